import { spawnSync } from 'node:child_process';

/** A Python with scipy, to check our numerics against scipy's (CI installs Debian's python3-scipy). */
export function pythonWithScipy(): string | null {
  for (const candidate of ['python3', '/usr/bin/python3']) {
    const probe = spawnSync(candidate, ['-c', 'import scipy.ndimage, numpy'], { encoding: 'utf8' });
    if (probe.status === 0) return candidate;
  }
  return null;
}

/** Runs a Python script with JSON on stdin and returns its JSON output. */
export function runPython<T>(python: string, script: string, input: unknown): T {
  const res = spawnSync(python, ['-c', script], {
    input: JSON.stringify(input),
    encoding: 'utf8',
    maxBuffer: 256 * 1024 * 1024,
  });
  if (res.status !== 0) throw new Error(`python failed: ${res.stderr}`);
  return JSON.parse(res.stdout) as T;
}
