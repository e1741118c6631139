import type {
  BlockedSector,
  BulletinContent,
  BulletinOutlookInputs,
  GeoPolygonal,
  RegimeSettings as RegimeSettingsShape,
  RuleCondition,
  SiteSettings,
} from '@stormhour/shared';
import { sql } from 'drizzle-orm';
import {
  boolean,
  customType,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  serial,
  text,
  timestamp,
  uniqueIndex,
} from 'drizzle-orm/pg-core';
import type { JobFile, JobProblem } from '../jobs/job-problem.js';

/** PostgreSQL bytea as a Node Buffer. */
const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'bytea' });

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

// ── Radar ──────────────────────────────────────────────────────────────────────────────────────────

export const radarSites = pgTable('radar_sites', {
  id: serial('id').primaryKey(),
  code: text('code').notNull().unique(),
  name: text('name').notNull(),
  lat: doublePrecision('lat').notNull(),
  lon: doublePrecision('lon').notNull(),
  altitudeM: doublePrecision('altitude_m').notNull(),
  rangeKm: doublePrecision('range_km').notNull(),
  intervalMin: doublePrecision('interval_min').notNull(),
  utcOffsetMinutes: integer('utc_offset_minutes').notNull(),
  blockedSectors: jsonb('blocked_sectors').$type<BlockedSector[]>().notNull().default([]),
  createdAt: createdAt(),
});

/** Every version of a site's settings; cells and tracks record the version that made them. */
export const siteSettings = pgTable(
  'site_settings',
  {
    id: serial('id').primaryKey(),
    siteId: integer('site_id')
      .notNull()
      .references(() => radarSites.id),
    version: integer('version').notNull(),
    settings: jsonb('settings').$type<SiteSettings>().notNull(),
    createdAt: createdAt(),
    createdBy: integer('created_by').references(() => users.id),
  },
  (t) => [uniqueIndex('site_settings_version_idx').on(t.siteId, t.version)],
);

