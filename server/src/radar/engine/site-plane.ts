import geodesic from 'geographiclib-geodesic';
import proj4 from 'proj4';

const WGS84 = geodesic.Geodesic.WGS84;

export interface SitePosition {
  lat: number;
  lon: number;
}

/**
 * The radar's own plane: azimuthal equidistant centred on the radar (distances and bearings from the
 * radar are true), x east and y north in km. Everything the engine measures lives here.
 */
export interface SitePlane {
  toKm(lon: number, lat: number): [number, number];
  toLonLat(xKm: number, yKm: number): [number, number];
  /** The proj4 definition, for readers whose files use the same projection. */
  definition: string;
}

export function radarCentredDefinition(site: SitePosition): string {
  return `+proj=aeqd +lat_0=${site.lat} +lon_0=${site.lon} +datum=WGS84 +units=m +no_defs`;
}

export function sitePlane(site: SitePosition): SitePlane {
  const definition = radarCentredDefinition(site);
  const converter = proj4('EPSG:4326', definition);
  return {
    definition,
    toKm(lon, lat) {
      const [x, y] = converter.forward([lon, lat]);
      return [x / 1000, y / 1000];
    },
    toLonLat(xKm, yKm) {
      const [lon, lat] = converter.inverse([xKm * 1000, yKm * 1000]);
      return [lon, lat];
    },
  };
}

/** Geodesic distance (km) and initial azimuth (degrees clockwise from north) on WGS84 (Karney 2013). */
export function distanceAndAzimuth(from: SitePosition, to: SitePosition): { km: number; azimuthDeg: number } {
  const r = WGS84.Inverse(from.lat, from.lon, to.lat, to.lon);
  return { km: (r.s12 ?? 0) / 1000, azimuthDeg: (((r.azi1 ?? 0) % 360) + 360) % 360 };
}

/** The point at a distance and azimuth from a start, on WGS84. */
export function destination(from: SitePosition, azimuthDeg: number, km: number): SitePosition {
  const r = WGS84.Direct(from.lat, from.lon, azimuthDeg, km * 1000);
  return { lat: r.lat2 ?? Number.NaN, lon: r.lon2 ?? Number.NaN };
}
