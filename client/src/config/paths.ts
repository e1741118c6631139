import type { Section } from '@stormhour/shared';

/** The review steps a bulletin's page can ask the server for. */
export type BulletinAction = 'submit' | 'approve' | 'return' | 'send' | 'withdraw';
/** The forms a bulletin can be downloaded in. */
export type BulletinExportFormat = 'pdf' | 'cap' | 'text' | 'sms';

/** Every route path of the app, so links, guards and tests agree. */
export const paths = {
  signIn: '/sign-in',
  home: '/',
  changePassword: '/account/password',
  section: {
    atlas: '/atlas',
    intake: '/intake',
    regimes: '/regimes',
    outlook: '/outlook',
    bulletins: '/bulletins',
    inbox: '/inbox',
    scorecard: '/scorecard',
    admin: '/admin',
  } satisfies Record<Section, string>,
  admin: {
    blocks: '/admin/blocks',
    people: '/admin/people',
    audit: '/admin/audit',
    mail: '/admin/mail',
    mailMessage: (id: number | string) => `/admin/mail/messages/${id}`,
    calendars: '/admin/crop-calendars',
  },
  bulletins: {
    list: '/bulletins',
    bulletin: (id: number | string) => `/bulletins/${id}`,
    rules: '/bulletins/rules',
    calendars: '/bulletins/calendars',
  },
  inbox: {
    list: '/inbox',
    bulletin: (id: number | string) => `/inbox/${id}`,
  },
  intake: {
    uploads: '/intake',
    sites: '/intake/sites',
    newSite: '/intake/sites/new',
    site: (id: number | string) => `/intake/sites/${id}`,
    tracks: '/intake/tracks',
    track: (id: number | string) => `/intake/tracks/${id}`,
    job: (id: number | string) => `/intake/jobs/${id}`,
  },
} as const;

/** Names shown in the navigation; the browser tests find links by these. */
export const SECTION_NAMES: Record<Section, string> = {
  atlas: 'Atlas',
  intake: 'Intake',
  regimes: 'Regimes',
  outlook: 'Outlook',
  bulletins: 'Bulletins',
  inbox: 'Inbox',
  scorecard: 'Scorecard',
  admin: 'Admin',
};

/** API endpoints, relative to the site root. */
export const api = {
  login: '/api/auth/login',
  refresh: '/api/auth/refresh',
  logout: '/api/auth/logout',
  me: '/api/auth/me',
  password: '/api/auth/password',
  districts: '/api/districts',
  district: (id: number) => `/api/districts/${id}`,
  blocks: '/api/blocks',
  blocksGeojson: '/api/blocks/geojson',
  block: (id: number) => `/api/blocks/${id}`,
  blocksImport: '/api/blocks/import',
  users: '/api/users',
  user: (id: number) => `/api/users/${id}`,
  audit: '/api/audit',
  radarSites: '/api/radar-sites',
  radarSite: (id: number) => `/api/radar-sites/${id}`,
  radarSiteCoverage: (id: number) => `/api/radar-sites/${id}/coverage`,
  intake: '/api/intake',
  jobs: '/api/jobs',
  job: (id: number) => `/api/jobs/${id}`,
  tracks: '/api/tracks',
  track: (id: number) => `/api/tracks/${id}`,
  cells: '/api/cells',
  regimes: '/api/regimes',
  regimeComposite: '/api/regimes/composite',
  regimeSettings: '/api/regimes/settings',
  regimeExpected: '/api/regimes/expected',
  regimeSources: '/api/regimes/sources',
  mailSettings: '/api/mail/settings',
  mailOutbox: '/api/mail/outbox',
  mailOutboxRetry: (id: number) => `/api/mail/outbox/${id}/retry`,
  mailTest: '/api/mail/test',
  mailMessages: '/api/mail/messages',
  mailMessage: (id: number) => `/api/mail/messages/${id}`,
  mailMessageSource: (id: number) => `/api/mail/messages/${id}/source`,
  mailAttachment: (id: number, index: number) => `/api/mail/messages/${id}/attachments/${index}`,
  cropCalendar: (districtId: number) => `/api/districts/${districtId}/crop-calendar`,
  cropCalendarsImport: '/api/crop-calendars/import',
  adviceRules: '/api/advice-rules',
  adviceRule: (id: number) => `/api/advice-rules/${id}`,
  bulletins: '/api/bulletins',
  bulletin: (id: number) => `/api/bulletins/${id}`,
  bulletinAction: (id: number, action: BulletinAction) => `/api/bulletins/${id}/${action}`,
  bulletinVersion: (id: number, version: number) => `/api/bulletins/${id}/versions/${version}`,
  bulletinDiff: (id: number) => `/api/bulletins/${id}/diff`,
  bulletinReports: (id: number) => `/api/bulletins/${id}/reports`,
  bulletinDelivery: (id: number) => `/api/bulletins/${id}/delivery`,
  bulletinExport: (id: number, format: BulletinExportFormat) =>
    `/api/bulletins/${id}/${format === 'cap' ? 'cap.xml' : format}`,
  inbox: '/api/inbox',
  inboxBulletin: (id: number) => `/api/inbox/${id}`,
  inboxAcknowledge: (id: number) => `/api/inbox/${id}/acknowledge`,
  inboxReports: (id: number) => `/api/inbox/${id}/reports`,
  outlook: '/api/outlook',
  outlookCsv: '/api/outlook.csv',
  atlas: {
    map: '/api/atlas/map',
    diurnal: '/api/atlas/diurnal',
    distributions: '/api/atlas/distributions',
    timeDistance: '/api/atlas/time-distance',
    motion: '/api/atlas/motion',
  },
} as const;
