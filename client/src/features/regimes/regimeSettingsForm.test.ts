import { RegimeSettings } from '@stormhour/shared';
import { describe, expect, it } from 'vitest';
import { checkSettings, placeSettingsErrors, settingsValues } from './regimeSettingsForm';

const saved = RegimeSettings.parse({ fixedBoundsGKg: [-0.2, 0.2] });

describe('regime settings form', () => {
  it('keeps the saved bounds with terciles, whatever was typed before switching', () => {
    const values = { ...settingsValues(saved), bounds: ['oops', ''] as [string, string] };
    const checked = checkSettings(values, saved);
    expect(checked.ok && checked.body.fixedBoundsGKg).toEqual([-0.2, 0.2]);
  });

  it('says which numbers do not read, before asking the schema', () => {
    const values = { ...settingsValues(saved), moistureMethod: 'fixed' as const, weakBelowMs: 'calm' };
    values.sectors[0] = { ...values.sectors[0], toDeg: '' };
    const checked = checkSettings(values, saved);
    expect(checked.ok ? {} : checked.errors).toEqual({
      weakBelowMs: 'Enter a speed in m/s',
      'sectors.0.toDeg': 'Enter a direction in degrees',
    });
  });

  it('puts the rule on both bounds beside the moist bound', () => {
    expect(placeSettingsErrors({ fixedBoundsGKg: 'The dry bound must be below the moist bound' })).toEqual({
      'fixedBoundsGKg.1': 'The dry bound must be below the moist bound',
    });
  });
});
