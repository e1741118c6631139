import 'reflect-metadata';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import type { INestApplication } from '@nestjs/common';
import { Test } from '@nestjs/testing';
import type { Role } from '@stormhour/shared';
import request from 'supertest';
import { AppModule } from '../app.module.js';
import { setUpApp } from '../app.setup.js';
import type { AppConfig } from '../config/config.js';
import { DATABASE, type DatabaseHandle, migrateDatabase, wrap } from '../database/database.js';
import { hashPassword } from '../users/passwords.js';
import { UsersRepository } from '../users/users.repository.js';

/** Migrating costs seconds; one migrated template per worker is cloned for each app instead. */
let template: Promise<PGlite> | undefined;
function migratedTemplate(): Promise<PGlite> {
  template ??= (async () => {
    const pg = await PGlite.create();
    await migrateDatabase(wrap(pg));
    return pg;
  })();
  return template;
}

export function testConfig(overrides: Partial<AppConfig> = {}): AppConfig {
  return {
    port: 0,
    dataDir: 'memory://',
    jwtSecret: 'test-secret-that-is-long-enough-for-hs256-signing',
    demo: false,
    demoPassword: 'stormhour-demo',
    uploadLimitBytes: 1024 * 1024,
    loginAttemptsPerMinute: 50,
    accessTokenMinutes: 15,
    refreshDays: 7,
    clientDist: null,
    demoDataDir: '',
    filesDir: join(tmpdir(), `stormhour-test-files-${process.pid}`),
    smtpUrl: null,
    mailFakePort: 0,
    mailFrom: 'Stormhour test <bulletins@stormhour.invalid>',
    unitName: 'Agro-met advisory unit',
    ...overrides,
  };
}

export interface TestApp {
  app: INestApplication;
  http: ReturnType<typeof request>;
  db: DatabaseHandle;
  /** Creates a user with the given role and returns a bearer token for them. */
  signedIn(role: Role, opts?: { email?: string; districtId?: number | null }): Promise<string>;
  close(): Promise<void>;
}

export const TEST_PASSWORD = 'correct horse battery';
let passwordHash: Promise<string> | undefined;

export async function createTestApp(overrides: Partial<AppConfig> = {}): Promise<TestApp> {
  const db = wrap((await (await migratedTemplate()).clone()) as PGlite);
  const moduleRef = await Test.createTestingModule({ imports: [AppModule.register(testConfig(overrides))] })
    .overrideProvider(DATABASE)
    .useValue(db)
    .compile();
  const app = moduleRef.createNestApplication({ bodyParser: false, logger: ['error'] });
  setUpApp(app);
  await app.init();
  const http = request(app.getHttpServer());
  const users = app.get(UsersRepository);
  let n = 0;

  return {
    app,
    http,
    db,
    async signedIn(role, opts = {}) {
      passwordHash ??= hashPassword(TEST_PASSWORD);
      const email = opts.email ?? `${role}.${++n}@unit.example`;
      const districtId = opts.districtId ?? (role === 'officer' ? await anyDistrict(db) : null);
      await users.insert({ email, name: `Test ${role}`, role, districtId, passwordHash: await passwordHash });
      const res = await http.post('/api/auth/login').send({ email, password: TEST_PASSWORD }).expect(200);
      return res.body.accessToken as string;
    },
    async close() {
      await app.close();
    },
  };
}

async function anyDistrict(db: DatabaseHandle): Promise<number> {
  const found = await db.pg.query<{ id: number }>('select id from districts order by id limit 1');
  if (found.rows[0]) return found.rows[0].id;
  const created = await db.pg.query<{ id: number }>(
    "insert into districts (code, name) values ('TST', 'Test district') returning id",
  );
  return created.rows[0].id;
}
