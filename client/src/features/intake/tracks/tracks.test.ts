import { describe, expect, it } from 'vitest';
import { compassPoint, formatHeading, onsetText, trackPath } from './trackFormat';
import { nextSort, searchFromView, tracksQuery, viewFromSearch } from './tracksSearch';

describe('compassPoint', () => {
  // Eight-point compass rose, 45° sectors centred on each point (common practice).
  it.each([
    [0, 'N'],
    [22.4, 'N'],
    [22.5, 'NE'],
    [90, 'E'],
    [180, 'S'],
    [292.5, 'NW'],
    [337.4, 'NW'],
    [337.5, 'N'],
    [360, 'N'],
    [-45, 'NW'],
  ])('%d° → %s', (degrees, point) => {
    expect(compassPoint(degrees)).toBe(point);
  });

  it('writes the heading with its degrees', () => {
    expect(formatHeading(314.6)).toBe('315° NW');
    expect(formatHeading(null)).toBe('—');
  });
});

describe('onsetText', () => {
  it.each([
    [true, null, 'Yes'],
    [false, 'edge-band', 'At the edge of coverage'],
    [false, 'after-gap', 'After a gap in the data'],
    [false, null, 'No'],
  ] as const)('onset %s, reason %s → %s', (onset, notOnsetReason, text) => {
    expect(onsetText({ onset, notOnsetReason })).toBe(text);
  });
});

describe('trackPath', () => {
  it('joins the centroids in time order, whatever order they arrive in', () => {
    const path = trackPath([
      { scanTime: '2026-07-14T09:54:00Z', lon: 88.0, lat: 14.2 },
      { scanTime: '2026-07-14T09:42:00Z', lon: 88.2, lat: 14.0 },
      { scanTime: '2026-07-14T09:48:00Z', lon: 88.1, lat: 14.1 },
    ]);
    expect(path).toEqual([
      [88.2, 14.0],
      [88.1, 14.1],
      [88.0, 14.2],
    ]);
  });
});

describe('the tracks view in the address', () => {
  it('reads defaults from an empty address and writes nothing back', () => {
    const view = viewFromSearch(new URLSearchParams());
    expect(view).toMatchObject({ siteId: null, sort: 'firstTime', order: 'asc', page: 1, pageSize: 50 });
    expect(searchFromView(view).toString()).toBe('');
  });

  it('round-trips every filter', () => {
    const text =
      'siteId=2&blockId=5&type=deep&onsetOnly=true&minDurationMin=30&from=2026-07-01&to=2026-07-31&sort=speedMs&order=desc&page=3&pageSize=25';
    expect(searchFromView(viewFromSearch(new URLSearchParams(text))).toString()).toBe(text);
  });

  it('ignores values that are not allowed', () => {
    const view = viewFromSearch(new URLSearchParams('siteId=x&type=huge&sort=name&pageSize=7&from=July'));
    expect(view).toMatchObject({ siteId: null, type: null, sort: 'firstTime', pageSize: 50, fromDay: null });
  });

  it('asks the server for the page and the local days in UTC', () => {
    const view = viewFromSearch(
      new URLSearchParams('siteId=1&from=2026-07-14&to=2026-07-14&page=3&pageSize=25'),
    );
    // Local day 14 July at UTC+06:00 runs from 18:00 UTC on the 13th to 18:00 UTC on the 14th.
    expect(tracksQuery({ ...view, siteId: 1 }, 360)).toEqual({
      siteId: 1,
      from: '2026-07-13T18:00:00.000Z',
      to: '2026-07-14T18:00:00.000Z',
      sort: 'firstTime',
      order: 'asc',
      offset: 50,
      limit: 25,
    });
  });

  it('flips the order on the same column and starts a new one ascending, back on page 1', () => {
    const view = viewFromSearch(new URLSearchParams('sort=durationMin&page=4'));
    expect(nextSort(view, 'durationMin')).toEqual({ sort: 'durationMin', order: 'desc', page: 1 });
    expect(nextSort(view, 'speedMs')).toEqual({ sort: 'speedMs', order: 'asc', page: 1 });
  });
});
