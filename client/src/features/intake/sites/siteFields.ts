import type { SiteSettings } from '@stormhour/shared';

/*
 * The site form's fields, as data: label, unit and a one-line help for each, grouped as the form shows
 * them. Keys are the request's field paths ("settings.thresholdDbz"), so zod issues and the server's
 * `details[].where` land on the right field without translation.
 */

export interface NumberField {
  kind: 'number';
  key: string;
  label: string;
  unit: string;
  help: string;
  /** Shown value = stored value × scale (shares stored 0–1 are edited as %). */
  scale?: number;
}

export interface ChoiceField {
  kind: 'choice';
  key: string;
  label: string;
  help: string;
  options: { value: string; text: string }[];
  /** Choices that are numbers in the request (neighbour counts). */
  numeric?: boolean;
}

export interface TextField {
  kind: 'text';
  key: string;
  label: string;
  help: string;
}

export type SiteField = NumberField | ChoiceField | TextField;

export interface FieldSection {
  title: string;
  fields: SiteField[];
}

/** The site itself. Latitude, longitude, height and code are fixed once the site exists. */
export const SITE_FIELDS: SiteField[] = [
  {
    kind: 'text',
    key: 'code',
    label: 'Code',
    help: 'Capital letters, digits, - or _; used in tables and file names.',
  },
  { kind: 'text', key: 'name', label: 'Name', help: 'How staff call the site.' },
  { kind: 'number', key: 'lat', label: 'Latitude', unit: '° N', help: 'Of the antenna; south is negative.' },
  { kind: 'number', key: 'lon', label: 'Longitude', unit: '° E', help: 'Of the antenna; west is negative.' },
  {
    kind: 'number',
    key: 'altitudeM',
    label: 'Antenna height',
    unit: 'm above sea level',
    help: 'Height of the antenna.',
  },
  {
    kind: 'number',
    key: 'rangeKm',
    label: 'Range',
    unit: 'km',
    help: 'Echoes further out than this are not used.',
  },
  {
    kind: 'number',
    key: 'intervalMin',
    label: 'Scan interval',
    unit: 'min',
    help: 'Nominal time between two scans.',
  },
  {
    kind: 'number',
    key: 'utcOffsetMinutes',
    label: 'Local time offset',
    unit: 'min',
    help: 'Local time = UTC + this many minutes (360 is UTC+06:00).',
  },
];

/** Fields that cannot change after the site is created (UpdateSiteRequest leaves them out). */
export const FIXED_AFTER_CREATE = ['code', 'lat', 'lon', 'altitudeM'] as const;

const NEIGHBOURS_3D = [
  { value: '6', text: '6 (faces)' },
  { value: '18', text: '18 (faces and edges)' },
  { value: '26', text: '26 (faces, edges and corners)' },
];
const NEIGHBOURS_2D = [
  { value: '4', text: '4 (sides)' },
  { value: '8', text: '8 (sides and corners)' },
];

