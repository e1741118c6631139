import { describe, expect, it } from 'vitest';
import { destination, distanceAndAzimuth, sitePlane } from '../../radar/engine/site-plane.js';
import { axisLength, projectOntoAxis, timeDistanceCounts } from './axis.js';

describe('projection onto an axis', () => {
  it('matches a hand-worked example', () => {
    // Axis (0,0) → (30,40): length 50, unit vector (0.6, 0.8) (computed by hand).
    // (10,20): along 0.6·10 + 0.8·20 = 22, across 0.6·20 − 0.8·10 = +4 (left of the axis).
    // (40,0): along 24, across −32 (right). (−6,−8): along −10, behind the first point.
    const axis = { ax: 0, ay: 0, bx: 30, by: 40 };
    expect(axisLength(axis)).toBe(50);
    const { along, across } = projectOntoAxis(Float64Array.of(10, 40, -6), Float64Array.of(20, 0, -8), axis);
    expect(Array.from(along)).toEqual([22, 24, -10].map((v) => expect.closeTo(v, 12)));
    expect(Array.from(across)).toEqual([4, -32, 0].map((v) => expect.closeTo(v, 12)));
  });

  it('agrees with geodesics on WGS84 (geographiclib, Karney 2013) in the radar-centred plane', () => {
    const site = { lat: 14.18, lon: 87.95 };
    const plane = sitePlane(site);
    const a = { lat: 13.5, lon: 87.3 };
    const b = { lat: 14.9, lon: 88.7 };
    const line = distanceAndAzimuth(a, b);
    const [ax, ay] = plane.toKm(a.lon, a.lat);
    const [bx, by] = plane.toKm(b.lon, b.lat);
    const axis = { ax, ay, bx, by };
    // Azimuthal equidistant distortion off the centre is (r/R)²/6 ≈ 5e-5 at 100 km: well under 0.1 km here.
    expect(axisLength(axis)).toBeCloseTo(line.km, 1);
    // A point 80 km along the geodesic, then 15 km off it to the right (azimuth + 90°).
    const onLine = destination(a, line.azimuthDeg, 80);
    const back = distanceAndAzimuth(onLine, b);
    const off = destination(onLine, back.azimuthDeg + 90, 15);
    const [px, py] = plane.toKm(off.lon, off.lat);
    const { along, across } = projectOntoAxis(Float64Array.of(px), Float64Array.of(py), axis);
    expect(along[0]).toBeCloseTo(80, 0);
    expect(Math.abs(along[0] - 80)).toBeLessThan(0.2);
    expect(Math.abs(across[0] + 15)).toBeLessThan(0.2);
  });
});

describe('time–distance counts', () => {
  it('counts only the corridor and places each point by distance and local hour', () => {
    const along = Float64Array.of(5, 15, 29.99, 30, 12, -1, 31, 8);
    const across = Float64Array.of(0, -9, 3, 0, 11, 0, 0, 10);
    const hours = Float64Array.of(0.5, 13.9, 23.99, 14, 14, 14, 14, 6);
    const { counts, inCorridor } = timeDistanceCounts(along, across, hours, 30, 10, 10);
    expect(counts).toHaveLength(3);
    // Left out: across 11 > 10, along −1 and 31 outside the axis. The far end (30) joins the last row.
    expect(inCorridor).toBe(5);
    expect(counts[0][0]).toBe(1);
    expect(counts[0][6]).toBe(1);
    expect(counts[1][13]).toBe(1);
    expect(counts[2][23]).toBe(1);
    expect(counts[2][14]).toBe(1);
  });
});
