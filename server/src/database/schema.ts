import type { GeoPolygonal } from '@stormhour/shared';
import {
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  serial,
  text,
  timestamp,
} from 'drizzle-orm/pg-core';

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();

export const districts = pgTable('districts', {
  id: serial('id').primaryKey(),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  createdAt: createdAt(),
});

export const blocks = pgTable(
  'blocks',
  {
    id: serial('id').primaryKey(),
    code: text('code').notNull().unique(),
    name: text('name').notNull(),
    districtId: integer('district_id')
      .notNull()
      .references(() => districts.id),
    geometry: jsonb('geometry').$type<GeoPolygonal>().notNull(),
    minLon: doublePrecision('min_lon').notNull(),
    minLat: doublePrecision('min_lat').notNull(),
    maxLon: doublePrecision('max_lon').notNull(),
    maxLat: doublePrecision('max_lat').notNull(),
    centroidLon: doublePrecision('centroid_lon').notNull(),
    centroidLat: doublePrecision('centroid_lat').notNull(),
    areaKm2: doublePrecision('area_km2').notNull(),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('blocks_district_idx').on(t.districtId)],
);

export const users = pgTable('users', {
  id: serial('id').primaryKey(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  role: text('role', { enum: ['admin', 'scientist', 'writer', 'officer'] }).notNull(),
  districtId: integer('district_id').references(() => districts.id),
  passwordHash: text('password_hash').notNull(),
  active: boolean('active').notNull().default(true),
  /** Bumped when a user is deactivated; access tokens carry it, so older tokens stop working. */
  tokenVersion: integer('token_version').notNull().default(0),
  createdAt: createdAt(),
  lastSignInAt: timestamp('last_sign_in_at', { withTimezone: true }),
});

/** Refresh sessions: only a hash of the cookie's token is stored. */
export const sessions = pgTable(
  'sessions',
  {
    id: serial('id').primaryKey(),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id),
    tokenHash: text('token_hash').notNull().unique(),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);

export const auditLog = pgTable(
  'audit_log',
  {
    id: serial('id').primaryKey(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    actorId: integer('actor_id').references(() => users.id),
    actorEmail: text('actor_email'),
    action: text('action').notNull(),
    target: text('target'),
    detail: jsonb('detail').$type<Record<string, unknown>>(),
  },
  (t) => [index('audit_at_idx').on(t.at), index('audit_action_idx').on(t.action)],
);