export const SETTINGS_SECTIONS: FieldSection[] = [
  {
    title: 'Finding cells',
    fields: [
      {
        kind: 'number',
        key: 'settings.thresholdDbz',
        label: 'Reflectivity threshold',
        unit: 'dBZ',
        help: 'Grid points at or above this belong to a cell.',
      },
      {
        kind: 'number',
        key: 'settings.minVolumeKm3',
        label: 'Smallest cell volume',
        unit: 'km³',
        help: 'Smaller regions in volume scans are dropped.',
      },
      {
        kind: 'number',
        key: 'settings.minAreaKm2',
        label: 'Smallest cell area',
        unit: 'km²',
        help: 'Replaces the volume rule for column-maximum fields.',
      },
      {
        kind: 'choice',
        key: 'settings.connectivity3d',
        label: 'Neighbours in volume scans',
        help: 'Which grid neighbours join one region in 3-D.',
        options: NEIGHBOURS_3D,
        numeric: true,
      },
      {
        kind: 'choice',
        key: 'settings.connectivity2d',
        label: 'Neighbours in 2-D fields',
        help: 'Which grid neighbours join one region in 2-D.',
        options: NEIGHBOURS_2D,
        numeric: true,
      },
      {
        kind: 'number',
        key: 'settings.echoTopDbz',
        label: 'Echo-top threshold',
        unit: 'dBZ',
        help: 'The echo top is the highest level at or above this over the cell.',
      },
      {
        kind: 'number',
        key: 'settings.coreDbz',
        label: 'Intense-core threshold',
        unit: 'dBZ',
        help: 'The cell’s volume at or above this is its core.',
      },
      {
        kind: 'number',
        key: 'settings.vilCapDbz',
        label: 'Cap for liquid water',
        unit: 'dBZ',
        help: 'Reflectivity is capped here before integrating liquid water, so hail does not inflate it.',
      },
      {
        kind: 'number',
        key: 'settings.zrA',
        label: 'Rain-rate coefficient a',
        unit: 'in Z = a·R^b',
        help: 'Turns reflectivity into rain rate at the lowest level.',
      },
      {
        kind: 'number',
        key: 'settings.zrB',
        label: 'Rain-rate exponent b',
        unit: 'in Z = a·R^b',
        help: 'Exponent of the same relation.',
      },
      {
        kind: 'number',
        key: 'settings.typeEdgesKm.0',
        label: 'Congestus from',
        unit: 'km',
        help: 'Cells with a lower top are shallow cumulus.',
      },
      {
        kind: 'number',
        key: 'settings.typeEdgesKm.1',
        label: 'Deep from',
        unit: 'km',
        help: 'Cells with a top at least this high are deep convection.',
      },
      {
        kind: 'choice',
        key: 'settings.typeHeight',
        label: 'Height that sets the type',
        help: 'Which top of the cell the two edges above are compared with.',
        options: [
          { value: 'echoTop', text: 'Echo top' },
          { value: 'top35', text: 'Top of the threshold echo (35 dBZ top)' },
        ],
      },
    ],
  },
  {
    title: 'Tracking',
    fields: [
      {
        kind: 'number',
        key: 'settings.maxSpeedMs',
        label: 'Fastest motion',
        unit: 'm/s',
        help: 'A match that needs a faster motion is refused.',
      },
      {
        kind: 'number',
        key: 'settings.maxGapIntervals',
        label: 'Longest gap',
        unit: '× scan interval',
        help: 'Scans further apart than this break every track.',
      },
      {
        kind: 'number',
        key: 'settings.sizeWeight',
        label: 'Weight of size change',
        unit: 'no unit',
        help: 'How much a change of area costs against distance when matching cells.',
      },
      {
        kind: 'number',
        key: 'settings.minScans',
        label: 'Scans for a storm',
        unit: 'scans',
        help: 'A track counts as a storm when it lasts at least this many scans.',
      },
    ],
  },
  {
    title: 'Onsets and coverage',
    fields: [
      {
        kind: 'number',
        key: 'settings.edgeBandKm',
        label: 'Edge band',
        unit: 'km',
        help: 'Tracks that start this close to the edge of coverage are flagged, not counted.',
      },
      {
        kind: 'number',
        key: 'settings.minBlockCoverage',
        label: 'Least block coverage',
        unit: '%',
        scale: 100,
        help: 'Blocks with less of their area in coverage show “no data”, never zero.',
      },
      {
        kind: 'number',
        key: 'settings.minAvailability',
        label: 'Least availability',
        unit: '%',
        scale: 100,
        help: 'A day counts for a time-of-day bin only with this share of expected scans.',
      },
    ],
  },
];

export const ALL_SETTING_FIELDS: SiteField[] = SETTINGS_SECTIONS.flatMap((s) => s.fields);

/** Reads a value at a dotted path ("settings.typeEdgesKm.0") out of a nested object. */
export function valueAt(source: unknown, key: string): unknown {
  return key.split('.').reduce<unknown>((value, part) => {
    if (value === null || typeof value !== 'object') return undefined;
    return (value as Record<string, unknown>)[part];
  }, source);
}

export type SettingKey = keyof SiteSettings;
