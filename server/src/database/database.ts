import { fileURLToPath } from 'node:url';
import { PGlite } from '@electric-sql/pglite';
import { drizzle, type PgliteDatabase } from 'drizzle-orm/pglite';
import { migrate } from 'drizzle-orm/pglite/migrator';
import * as schema from './schema.js';

export type Database = PgliteDatabase<typeof schema>;
/** A transaction handle; repositories accept either so callers can group writes. */
export type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0];

export interface DatabaseHandle {
  db: Database;
  pg: PGlite;
  /** How many statements that may have written, and transactions, have ended through this handle. */
  writes(): number;
}

export const DATABASE = Symbol('DATABASE');

// Resolved from this file so both src (tests) and dist (node) find the committed migrations.
const migrationsFolder = fileURLToPath(new URL('../../drizzle', import.meta.url));

export async function openDatabase(dataDir: string): Promise<DatabaseHandle> {
  const pg = await PGlite.create(dataDir);
  return wrap(pg);
}

export async function migrateDatabase(handle: DatabaseHandle): Promise<void> {
  await migrate(handle.db, { migrationsFolder });
}

export function wrap(pg: PGlite): DatabaseHandle {
  // Caches (e.g. the outlook's data fingerprint) ask this counter whether anything may have changed
  // instead of asking the database on every request. Every statement not starting with SELECT counts,
  // and every transaction when it ends (committed or not); counting too often only costs a re-check.
  // A SELECT that writes through a function is not seen: users of the counter also look at the
  // database's own write mark now and then.
  let writes = 0;
  const after = <R>(work: Promise<R>, wrote: boolean): Promise<R> =>
    wrote ? work.finally(() => void writes++) : work;
  const query = pg.query.bind(pg);
  const exec = pg.exec.bind(pg);
  const transaction = pg.transaction.bind(pg);
  pg.query = ((sql, params, options) =>
    after(query(sql, params, options), !/^\s*select\b/i.test(sql))) as typeof pg.query;
  pg.exec = ((sql, options) => after(exec(sql, options), true)) as typeof pg.exec;
  pg.transaction = ((callback) => after(transaction(callback), true)) as typeof pg.transaction;
  return { pg, db: drizzle(pg, { schema }), writes: () => writes };
}
