import { PGlite } from '@electric-sql/pglite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrateDatabase, wrap } from '../database/database.js';
import { AnomaliesRepository } from './anomalies.repository.js';

/** Stored fields come back exactly as stored, whichever batch of the packed read they fall in. */
describe('AnomaliesRepository.fields', () => {
  let pg: PGlite;
  let repo: AnomaliesRepository;
  const stored: {
    variable: 'q' | 'u' | 'v';
    date: string;
    product: 'analysis' | 'forecast';
    levelHpa: number;
    nx: number;
    ny: number;
    values: Float32Array;
  }[] = [];

  beforeAll(async () => {
    pg = await PGlite.create();
    const handle = wrap(pg);
    await migrateDatabase(handle);
    repo = new AnomaliesRepository(handle);
    // 150 days × 3 variables = 450 analysis fields at 850 hPa (more than three read batches), two grid
    // sizes, NaN and signed zeros among the values, plus forecasts and another level that must not mix in.
    let seed = 7;
    const next = () => {
      seed = (seed * 1103515245 + 12345) % 2 ** 31;
      return (seed / 2 ** 31) * 20 - 10;
    };
    for (let d = 0; d < 150; d++) {
      const date = new Date(Date.UTC(2024, 5, 1) + d * 86_400_000).toISOString().slice(0, 10);
      for (const variable of ['q', 'u', 'v'] as const)
        for (const [product, levelHpa] of [
          ['analysis', 850],
          ['forecast', 850],
          ['analysis', 700],
        ] as const) {
          if (product !== 'analysis' || levelHpa !== 850) if (d % 10) continue;
          const [nx, ny] = d < 75 ? [9, 7] : [5, 4];
          const values = Float32Array.from({ length: nx * ny }, (_, i) =>
            i === 3 ? Number.NaN : i === 4 ? -0 : next(),
          );
          stored.push({ variable, date, product, levelHpa, nx, ny, values });
        }
    }
    // Stored out of date order, so the read's ordering is what puts them in order.
    const shuffled = [...stored].sort((a, b) => (a.values[0] < b.values[0] ? -1 : 1));
    await repo.transaction(async (tx) => {
      for (const s of shuffled)
        await repo.upsert(
          {
            variable: s.variable,
            levelHpa: s.levelHpa,
            product: s.product,
            date: s.date,
            nx: s.nx,
            ny: s.ny,
            lon0: 86.25,
            lat0: 15.5,
            dLon: 0.25,
            dLat: 0.125,
            values: Buffer.from(s.values.buffer),
            sourceFile: 'made-in-test.csv',
          },
          tx,
        );
    });
  }, 60_000);
  afterAll(() => pg?.close());

  const expected = (product: string, levelHpa: number, from = '', to = '9999') =>
    stored
      .filter((s) => s.product === product && s.levelHpa === levelHpa && s.date >= from && s.date <= to)
      .sort((a, b) => a.date.localeCompare(b.date));

  it('returns every field of the level and product, in date order, values bit for bit', async () => {
    const got = await repo.fields(850);
    const want = expected('analysis', 850);
    expect(got).toHaveLength(450);
    expect(got.map((f) => f.date)).toEqual(want.map((f) => f.date));
    const byKey = new Map(want.map((s) => [`${s.date}|${s.variable}`, s]));
    for (const f of got) {
      const s = byKey.get(`${f.date}|${f.variable}`);
      expect(s, `${f.date} ${f.variable}`).toBeDefined();
      expect([f.nx, f.ny, f.lon0, f.lat0, f.dLon, f.dLat]).toEqual([s?.nx, s?.ny, 86.25, 15.5, 0.25, 0.125]);
      expect(new Uint8Array(f.values.buffer, f.values.byteOffset, f.values.byteLength)).toEqual(
        new Uint8Array(s?.values.buffer as ArrayBuffer),
      );
    }
  });

  it('keeps to the period, product and level asked for', async () => {
    const period = await repo.fields(850, '2024-07-10', '2024-08-20');
    expect(period.map((f) => `${f.date}${f.variable}`).sort()).toEqual(
      expected('analysis', 850, '2024-07-10', '2024-08-20')
        .map((f) => `${f.date}${f.variable}`)
        .sort(),
    );
    expect((await repo.fields(850, undefined, undefined, 'forecast')).length).toBe(
      expected('forecast', 850).length,
    );
    expect((await repo.fields(700)).length).toBe(expected('analysis', 700).length);
    expect(await repo.fields(500)).toEqual([]);
  });
});
