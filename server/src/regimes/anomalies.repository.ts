import { Inject, Injectable } from '@nestjs/common';
import type { AnomalySource, AnomalyVariable, RegimeSettings } from '@stormhour/shared';
import { and, asc, desc, eq, getTableColumns, sql } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { anomalyClimatologies, anomalyFields, regimeSettings } from '../database/schema.js';
import type { ClimatologyField } from '../intake/anomaly-climatology.js';

export type AnomalyProduct = 'analysis' | 'forecast';

export interface StoredField {
  variable: AnomalyVariable;
  date: string;
  nx: number;
  ny: number;
  lon0: number;
  lat0: number;
  dLon: number;
  dLat: number;
  values: Float32Array;
}

/**
 * Grids travel to and from PGlite as base64 text, decoded and encoded by PostgreSQL itself: PGlite's own
 * bytea parameters and results go through a hex text form in JavaScript that is many times slower
 * (a season of 200 × 200 grids took minutes; see `npm run bench:anomalies`).
 */
const toBytea = (values: Buffer) => sql`decode(${values.toString('base64')}, 'base64')`;
const fromBytea = (column: typeof anomalyFields.values | typeof anomalyClimatologies.values) =>
  sql<string>`encode(${column}, 'base64')`;
/** Fields per result row when many are read at once (see fields()). */
const FIELDS_PER_ROW = 128;
type FieldMeta = [AnomalyVariable, string, number, number, number, number, number, number];
const float32 = (base64: string) => new Float32Array(Uint8Array.from(Buffer.from(base64, 'base64')).buffer);

@Injectable()
export class AnomaliesRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.handle.db.transaction(work);
  }

  /** Stores a day's field; a later upload of the same product, variable, level and date replaces it. */
  async upsert(row: typeof anomalyFields.$inferInsert, tx: Executor): Promise<void> {
    await tx
      .insert(anomalyFields)
      .values({ ...row, values: toBytea(row.values) })
      .onConflictDoUpdate({
        target: [anomalyFields.product, anomalyFields.variable, anomalyFields.levelHpa, anomalyFields.date],
        set: {
          uploadId: row.uploadId,
          nx: row.nx,
          ny: row.ny,
          lon0: row.lon0,
          lat0: row.lat0,
          dLon: row.dLon,
          dLat: row.dLat,
          values: sql`excluded.values`,
          sourceFile: row.sourceFile,
          derivation: row.derivation ?? 'anomaly',
          climatologyFile: row.climatologyFile ?? null,
        },
      });
  }

  /** Stores a climatology band; a later upload of the same variable, level and month or day replaces it. */
  async upsertClimatology(row: typeof anomalyClimatologies.$inferInsert, tx: Executor): Promise<void> {
    await tx
      .insert(anomalyClimatologies)
      .values({ ...row, values: toBytea(row.values) })
      .onConflictDoUpdate({
        target: [anomalyClimatologies.variable, anomalyClimatologies.levelHpa, anomalyClimatologies.key],
        set: {
          uploadId: row.uploadId,
          nx: row.nx,
          ny: row.ny,
          lon0: row.lon0,
          lat0: row.lat0,
          dLon: row.dLon,
          dLat: row.dLat,
          values: sql`excluded.values`,
          sourceFile: row.sourceFile,
        },
      });
  }

  /** Every stored climatology band of a variable and level. */
  async climatology(variable: AnomalyVariable, levelHpa: number): Promise<ClimatologyField[]> {
    const rows = await this.handle.db
      .select({ ...getTableColumns(anomalyClimatologies), values: fromBytea(anomalyClimatologies.values) })
      .from(anomalyClimatologies)
      .where(and(eq(anomalyClimatologies.variable, variable), eq(anomalyClimatologies.levelHpa, levelHpa)));
    return rows.map((r) => ({
      variable: r.variable,
      levelHpa: r.levelHpa,
      key: r.key,
      grid: { nx: r.nx, ny: r.ny, lon0: r.lon0, lat0: r.lat0, dLon: r.dLon, dLat: r.dLat },
      values: float32(r.values),
      sourceFile: r.sourceFile,
    }));
  }

  /** Where the stored fields came from: per product, variable, source file and derivation, with their days. */
  async sources(levelHpa: number): Promise<AnomalySource[]> {
    return this.handle.db
      .select({
        product: anomalyFields.product,
        variable: anomalyFields.variable,
        sourceFile: anomalyFields.sourceFile,
        derivation: anomalyFields.derivation,
        climatologyFile: anomalyFields.climatologyFile,
        days: sql<number>`count(*)::int`,
        first: sql<string>`min(${anomalyFields.date})`,
        last: sql<string>`max(${anomalyFields.date})`,
      })
      .from(anomalyFields)
      .where(eq(anomalyFields.levelHpa, levelHpa))
      .groupBy(
        anomalyFields.product,
        anomalyFields.variable,
        anomalyFields.sourceFile,
        anomalyFields.derivation,
        anomalyFields.climatologyFile,
      )
      .orderBy(asc(anomalyFields.product), asc(anomalyFields.variable), asc(anomalyFields.sourceFile));
  }

  /**
   * The stored fields of a level and product in a period, in date order. Read in batches of
   * FIELDS_PER_ROW fields per result row (metadata as JSON, the grids concatenated into one binary
   * value): PGlite's conversion of each result row and field costs far more than the few hundred bytes
   * of a daily grid, so a record of thousands of days comes back as a few dozen rows instead.
   */
  async fields(
    levelHpa: number,
    from?: string,
    to?: string,
    product: AnomalyProduct = 'analysis',
  ): Promise<StoredField[]> {
    const params: unknown[] = [levelHpa, product];
    let where = 'level_hpa = $1 and product = $2';
    if (from) where += ` and date >= $${params.push(from)}`;
    if (to) where += ` and date <= $${params.push(to)}`;
    const res = await this.handle.pg.query<{ meta: FieldMeta[]; grids: string }>(
      `with f as (
         select row_number() over (order by date, id) - 1 as i, * from anomaly_fields where ${where}
       )
       select json_agg(json_build_array(variable, date, nx, ny, lon0, lat0, d_lon, d_lat) order by i) as meta,
              encode(string_agg(values, ''::bytea order by i), 'base64') as grids
       from f group by i / ${FIELDS_PER_ROW} order by min(i)`,
      params,
    );
    const out: StoredField[] = [];
    for (const row of res.rows) {
      const values = float32(row.grids);
      let offset = 0;
      for (const [variable, date, nx, ny, lon0, lat0, dLon, dLat] of row.meta) {
        out.push({
          variable,
          date,
          nx,
          ny,
          lon0,
          lat0,
          dLon,
          dLat,
          values: values.subarray(offset, offset + nx * ny),
        });
        offset += nx * ny;
      }
    }
    return out;
  }

  async count(): Promise<number> {
    const [{ n }] = await this.handle.db.select({ n: sql<number>`count(*)::int` }).from(anomalyFields);
    return n;
  }

  async latestSettings(siteId: number): Promise<{ version: number; settings: RegimeSettings } | undefined> {
    const [row] = await this.handle.db
      .select()
      .from(regimeSettings)
      .where(eq(regimeSettings.siteId, siteId))
      .orderBy(desc(regimeSettings.version))
      .limit(1);
    return row && { version: row.version, settings: row.settings };
  }

  async addSettings(
    siteId: number,
    version: number,
    settings: RegimeSettings,
    createdBy: number | null,
  ): Promise<void> {
    await this.handle.db.insert(regimeSettings).values({ siteId, version, settings, createdBy });
  }
}
