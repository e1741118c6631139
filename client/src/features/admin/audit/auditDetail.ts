function show(value: unknown): string {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (Array.isArray(value)) return `${value.length} item${value.length === 1 ? '' : 's'}`;
  return '{…}';
}

/** One line out of an entry's free-form detail: "key: value; key: value", cut at `maxLength`. */
export function summariseDetail(detail: Record<string, unknown> | null, maxLength = 120): string {
  if (!detail) return '';
  const text = Object.entries(detail)
    .map(([key, value]) => `${key}: ${show(value)}`)
    .join('; ');
  return text.length <= maxLength ? text : `${text.slice(0, maxLength - 1)}…`;
}
