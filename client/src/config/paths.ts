import type { Section } from '@stormhour/shared';

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
  atlas: {
    map: '/api/atlas/map',
    diurnal: '/api/atlas/diurnal',
    distributions: '/api/atlas/distributions',
    timeDistance: '/api/atlas/time-distance',
    motion: '/api/atlas/motion',
  },
} as const;