/** Long work: a row per job, with progress the client polls, and a clear result or error. */
export const jobs = pgTable(
  'jobs',
  {
    id: serial('id').primaryKey(),
    kind: text('kind').notNull(),
    state: text('state', { enum: ['queued', 'running', 'done', 'failed'] })
      .notNull()
      .default('queued'),
    progress: doublePrecision('progress').notNull().default(0),
    stage: text('stage'),
    params: jsonb('params').$type<Record<string, unknown>>().notNull().default({}),
    result: jsonb('result').$type<Record<string, unknown>>(),
    problems: jsonb('problems').$type<JobProblem[]>().notNull().default([]),
    files: jsonb('files').$type<JobFile[]>().notNull().default([]),
    error: text('error'),
    createdBy: integer('created_by').references(() => users.id),
    createdAt: createdAt(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [index('jobs_created_idx').on(t.createdAt)],
);

/** Uploaded files, kept by content hash so the same file twice is recognised. */
export const uploads = pgTable(
  'uploads',
  {
    id: serial('id').primaryKey(),
    siteId: integer('site_id').references(() => radarSites.id),
    kind: text('kind').notNull(),
    fileName: text('file_name').notNull(),
    sha256: text('sha256').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    jobId: integer('job_id').references(() => jobs.id),
    /** Set when the file's rows are stored; a file that failed stays unimported. */
    importedAt: timestamp('imported_at', { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('uploads_content_idx').on(t.siteId, t.kind, t.sha256)],
);

/**
 * Scans known to exist for a site, by where we learnt of them: the inventory, a cell table, or the
 * volume or column-maximum files themselves. Availability is the union; each source's own scans
 * decide where its tracks could have been seen starting.
 */
export const scans = pgTable(
  'scans',
  {
    id: serial('id').primaryKey(),
    siteId: integer('site_id')
      .notNull()
      .references(() => radarSites.id),
    source: text('source', { enum: ['scan-inventory', 'cell-table', 'volume', 'column-max'] }).notNull(),
    time: timestamp('time', { withTimezone: true }).notNull(),
    uploadId: integer('upload_id').references(() => uploads.id),
  },
  (t) => [
    uniqueIndex('scans_site_source_time_idx').on(t.siteId, t.source, t.time),
    index('scans_site_time_idx').on(t.siteId, t.time),
  ],
);

export const tracks = pgTable(
  'tracks',
  {
    id: serial('id').primaryKey(),
    siteId: integer('site_id')
      .notNull()
      .references(() => radarSites.id),
    /** 'volume' for tracks the engine made from reflectivity, 'cell-table' for imported cell tables. */
    source: text('source').notNull(),
    settingsVersion: integer('settings_version').notNull(),
    externalId: text('external_id'),
    firstTime: timestamp('first_time', { withTimezone: true }).notNull(),
    lastTime: timestamp('last_time', { withTimezone: true }).notNull(),
    scanCount: integer('scan_count').notNull(),
    durationMin: doublePrecision('duration_min').notNull(),
    speedMs: doublePrecision('speed_ms'),
    directionToDeg: doublePrecision('direction_to_deg'),
    isStorm: boolean('is_storm').notNull(),
    onset: boolean('onset').notNull(),
    notOnsetReason: text('not_onset_reason'),
    parentTrackId: integer('parent_track_id'),
    mergedIntoTrackId: integer('merged_into_track_id'),
    startLat: doublePrecision('start_lat').notNull(),
    startLon: doublePrecision('start_lon').notNull(),
    startBlockId: integer('start_block_id').references(() => blocks.id),
    maxVolumeKm3: doublePrecision('max_volume_km3'),
    maxAreaKm2: doublePrecision('max_area_km2').notNull(),
    maxEchoTopKm: doublePrecision('max_echo_top_km'),
    cellType: text('cell_type'),
  },
  (t) => [
    index('tracks_site_time_idx').on(t.siteId, t.firstTime),
    index('tracks_start_block_idx').on(t.startBlockId),
  ],
);

export const cells = pgTable(
  'cells',
  {
    id: serial('id').primaryKey(),
    siteId: integer('site_id')
      .notNull()
      .references(() => radarSites.id),
    source: text('source').notNull(),
    scanTime: timestamp('scan_time', { withTimezone: true }).notNull(),
    uploadId: integer('upload_id').references(() => uploads.id),
    settingsVersion: integer('settings_version').notNull(),
    trackId: integer('track_id').references(() => tracks.id, { onDelete: 'set null' }),
    externalTrackId: text('external_track_id'),
    lat: doublePrecision('lat').notNull(),
    lon: doublePrecision('lon').notNull(),
    xKm: doublePrecision('x_km').notNull(),
    yKm: doublePrecision('y_km').notNull(),
    areaKm2: doublePrecision('area_km2').notNull(),
    volumeKm3: doublePrecision('volume_km3'),
    maxDbz: doublePrecision('max_dbz'),
    maxDbzHeightKm: doublePrecision('max_dbz_height_km'),
    top35Km: doublePrecision('top35_km'),
    echoTopKm: doublePrecision('echo_top_km'),
    coreVolumeKm3: doublePrecision('core_volume_km3'),
    vilMaxKgM2: doublePrecision('vil_max_kg_m2'),
    vilMassKg: doublePrecision('vil_mass_kg'),
    rainRateMaxMmH: doublePrecision('rain_rate_max_mm_h'),
    precipFluxM3s: doublePrecision('precip_flux_m3_s'),
    semiMajorKm: doublePrecision('semi_major_km'),
    semiMinorKm: doublePrecision('semi_minor_km'),
    orientationDeg: doublePrecision('orientation_deg'),
    cellType: text('cell_type'),
    blockId: integer('block_id').references(() => blocks.id),
    parentExternalTrackId: text('parent_external_track_id'),
  },
  (t) => [
    index('cells_site_scan_idx').on(t.siteId, t.scanTime),
    index('cells_track_idx').on(t.trackId),
    index('cells_upload_idx').on(t.uploadId),
  ],
);

// ── Anomalies and regimes ─────────────────────────────────────────────────────────────────────────

/**
 * One day of one anomaly field on a regular longitude–latitude grid, values as little-endian
 * float32 (NaN where missing), row 0 the northernmost. Units are canonical: g/kg for q, m/s for u, v.
 */
export const anomalyFields = pgTable(
  'anomaly_fields',
  {
    id: serial('id').primaryKey(),
    uploadId: integer('upload_id').references(() => uploads.id),
    variable: text('variable', { enum: ['q', 'u', 'v'] }).notNull(),
    levelHpa: integer('level_hpa').notNull(),
    /** The local date the daily mean stands for, YYYY-MM-DD. */
    date: text('date').notNull(),
    nx: integer('nx').notNull(),
    ny: integer('ny').notNull(),
    /** Centre of the first column and of the first (northern) row, and the spacing, degrees. */
    lon0: doublePrecision('lon0').notNull(),
    lat0: doublePrecision('lat0').notNull(),
    dLon: doublePrecision('d_lon').notNull(),
    dLat: doublePrecision('d_lat').notNull(),
    values: bytea('values').notNull(),
    sourceFile: text('source_file').notNull(),
    /** An analysis of a past day, or a forecast; the two never replace or mix with each other. */
    product: text('product', { enum: ['analysis', 'forecast'] })
      .notNull()
      .default('analysis'),
    /** Uploaded as anomalies, or computed here as totals minus a stored climatology. */
    derivation: text('derivation', { enum: ['anomaly', 'total-minus-climatology'] })
      .notNull()
      .default('anomaly'),
    /** The climatology's source file, for fields computed from totals. */
    climatologyFile: text('climatology_file'),
  },
  (t) => [uniqueIndex('anomaly_fields_key_idx').on(t.product, t.variable, t.levelHpa, t.date)],
);

/**
 * A climatology of totals on a regular lon–lat grid (as anomaly_fields), one row per calendar month
 * ("06") or day of the year ("06-15"); totals uploaded later are turned into anomalies against it.
 */
export const anomalyClimatologies = pgTable(
  'anomaly_climatologies',
  {
    id: serial('id').primaryKey(),
    uploadId: integer('upload_id').references(() => uploads.id),
    variable: text('variable', { enum: ['q', 'u', 'v'] }).notNull(),
    levelHpa: integer('level_hpa').notNull(),
    /** "MM" for a month, "MM-DD" for a day of the year. */
    key: text('key').notNull(),
    nx: integer('nx').notNull(),
    ny: integer('ny').notNull(),
    lon0: doublePrecision('lon0').notNull(),
    lat0: doublePrecision('lat0').notNull(),
    dLon: doublePrecision('d_lon').notNull(),
    dLat: doublePrecision('d_lat').notNull(),
    values: bytea('values').notNull(),
    sourceFile: text('source_file').notNull(),
  },
  (t) => [uniqueIndex('anomaly_climatologies_key_idx').on(t.variable, t.levelHpa, t.key)],
);

export const regimeSettings = pgTable(
  'regime_settings',
  {
    id: serial('id').primaryKey(),
    siteId: integer('site_id')
      .notNull()
      .references(() => radarSites.id),
    version: integer('version').notNull(),
    settings: jsonb('settings').$type<RegimeSettingsShape>().notNull(),
    createdAt: createdAt(),
    createdBy: integer('created_by').references(() => users.id),
  },
  (t) => [uniqueIndex('regime_settings_version_idx').on(t.siteId, t.version)],
);

// ── Mail ──────────────────────────────────────────────────────────────────────────────────────────

/** What an outbox row keeps of each attachment; the bytes are in mail_blobs, stored once per content. */
export interface OutboxAttachmentRef {
  filename: string;
  contentType: string;
  sha256: string;
  size: number;
}

/**
 * Messages to send, one row per (dedupe key, recipient): the unique index is what makes sure nobody
 * is sent the same bulletin version twice. The sender loop moves rows queued → sending → sent | failed.
 */
export const mailOutbox = pgTable(
  'mail_outbox',
  {
    id: serial('id').primaryKey(),
    /** What is being sent, e.g. bulletin:12:v3; the same key and recipient never get a second row. */
    dedupeKey: text('dedupe_key').notNull(),
    recipient: text('recipient').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html'),
    attachments: jsonb('attachments').$type<OutboxAttachmentRef[]>().notNull().default([]),
    state: text('state', { enum: ['queued', 'sending', 'sent', 'failed'] })
      .notNull()
      .default('queued'),
    attempts: integer('attempts').notNull().default(0),
    lastError: text('last_error'),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    lastAttemptAt: timestamp('last_attempt_at', { withTimezone: true }),
    /** Where the last try went: the local fake or a real server; decides how a restart settles the row. */
    via: text('via', { enum: ['fake', 'smtp'] }),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    /** Fixed when the row is made (from key and recipient), so every try of it carries the same one. */
    messageId: text('message_id').notNull(),
    createdBy: integer('created_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('mail_outbox_key_recipient_idx').on(t.dedupeKey, t.recipient),
    index('mail_outbox_due_idx').on(t.state, t.nextAttemptAt),
  ],
);

/** Attachment bytes by SHA-256: a bulletin's PDF sent to twenty officers is stored once. */
export const mailBlobs = pgTable('mail_blobs', {
  sha256: text('sha256').primaryKey(),
  content: bytea('content').notNull(),
  size: integer('size').notNull(),
  createdAt: createdAt(),
});

/** The local fake SMTP server's mailbox: every message it accepted, exactly as received. */
export const mailReceived = pgTable(
  'mail_received',
  {
    id: serial('id').primaryKey(),
    receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
    envelopeFrom: text('envelope_from').notNull(),
    envelopeTo: jsonb('envelope_to').$type<string[]>().notNull(),
    /** Read from the headers at capture, for listing and for spotting a duplicate delivery. */
    messageId: text('message_id'),
    subject: text('subject'),
    sizeBytes: integer('size_bytes').notNull(),
    /** The RFC 5322 source as received. */
    raw: bytea('raw').notNull(),
  },
  (t) => [
    index('mail_received_at_idx').on(t.receivedAt),
    index('mail_received_message_id_idx').on(t.messageId),
  ],
);
// ── Crop calendars and advice rules ───────────────────────────────────────────────────────────────

/** One stage of one crop in a district, over ISO weeks (a range may wrap over the new year). */
export const cropCalendarEntries = pgTable(
  'crop_calendar_entries',
  {
    id: serial('id').primaryKey(),
    districtId: integer('district_id')
      .notNull()
      .references(() => districts.id),
    crop: text('crop').notNull(),
    stage: text('stage').notNull(),
    fromWeek: integer('from_week').notNull(),
    toWeek: integer('to_week').notNull(),
    /** The order the stages were given in. */
    position: integer('position').notNull(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('crop_calendar_district_idx').on(t.districtId)],
);

/**
 * Rules that turn a week's outlook into advice. Rules are retired (active = false), never deleted, so a
 * bulletin can always say which rule proposed its advice.
 */
export const adviceRules = pgTable('advice_rules', {
  id: serial('id').primaryKey(),
  crop: text('crop'),
  stage: text('stage'),
  condition: jsonb('condition').$type<RuleCondition>().notNull(),
  priority: integer('priority').notNull(),
  text: text('text').notNull(),
  source: text('source').notNull(),
  active: boolean('active').notNull().default(true),
  origin: text('origin', { enum: ['default', 'unit'] }).notNull(),
  createdAt: createdAt(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  updatedBy: integer('updated_by').references(() => users.id),
});

// ── Bulletins ─────────────────────────────────────────────────────────────────────────────────────

/**
 * A district's weekly bulletin. Its content lives in bulletin_versions; `approvedVersion` is the one
 * frozen at approval and the one sent. At most one bulletin per district and week is live (not
 * withdrawn): the partial unique index backs the service's 409.
 */
export const bulletins = pgTable(
  'bulletins',
  {
    id: serial('id').primaryKey(),
    districtId: integer('district_id')
      .notNull()
      .references(() => districts.id),
    /** Monday of the ISO week, YYYY-MM-DD. */
    weekStart: text('week_start').notNull(),
    number: text('number').notNull(),
    state: text('state', {
      enum: ['draft', 'in_review', 'returned', 'approved', 'sent', 'withdrawn'],
    }).notNull(),
    authorId: integer('author_id')
      .notNull()
      .references(() => users.id),
    currentVersion: integer('current_version').notNull(),
    approvedVersion: integer('approved_version'),
    /** The site's UTC offset, so local times of field reports are read as the bulletin meant them. */
    utcOffsetMinutes: integer('utc_offset_minutes').notNull(),
    draftedFrom: jsonb('drafted_from').$type<BulletinOutlookInputs>().notNull(),
    approvedFrom: jsonb('approved_from').$type<BulletinOutlookInputs>(),
    withdrawalReason: text('withdrawal_reason'),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    approvedAt: timestamp('approved_at', { withTimezone: true }),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    withdrawnAt: timestamp('withdrawn_at', { withTimezone: true }),
  },
  (t) => [
    uniqueIndex('bulletins_live_week_idx')
      .on(t.districtId, t.weekStart)
      .where(sql`${t.state} <> 'withdrawn'`),
    index('bulletins_district_idx').on(t.districtId, t.weekStart),
  ],
);

/** Every saved version of a bulletin's content; never changed once written. */
export const bulletinVersions = pgTable(
  'bulletin_versions',
  {
    id: serial('id').primaryKey(),
    bulletinId: integer('bulletin_id')
      .notNull()
      .references(() => bulletins.id),
    version: integer('version').notNull(),
    content: jsonb('content').$type<BulletinContent>().notNull(),
    savedBy: integer('saved_by')
      .notNull()
      .references(() => users.id),
    savedAt: timestamp('saved_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('bulletin_versions_idx').on(t.bulletinId, t.version)],
);

/** The bulletin's history: every transition, who made it and when. */
export const bulletinEvents = pgTable(
  'bulletin_events',
  {
    id: serial('id').primaryKey(),
    bulletinId: integer('bulletin_id')
      .notNull()
      .references(() => bulletins.id),
    transition: text('transition').notNull(),
    fromState: text('from_state'),
    toState: text('to_state').notNull(),
    actorId: integer('actor_id')
      .notNull()
      .references(() => users.id),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    comment: text('comment'),
  },
  (t) => [index('bulletin_events_bulletin_idx').on(t.bulletinId)],
);

/** When an officer first opened a sent bulletin, and acknowledged it. */
export const bulletinReads = pgTable(
  'bulletin_reads',
  {
    id: serial('id').primaryKey(),
    bulletinId: integer('bulletin_id')
      .notNull()
      .references(() => bulletins.id),
    officerId: integer('officer_id')
      .notNull()
      .references(() => users.id),
    readAt: timestamp('read_at', { withTimezone: true }).notNull().defaultNow(),
    acknowledgedAt: timestamp('acknowledged_at', { withTimezone: true }),
  },
  (t) => [uniqueIndex('bulletin_reads_idx').on(t.bulletinId, t.officerId)],
);

/** What an officer saw in a block during a bulletin's week; the scorecard verifies chances with them. */
export const fieldReports = pgTable(
  'field_reports',
  {
    id: serial('id').primaryKey(),
    bulletinId: integer('bulletin_id')
      .notNull()
      .references(() => bulletins.id),
    blockId: integer('block_id')
      .notNull()
      .references(() => blocks.id),
    officerId: integer('officer_id')
      .notNull()
      .references(() => users.id),
    stormSeen: boolean('storm_seen').notNull(),
    /** Local time as the officer gave it, and the instant it stands for. */
    startLocal: text('start_local'),
    startTime: timestamp('start_time', { withTimezone: true }),
    hail: boolean('hail').notNull(),
    windDamage: boolean('wind_damage').notNull(),
    cropDamage: boolean('crop_damage').notNull(),
    actionTaken: text('action_taken').notNull(),
    usefulness: integer('usefulness').notNull(),
    notes: text('notes').notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('field_reports_bulletin_idx').on(t.bulletinId, t.blockId)],
);
