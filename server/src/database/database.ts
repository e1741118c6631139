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
  return { pg, db: drizzle(pg, { schema }) };
}
