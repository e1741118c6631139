import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { coveragePolygon, inSector, isCovered } from './coverage.js';
import { destination, distanceAndAzimuth, sitePlane } from './site-plane.js';

const dms = (d: number, m: number, s: number) => Math.sign(d) * (Math.abs(d) + m / 60 + s / 3600);

describe('geodesics on WGS84', () => {
  it('solves Karney 2013 Table 2 (direct problem)', () => {
    // φ1 = 40°, α1 = 30°, s = 10 000 km → φ2 = 41.79331020506°, λ12 = 137.84490004377° (published).
    const p = destination({ lat: 40, lon: 0 }, 30, 10_000);
    expect(p.lat).toBeCloseTo(41.79331020506, 9);
    expect(p.lon).toBeCloseTo(137.84490004377, 9);
  });

  it('solves the GeodSolve manual example (inverse problem)', () => {
    // 40°38′23″N 73°46′44″W to 1°21′33″N 103°59′22″E: s = 15 347 628 m, azi1 = 3°18′29.9″ (published).
    const r = distanceAndAzimuth(
      { lat: dms(40, 38, 23), lon: -dms(73, 46, 44) },
      { lat: dms(1, 21, 33), lon: dms(103, 59, 22) },
    );
    expect(r.km * 1000).toBeCloseTo(15_347_628, -1);
    expect(r.azimuthDeg).toBeCloseTo(dms(3, 18, 29.9), 4);
  });

  it('solves Karney 2013 Table 3 (a short line of about 5 m)', () => {
    const r = distanceAndAzimuth({ lat: -30.12345, lon: 0 }, { lat: -30.12344, lon: 0.00005 });
    expect(r.km * 1000).toBeCloseTo(4.944208, 6);
    expect(r.azimuthDeg).toBeCloseTo(77.043533, 5);
  });
});

describe('the radar-centred plane (azimuthal equidistant, proj4)', () => {
  it('reproduces the EPSG Guidance Note 7-2 Modified Azimuthal Equidistant example', () => {
    // Guam 1963 / Yap Islands on Clarke 1866: E 42 665.90 m, N 65 509.82 m (published; PROJ agrees).
    const def = `+proj=aeqd +lat_0=${dms(9, 32, 48.15)} +lon_0=${dms(138, 10, 7.48)} +x_0=40000 +y_0=60000 +ellps=clrk66 +units=m +no_defs`;
    const [e, n] = proj4('EPSG:4326', def).forward([dms(138, 11, 34.908), dms(9, 35, 47.493)]);
    expect(e).toBeCloseTo(42_665.9, 1);
    expect(n).toBeCloseTo(65_509.82, 1);
  });

  it('keeps true distance and bearing from the radar, and round-trips', () => {
    const site = { lat: 14.3, lon: 88.1 };
    const plane = sitePlane(site);
    const p = destination(site, 135, 120);
    const [x, y] = plane.toKm(p.lon, p.lat);
    // Equidistance from the centre is the projection's defining property (Snyder 1987, ch. 25).
    expect(Math.hypot(x, y)).toBeCloseTo(120, 6);
    expect((Math.atan2(x, y) * 180) / Math.PI).toBeCloseTo(135, 5);
    const [lon, lat] = plane.toLonLat(x, y);
    expect(lon).toBeCloseTo(p.lon, 10);
    expect(lat).toBeCloseTo(p.lat, 10);
  });
});

describe('coverage', () => {
  const site = { lat: 14.3, lon: 88.1, rangeKm: 180, blockedSectors: [{ fromDeg: 350, toDeg: 20 }] };

  it.each([
    [355, true],
    [10, true],
    [20, true],
    [21, false],
    [180, false],
  ])('azimuth %d° in the sector 350–20°: %s', (az, inside) => {
    expect(inSector(az, site.blockedSectors[0])).toBe(inside);
  });

  it('sees within range outside blocked sectors only', () => {
    expect(isCovered(site, 100, 90)).toBe(true);
    expect(isCovered(site, 181, 90)).toBe(false);
    expect(isCovered(site, 50, 0)).toBe(false);
  });

  it('draws a closed ring that pulls in to the radar across the blocked sector', () => {
    const ring = coveragePolygon(site).coordinates[0];
    expect(ring[0]).toEqual(ring[ring.length - 1]);
    expect(ring.some(([lon, lat]) => lon === site.lon && lat === site.lat)).toBe(true);
    const far = ring.filter(([lon, lat]) => !(lon === site.lon && lat === site.lat));
    for (const [lon, lat] of far.slice(0, 20))
      expect(distanceAndAzimuth(site, { lat, lon }).km).toBeCloseTo(180, 6);
  });
});
