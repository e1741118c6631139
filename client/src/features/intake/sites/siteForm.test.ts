import { describe, expect, it } from 'vitest';
import { aSite } from '../../../test/intakeBuilders';
import {
  changesSettings,
  checkCreate,
  checkUpdate,
  placeErrors,
  readSiteForm,
  siteFormValues,
} from './siteForm';

function newSiteValues(fields: Record<string, string>) {
  const values = siteFormValues();
  return { ...values, fields: { ...values.fields, ...fields } };
}

const COMPLETE = {
  code: 'VSR',
  name: 'Vessary Valley',
  lat: '14.2',
  lon: '88.1',
  altitudeM: '240',
  rangeKm: '180',
  intervalMin: '6',
  utcOffsetMinutes: '360',
};

describe('siteFormValues', () => {
  it('starts a new site with the default settings, shares shown in %', () => {
    const { fields } = siteFormValues();
    expect(fields['settings.thresholdDbz']).toBe('35');
    expect(fields['settings.typeEdgesKm.0']).toBe('4');
    expect(fields['settings.typeEdgesKm.1']).toBe('9');
    // 0.8 of expected scans is edited as 80 %, without float noise.
    expect(fields['settings.minAvailability']).toBe('80');
    expect(fields.code).toBe('');
  });
});

describe('checkCreate', () => {
  it('turns the typed text into a CreateSiteRequest', () => {
    const values = newSiteValues({ ...COMPLETE, 'settings.minBlockCoverage': '56' });
    values.sectors = [{ fromDeg: '200', toDeg: '215.5' }];
    const checked = checkCreate(values);
    expect(checked.ok).toBe(true);
    if (!checked.ok) return;
    expect(checked.body).toMatchObject({ code: 'VSR', lat: 14.2, utcOffsetMinutes: 360 });
    expect(checked.body.blockedSectors).toEqual([{ fromDeg: 200, toDeg: 215.5 }]);
    expect(checked.body.settings.minBlockCoverage).toBe(0.56);
    expect(checked.body.settings.connectivity3d).toBe(26);
  });

  it.each([
    ['lat', '', 'lat', 'Enter a number'],
    ['lat', 'north', 'lat', 'Enter a number'],
    ['code', 'vsr', 'code', 'Use 1–24 capital letters, digits, - or _'],
    // A share above 100 % is reported in %, the unit the user typed.
    ['settings.minAvailability', '120', 'settings.minAvailability', 'Enter a share from 0 to 100 %'],
    // The rule on both edges lands beside the deep edge.
    ['settings.typeEdgesKm.1', '3', 'settings.typeEdgesKm.1', 'The shallow edge must be below the deep edge'],
  ])('%s = %j → error on %s', (key, text, where, message) => {
    const checked = checkCreate(newSiteValues({ ...COMPLETE, [key]: text }));
    expect(checked.ok).toBe(false);
    if (checked.ok) return;
    expect(checked.errors[where]).toBe(message);
  });

  it('names a sector azimuth that does not read', () => {
    const values = newSiteValues(COMPLETE);
    values.sectors = [{ fromDeg: '10', toDeg: '' }];
    const { errors } = readSiteForm(values);
    expect(errors).toEqual({ 'blockedSectors.0.toDeg': 'Enter an azimuth in degrees' });
  });
});

describe('checkUpdate', () => {
  const site = aSite({ settingsVersion: 3 });

  it('sends nothing when nothing changed', () => {
    const checked = checkUpdate(site, siteFormValues(site));
    expect(checked).toEqual({ ok: true, body: {} });
  });

  it('sends only the fields and settings that changed', () => {
    const values = siteFormValues(site);
    values.fields.name = 'Vessary Valley North';
    values.fields['settings.thresholdDbz'] = '40';
    values.fields['settings.typeEdgesKm.1'] = '10';
    const checked = checkUpdate(site, values);
    expect(checked).toEqual({
      ok: true,
      body: { name: 'Vessary Valley North', settings: { thresholdDbz: 40, typeEdgesKm: [4, 10] } },
    });
    expect(checked.ok && changesSettings(checked.body)).toBe(true);
  });

  it('does not count a rename as a settings change', () => {
    const values = siteFormValues(site);
    values.fields.name = 'Valley';
    const checked = checkUpdate(site, values);
    expect(checked.ok && changesSettings(checked.body)).toBe(false);
  });
});

describe('placeErrors', () => {
  it('keeps server problems on their own fields', () => {
    expect(placeErrors({ 'settings.thresholdDbz': 'Too high', 'blockedSectors.0': 'Overlaps' })).toEqual({
      'settings.thresholdDbz': 'Too high',
      'blockedSectors.0': 'Overlaps',
    });
  });
});
