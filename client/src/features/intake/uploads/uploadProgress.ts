/**
 * One request carries every file, in the order they were appended, so the bytes sent so far fill the
 * files one after another. Returns each file's share sent, 0–1 (multipart boundaries are ignored:
 * they are a few hundred bytes against files of kilobytes or more).
 */
export function perFileProgress(sizes: readonly number[], fractionSent: number): number[] {
  const total = sizes.reduce((sum, size) => sum + size, 0);
  let remaining = Math.min(Math.max(fractionSent, 0), 1) * total;
  return sizes.map((size) => {
    if (size === 0) return fractionSent >= 1 ? 1 : remaining > 0 ? 1 : 0;
    const sent = Math.min(size, remaining);
    remaining -= sent;
    return sent / size;
  });
}
