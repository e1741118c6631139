import { describe, expect, it } from 'vitest';
import { summarizeTrack } from './track-summary.js';
import { type CellObservation, type Scan, trackScans } from './tracking.js';

const MIN = 60_000;
const settings = { maxSpeedMs: 30, maxGapMs: 15 * MIN, sizeWeight: 0.5 };
const starts = { minScans: 2, nominalIntervalMs: 6 * MIN, edgeBandKm: 10, coverageRadiusKm: 180 };
const cell = (x: number, y: number, volumeKm3 = 30, areaKm2 = 20): CellObservation => ({
  x,
  y,
  areaKm2,
  volumeKm3,
});
const scanAt = (minute: number, cells: CellObservation[]): Scan => ({
  time: Date.UTC(2031, 6, 1, 8) + minute * MIN,
  cells,
});

// Worked by hand: every expectation below follows from the definitions in the tracker's comments.
describe('trackScans', () => {
  it('follows two storms whose paths cross, using their own motion', () => {
    // A moves east at 5 m/s (1.8 km per 6 min), B moves west; they pass within 0.4 km of each other.
    const scans = [0, 1, 2, 3, 4].map((k) =>
      scanAt(6 * k, [cell(-4 + 1.8 * k, 0, 30), cell(4 - 1.8 * k, 0.4, 60)]),
    );
    const tracks = trackScans(scans, settings);
    expect(tracks).toHaveLength(2);
    // Cell 0 of each scan is A; A's track must keep taking cell 0 even after the crossing.
    expect(tracks[0].cells.map(([, c]) => c)).toEqual([0, 0, 0, 0, 0]);
    expect(tracks[1].cells.map(([, c]) => c)).toEqual([1, 1, 1, 1, 1]);
  });

  it('refuses a link faster than the maximum speed, starting a new track instead', () => {
    // 12 km in 6 min is 33 m/s > 30 m/s.
    const tracks = trackScans([scanAt(0, [cell(0, 0)]), scanAt(6, [cell(12, 0)])], settings);
    expect(tracks).toHaveLength(2);
    expect(tracks[1].parent).toBeNull();
  });

  it('breaks every track across a gap longer than the maximum and flags what follows', () => {
    const tracks = trackScans([scanAt(0, [cell(0, 0)]), scanAt(30, [cell(0.5, 0)])], settings);
    expect(tracks.map((t) => t.startsUnseen)).toEqual(['data-start', 'after-gap']);
  });

  it('bridges one missing scan inside the maximum gap', () => {
    const tracks = trackScans([scanAt(0, [cell(0, 0)]), scanAt(12, [cell(1, 0)])], settings);
    expect(tracks).toHaveLength(1);
  });

  it('marks a split: the smaller child of a cell records its parent', () => {
    const tracks = trackScans(
      [scanAt(0, [cell(0, 0, 60, 40)]), scanAt(6, [cell(0.5, 0, 45, 30), cell(-3, 2, 15, 10)])],
      settings,
    );
    expect(tracks).toHaveLength(2);
    expect(tracks[0].cells).toEqual([
      [0, 0],
      [1, 0],
    ]);
    expect(tracks[1].parent).toBe(0);
  });

  it('marks a merger: the track that loses its cell records the one it joined', () => {
    const tracks = trackScans(
      [scanAt(0, [cell(0, 0, 50, 30), cell(4, 0, 10, 8)]), scanAt(6, [cell(1, 0, 62, 40)])],
      settings,
    );
    expect(tracks[0].cells).toHaveLength(2);
    expect(tracks[1].mergedInto).toBe(0);
  });
});

describe('summarizeTrack', () => {
  it('counts an onset inside coverage and gives duration, speed and direction', () => {
    // Moves 3.6 km north-east... here due north: 0 → 3.6 km in 12 min = 5 m/s toward 0°.
    const scans = [
      scanAt(0, []),
      scanAt(6, [cell(50, 0)]),
      scanAt(12, [cell(50, 1.8)]),
      scanAt(18, [cell(50, 3.6)]),
    ];
    const [t] = trackScans(scans, settings);
    const s = summarizeTrack(t, scans, starts);
    expect(s).toMatchObject({
      scans: 3,
      isStorm: true,
      onset: true,
      notOnsetReason: null,
      durationMs: 18 * MIN,
    });
    expect(s.speedMs).toBeCloseTo(5, 9);
    expect(s.directionToDeg).toBeCloseTo(0, 9);
  });

  it.each([
    // Direction the storm moves toward, clockwise from north (common practice).
    [1, 0, 90],
    [0, -1, 180],
    [-1, 0, 270],
    [-1, 1, 315],
  ])('moving by (%d, %d) km heads toward %d°', (dx, dy, deg) => {
    const scans = [scanAt(0, []), scanAt(6, [cell(0, 0)]), scanAt(12, [cell(dx, dy)])];
    const s = summarizeTrack(trackScans(scans, settings)[0], scans, starts);
    expect(s.directionToDeg).toBeCloseTo(deg, 9);
  });

  it.each([
    [
      'a start at the edge of coverage',
      [scanAt(0, []), scanAt(6, [cell(175, 0)]), scanAt(12, [cell(174, 0)])],
      0,
      'edge-band',
    ],
    [
      'a start in the first scan of the data',
      [scanAt(0, [cell(0, 0)]), scanAt(6, [cell(1, 0)])],
      0,
      'data-start',
    ],
    [
      'a split child',
      [
        scanAt(0, []),
        scanAt(6, [cell(0, 0, 60, 40)]),
        scanAt(12, [cell(0.5, 0, 45, 30), cell(-3, 2, 15, 10)]),
        scanAt(18, [cell(1, 0, 45, 30), cell(-3.5, 2, 15, 10)]),
      ],
      1,
      'split',
    ],
  ] as const)('does not count %s as an onset', (_what, scans, track, reason) => {
    const s = summarizeTrack(trackScans([...scans], settings)[track], [...scans], starts);
    expect(s.onset).toBe(false);
    expect(s.notOnsetReason).toBe(reason);
  });

  it('does not count a one-scan cell as a storm', () => {
    const scans = [scanAt(0, []), scanAt(6, [cell(0, 0)]), scanAt(12, [])];
    const s = summarizeTrack(trackScans(scans, settings)[0], scans, starts);
    expect(s).toMatchObject({ isStorm: false, onset: false, durationMs: 6 * MIN, speedMs: null });
  });
});
