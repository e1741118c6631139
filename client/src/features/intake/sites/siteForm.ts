import {
  CreateSiteRequest,
  DEFAULT_SITE_SETTINGS,
  type SiteView,
  UpdateSiteRequest,
} from '@stormhour/shared';
import { fieldErrorsFromZod } from '../../../lib/fieldErrors';
import { ALL_SETTING_FIELDS, FIXED_AFTER_CREATE, SITE_FIELDS, type SiteField, valueAt } from './siteFields';

/** What the form holds: text as typed, so a half-typed number is not lost or coerced. */
export interface SiteFormValues {
  fields: Record<string, string>;
  sectors: { fromDeg: string; toDeg: string }[];
}

export type FieldErrors = Record<string, string>;

const EVERY_FIELD: SiteField[] = [...SITE_FIELDS, ...ALL_SETTING_FIELDS];

/** Field keys the form can show an error beside; anything else is listed above the form. */
export function placedKeys(sectorCount: number): Set<string> {
  const keys = new Set(EVERY_FIELD.map((f) => f.key));
  for (let i = 0; i < sectorCount; i++) {
    for (const suffix of ['', '.fromDeg', '.toDeg']) keys.add(`blockedSectors.${i}${suffix}`);
  }
  return keys;
}

function shown(value: unknown, field: SiteField): string {
  if (value === undefined || value === null) return '';
  if (field.kind === 'number' && typeof value === 'number') {
    // toPrecision trims float noise such as 0.56 × 100 = 56.00000000000001.
    return String(Number((value * (field.scale ?? 1)).toPrecision(12)));
  }
  return String(value);
}

/** The form's starting values: the site's own, or empty site fields with the default settings. */
export function siteFormValues(site?: SiteView): SiteFormValues {
  const source = site ?? { settings: DEFAULT_SITE_SETTINGS };
  const fields: Record<string, string> = {};
  for (const field of EVERY_FIELD) fields[field.key] = shown(valueAt(source, field.key), field);
  const sectors = (site?.blockedSectors ?? []).map((s) => ({
    fromDeg: String(s.fromDeg),
    toDeg: String(s.toDeg),
  }));
  return { fields, sectors };
}

function parseNumber(text: string): number | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : null;
}

/** Sets a value at a dotted path, making arrays for numeric parts ("typeEdgesKm.0"). */
function setAt(target: Record<string, unknown>, key: string, value: unknown): void {
  const parts = key.split('.');
  let node: Record<string, unknown> = target;
  parts.slice(0, -1).forEach((part, i) => {
    node[part] ??= /^\d+$/.test(parts[i + 1]) ? [] : {};
    node = node[part] as Record<string, unknown>;
  });
  node[parts[parts.length - 1]] = value;
}

/** Turns the typed text into the request's shape; numbers that do not read are errors already. */
export function readSiteForm(values: SiteFormValues): {
  draft: Record<string, unknown>;
  errors: FieldErrors;
} {
  const draft: Record<string, unknown> = {};
  const errors: FieldErrors = {};
  for (const field of EVERY_FIELD) {
    const text = values.fields[field.key] ?? '';
    if (field.kind === 'text') {
      setAt(draft, field.key, text.trim());
    } else if (field.kind === 'choice') {
      setAt(draft, field.key, field.numeric ? Number(text) : text);
    } else {
      const value = parseNumber(text);
      if (value === null) errors[field.key] = 'Enter a number';
      else setAt(draft, field.key, Number((value / (field.scale ?? 1)).toPrecision(12)));
    }
  }
  draft.blockedSectors = values.sectors.map((sector, i) => {
    const fromDeg = parseNumber(sector.fromDeg);
    const toDeg = parseNumber(sector.toDeg);
    if (fromDeg === null) errors[`blockedSectors.${i}.fromDeg`] = 'Enter an azimuth in degrees';
    if (toDeg === null) errors[`blockedSectors.${i}.toDeg`] = 'Enter an azimuth in degrees';
    return { fromDeg, toDeg };
  });
  return { draft, errors };
}

/**
 * Puts each problem on a field the form shows: a rule on both type edges goes beside the deep edge,
 * and shares edited as % get a message in %.
 */
export function placeErrors(errors: FieldErrors): FieldErrors {
  const placed: FieldErrors = {};
  for (const [key, message] of Object.entries(errors)) {
    const target = key === 'settings.typeEdgesKm' ? 'settings.typeEdgesKm.1' : key;
    const field = EVERY_FIELD.find((f) => f.key === target);
    placed[target] ??= field?.kind === 'number' && field.scale ? 'Enter a share from 0 to 100 %' : message;
  }
  return placed;
}

type Checked<T> = { ok: true; body: T } | { ok: false; errors: FieldErrors };

function checkAll(values: SiteFormValues): Checked<CreateSiteRequest> {
  const { draft, errors } = readSiteForm(values);
  if (Object.keys(errors).length > 0) return { ok: false, errors };
  const parsed = CreateSiteRequest.safeParse(draft);
  if (!parsed.success) return { ok: false, errors: placeErrors(fieldErrorsFromZod(parsed.error)) };
  return { ok: true, body: parsed.data };
}

export function checkCreate(values: SiteFormValues): Checked<CreateSiteRequest> {
  return checkAll(values);
}

function same(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/**
 * Checks the whole form, then keeps only what changed, so a concurrent edit of another field is not
 * overwritten and unchanged settings do not make a new settings version.
 */
export function checkUpdate(site: SiteView, values: SiteFormValues): Checked<UpdateSiteRequest> {
  const fixed = Object.fromEntries(FIXED_AFTER_CREATE.map((key) => [key, String(site[key])]));
  const checked = checkAll({ ...values, fields: { ...values.fields, ...fixed } });
  if (!checked.ok) return checked;
  const next = checked.body;
  const body: UpdateSiteRequest = {};
  if (next.name !== site.name) body.name = next.name;
  if (next.rangeKm !== site.rangeKm) body.rangeKm = next.rangeKm;
  if (next.intervalMin !== site.intervalMin) body.intervalMin = next.intervalMin;
  if (next.utcOffsetMinutes !== site.utcOffsetMinutes) body.utcOffsetMinutes = next.utcOffsetMinutes;
  if (!same(next.blockedSectors, site.blockedSectors)) body.blockedSectors = next.blockedSectors;
  const settings = Object.fromEntries(
    Object.entries(next.settings).filter(
      ([key, value]) => !same(value, site.settings[key as keyof typeof site.settings]),
    ),
  );
  if (Object.keys(settings).length > 0) body.settings = settings;
  // Checked but sent as built: parsing would fill every omitted setting with its default (zod 4
  // applies defaults inside .partial()), and the server would reset settings nobody touched.
  const parsed = UpdateSiteRequest.safeParse(body);
  if (!parsed.success) return { ok: false, errors: placeErrors(fieldErrorsFromZod(parsed.error)) };
  return { ok: true, body };
}

/** True when saving these changes makes a new settings version. */
export function changesSettings(body: UpdateSiteRequest): boolean {
  return body.settings !== undefined && Object.keys(body.settings).length > 0;
}
