import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { generateScenario } from './scenario.js';
import { writeScenario } from './write.js';

const committed = fileURLToPath(new URL('../vessary/', import.meta.url));
const tmp = mkdtempSync(join(tmpdir(), 'stormhour-sd-full-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

const walk = (root: string): string[] => {
  const out: string[] = [];
  const visit = (d: string) => {
    for (const e of readdirSync(d)) {
      const p = join(d, e);
      if (statSync(p).isDirectory()) visit(p);
      else out.push(relative(root, p));
    }
  };
  visit(root);
  return out.sort();
};

describe('committed set (sample-data/vessary)', () => {
  it('is what the default seed generates today, byte for byte', () => {
    const t0 = performance.now();
    writeScenario(generateScenario(), tmp, { clean: true });
    expect(performance.now() - t0).toBeLessThan(60_000);
    const files = walk(tmp);
    expect(walk(committed)).toEqual(files);
    for (const f of files)
      expect(readFileSync(join(tmp, f)).equals(readFileSync(join(committed, f))), f).toBe(true);
  }, 120_000);

  it('stays within 25 MB', () => {
    const total = walk(committed).reduce((s, f) => s + statSync(join(committed, f)).size, 0);
    expect(total).toBeLessThan(25_000_000);
  });
});
