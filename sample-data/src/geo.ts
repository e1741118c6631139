import proj4 from 'proj4';

/** proj4 string of the radar-centred azimuthal equidistant projection (metres). */
export function aeqdProj4(lat0: number, lon0: number): string {
  return `+proj=aeqd +lat_0=${lat0} +lon_0=${lon0} +datum=WGS84 +units=m +no_defs`;
}

/** Radar-centred azimuthal equidistant coordinates in km (x east, y north). */
export class RadarProjection {
  readonly proj4: string;
  private readonly conv: proj4.Converter;

  constructor(
    readonly lat0: number,
    readonly lon0: number,
  ) {
    this.proj4 = aeqdProj4(lat0, lon0);
    this.conv = proj4('EPSG:4326', this.proj4);
  }

  /** lon/lat (degrees) → x, y (km). */
  toXY(lon: number, lat: number): [number, number] {
    const [x, y] = this.conv.forward([lon, lat]);
    return [x / 1000, y / 1000];
  }

  /** x, y (km) → lon/lat (degrees). */
  toLonLat(xKm: number, yKm: number): [number, number] {
    const [lon, lat] = this.conv.inverse([xKm * 1000, yKm * 1000]);
    return [lon, lat];
  }
}

const R_EARTH_KM = 6371.0088;

/** Local equirectangular km offsets around a centre (used for the analytic terrain and the province shape). */
export function localKm(lon: number, lat: number, lon0: number, lat0: number): [number, number] {
  const kx = (Math.PI / 180) * R_EARTH_KM * Math.cos((lat0 * Math.PI) / 180);
  const ky = (Math.PI / 180) * R_EARTH_KM;
  return [(lon - lon0) * kx, (lat - lat0) * ky];
}

export function fromLocalKm(x: number, y: number, lon0: number, lat0: number): [number, number] {
  const kx = (Math.PI / 180) * R_EARTH_KM * Math.cos((lat0 * Math.PI) / 180);
  const ky = (Math.PI / 180) * R_EARTH_KM;
  return [lon0 + x / kx, lat0 + y / ky];
}

/** Area of a lon/lat ring on the sphere (km², positive for counter-clockwise rings). */
export function ringAreaKm2(ring: readonly (readonly number[])[]): number {
  // Spherical excess by the line-integral formula used by d3-geo/turf (Chamberlain & Duquette 2007).
  let sum = 0;
  const n = ring.length;
  for (let i = 0; i < n - 1; i++) {
    const [l1, p1] = ring[i];
    const [l2, p2] = ring[i + 1];
    sum +=
      (((l2 - l1) * Math.PI) / 180) * (2 + Math.sin((p1 * Math.PI) / 180) + Math.sin((p2 * Math.PI) / 180));
  }
  return (-sum * R_EARTH_KM * R_EARTH_KM) / 2;
}

export function polygonAreaKm2(poly: readonly (readonly (readonly number[])[])[]): number {
  let a = 0;
  poly.forEach((ring, i) => {
    const r = Math.abs(ringAreaKm2(ring));
    a += i === 0 ? r : -r;
  });
  return a;
}

/** Round to a fixed number of decimals (half away from zero), returning a number. */
export function roundTo(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return (Math.sign(value) * Math.round(Math.abs(value) * f)) / f;
}

export function fmt(value: number, decimals: number): string {
  const r = roundTo(value, decimals);
  return (Object.is(r, -0) ? 0 : r).toFixed(decimals);
}
