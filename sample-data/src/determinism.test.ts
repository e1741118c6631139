import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { generateScenario } from './scenario.js';
import { writeScenario } from './write.js';

const packageDir = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const tmp = mkdtempSync(join(tmpdir(), 'stormhour-sd-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

function listFiles(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    for (const e of readdirSync(d)) {
      const p = join(d, e);
      if (statSync(p).isDirectory()) walk(p);
      else out.push(relative(dir, p));
    }
  };
  walk(dir);
  return out.sort();
}

function generate(seed: number, days: number, name: string): string {
  const out = join(tmp, name);
  writeScenario(generateScenario({ seed, days }), out, { volumes: 2, clean: true });
  return out;
}

describe('determinism', () => {
  const a = generate(7, 3, 'a');
  const b = generate(7, 3, 'b');
  const c = generate(8, 3, 'c');

  it('writes byte-identical files for the same seed', () => {
    const files = listFiles(a);
    expect(files).toEqual(listFiles(b));
    expect(files.length).toBeGreaterThan(20);
    for (const f of files) expect(readFileSync(join(a, f)).equals(readFileSync(join(b, f))), f).toBe(true);
  });

  it('writes different files for a different seed', () => {
    for (const f of [
      'blocks.geojson',
      'terrain.tif',
      'cells-2025.csv',
      'anomalies-2025.csv',
      'scans-2025.csv',
    ]) {
      expect(readFileSync(join(a, f)).equals(readFileSync(join(c, f))), f).toBe(false);
    }
  });

  it('the command line gives the same bytes as the library', () => {
    const out = join(tmp, 'cli');
    const tsx = resolve(packageDir, '..', 'node_modules', '.bin', 'tsx');
    const res = spawnSync(
      tsx,
      ['src/cli.ts', '--seed', '7', '--days', '3', '--volumes', '2', '--out', out, '--quiet'],
      {
        cwd: packageDir,
        encoding: 'utf8',
        env: { ...process.env, INIT_CWD: packageDir },
      },
    );
    expect(res.stderr).toBe('');
    expect(res.status).toBe(0);
    const files = listFiles(out);
    expect(files).toEqual(listFiles(a));
    for (const f of files) expect(readFileSync(join(a, f)).equals(readFileSync(join(out, f))), f).toBe(true);
  }, 60_000);

  it('refuses bad arguments', () => {
    const tsx = resolve(packageDir, '..', 'node_modules', '.bin', 'tsx');
    const res = spawnSync(tsx, ['src/cli.ts', '--days', 'many'], { cwd: packageDir, encoding: 'utf8' });
    expect(res.status).toBe(1);
    expect(res.stderr).toMatch(/not an integer/);
  }, 60_000);
});
