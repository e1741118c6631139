import { ATLAS_BIN_HOURS, DEFAULT_AXIS } from '@stormhour/shared';
import type { AtlasParams, AxisParams } from './api';

/** The Atlas keeps its whole state in the address, so a view can be linked, reloaded and shared. */
export const VIEWS = ['map', 'diurnal', 'distributions', 'time-distance', 'motion'] as const;
export type AtlasView = (typeof VIEWS)[number];

export const VIEW_NAMES: Record<AtlasView, string> = {
  map: 'Onset map',
  diurnal: 'Daily cycle',
  distributions: 'Distributions',
  'time-distance': 'Time–distance',
  motion: 'Motion rose',
};

const numberOr = (text: string | null, fallback: number) => {
  if (text === null || text.trim() === '') return fallback;
  const n = Number(text);
  return Number.isFinite(n) ? n : fallback;
};

export function viewOf(search: URLSearchParams): AtlasView {
  const v = search.get('view');
  return (VIEWS as readonly string[]).includes(v ?? '') ? (v as AtlasView) : 'map';
}

export function filterOf(search: URLSearchParams, siteId: number): AtlasParams {
  const district = Number(search.get('district'));
  return {
    siteId,
    from: search.get('from') || null,
    to: search.get('to') || null,
    regime: search.get('regime') || null,
    districtId: Number.isInteger(district) && district > 0 ? district : null,
    cellType: search.get('type') || null,
    source: search.get('source') || null,
  };
}

export function binOf(search: URLSearchParams): { binHours: number; bin: number | null } {
  const hours = numberOr(search.get('binHours'), 3);
  const binHours = (ATLAS_BIN_HOURS as readonly number[]).includes(hours) ? hours : 3;
  const bin = search.get('bin');
  const index = bin === null || bin === '' ? null : Number(bin);
  return {
    binHours,
    bin: index !== null && Number.isInteger(index) && index >= 0 && index < 24 / binHours ? index : null,
  };
}

export function axisOf(search: URLSearchParams): AxisParams {
  return {
    fromLat: numberOr(search.get('fromLat'), DEFAULT_AXIS.fromLat),
    fromLon: numberOr(search.get('fromLon'), DEFAULT_AXIS.fromLon),
    toLat: numberOr(search.get('toLat'), DEFAULT_AXIS.toLat),
    toLon: numberOr(search.get('toLon'), DEFAULT_AXIS.toLon),
    halfWidthKm: numberOr(search.get('halfWidth'), 40),
  };
}

/** "12–15 h" for a bin of local time. */
export function binLabel(binHours: number, bin: number): string {
  return `${String(bin * binHours).padStart(2, '0')}–${String((bin + 1) * binHours).padStart(2, '0')} h`;
}
