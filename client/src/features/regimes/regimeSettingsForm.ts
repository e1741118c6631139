import { RegimeSettings } from '@stormhour/shared';
import { fieldErrorsFromZod } from '../../lib/fieldErrors';

type FieldErrors = Record<string, string>;

/** The settings as typed: numbers stay text until saved, so a half-typed "-0." is not lost. */
export interface RegimeSettingsValues {
  moistureMethod: RegimeSettings['moistureMethod'];
  bounds: [dry: string, moist: string];
  weakBelowMs: string;
  sectors: { name: string; fromDeg: string; toDeg: string }[];
}

export function settingsValues(settings: RegimeSettings): RegimeSettingsValues {
  return {
    moistureMethod: settings.moistureMethod,
    bounds: [String(settings.fixedBoundsGKg[0]), String(settings.fixedBoundsGKg[1])],
    weakBelowMs: String(settings.weakBelowMs),
    sectors: settings.sectors.map((s) => ({
      name: s.name,
      fromDeg: String(s.fromDeg),
      toDeg: String(s.toDeg),
    })),
  };
}

function parseNumber(text: string): number | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : null;
}

/**
 * Puts each problem on a field the form shows: the rule on both bounds goes beside the moist bound,
 * and a rule on the whole list of sectors below the list.
 */
export function placeSettingsErrors(errors: FieldErrors): FieldErrors {
  const placed: FieldErrors = {};
  for (const [key, message] of Object.entries(errors)) {
    const target = key === 'fixedBoundsGKg' ? 'fixedBoundsGKg.1' : key;
    placed[target] ??= message;
  }
  return placed;
}

type Checked = { ok: true; body: RegimeSettings } | { ok: false; errors: FieldErrors };

/**
 * The whole settings to send, checked by the shared schema. With terciles the bounds are hidden and
 * not in use, so the saved ones are kept rather than whatever was typed before switching.
 */
export function checkSettings(values: RegimeSettingsValues, saved: RegimeSettings): Checked {
  const errors: FieldErrors = {};
  const fixed = values.moistureMethod === 'fixed';
  const bounds = values.bounds.map((text, i) => {
    if (!fixed) return saved.fixedBoundsGKg[i];
    const value = parseNumber(text);
    if (value === null) errors[`fixedBoundsGKg.${i}`] = 'Enter a number in g/kg';
    return value;
  });
  const weakBelowMs = parseNumber(values.weakBelowMs);
  if (weakBelowMs === null) errors.weakBelowMs = 'Enter a speed in m/s';
  const sectors = values.sectors.map((sector, i) => {
    const fromDeg = parseNumber(sector.fromDeg);
    const toDeg = parseNumber(sector.toDeg);
    if (fromDeg === null) errors[`sectors.${i}.fromDeg`] = 'Enter a direction in degrees';
    if (toDeg === null) errors[`sectors.${i}.toDeg`] = 'Enter a direction in degrees';
    return { name: sector.name, fromDeg, toDeg };
  });
  if (Object.keys(errors).length > 0) return { ok: false, errors };
  const parsed = RegimeSettings.safeParse({
    moistureMethod: values.moistureMethod,
    fixedBoundsGKg: bounds,
    weakBelowMs,
    sectors,
  });
  if (!parsed.success) return { ok: false, errors: placeSettingsErrors(fieldErrorsFromZod(parsed.error)) };
  return { ok: true, body: parsed.data };
}
