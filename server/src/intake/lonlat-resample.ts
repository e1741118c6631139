import proj4 from 'proj4';

/** A raster's placement in its own CRS: the outer corner of the first pixel and the pixel size. */
export interface SourcePlacement {
  nx: number;
  ny: number;
  /** Model coordinates of the upper-left corner of pixel (0, 0). */
  x0: number;
  y0: number;
  /** Model units per pixel along a row and down a column (dy is negative for north-up images). */
  dx: number;
  dy: number;
}

/** A regular longitude–latitude grid: centre of the first column and first (northern) row, spacing. */
export interface LonLatGrid {
  nx: number;
  ny: number;
  lon0: number;
  lat0: number;
  dLon: number;
  dLat: number;
}

/** Metres per degree of latitude and of longitude at a latitude, on a sphere of WGS84's mean radius. */
const METRES_PER_DEGREE = (6_371_008.8 * Math.PI) / 180;

/**
 * The lon–lat grid covering a projected raster's footprint at about its resolution: the bounding box of
 * the pixel centres on the raster's edge, in cells of the pixel size converted to degrees at the
 * raster's centre (rounded to 1e-4°, so the stored grid has a tidy step).
 */
export function lonLatGridFor(src: SourcePlacement, crs: string): LonLatGrid {
  const toLonLat = proj4(crs, 'EPSG:4326');
  let west = Number.POSITIVE_INFINITY;
  let east = Number.NEGATIVE_INFINITY;
  let south = Number.POSITIVE_INFINITY;
  let north = Number.NEGATIVE_INFINITY;
  const visit = (i: number, j: number) => {
    const [lon, lat] = toLonLat.forward([src.x0 + (i + 0.5) * src.dx, src.y0 + (j + 0.5) * src.dy]);
    west = Math.min(west, lon);
    east = Math.max(east, lon);
    south = Math.min(south, lat);
    north = Math.max(north, lat);
  };
  for (let i = 0; i < src.nx; i++) {
    visit(i, 0);
    visit(i, src.ny - 1);
  }
  for (let j = 0; j < src.ny; j++) {
    visit(0, j);
    visit(src.nx - 1, j);
  }
  const [, centreLat] = toLonLat.forward([src.x0 + (src.nx / 2) * src.dx, src.y0 + (src.ny / 2) * src.dy]);
  const round = (deg: number) => Math.max(1e-4, Math.round(deg * 1e4) / 1e4);
  const dLat = round(Math.abs(src.dy) / METRES_PER_DEGREE);
  const dLon = round(Math.abs(src.dx) / (METRES_PER_DEGREE * Math.cos((centreLat * Math.PI) / 180)));
  // Whole cells inside the footprint's box, centred in it.
  const nx = Math.max(1, Math.floor((east - west) / dLon + 1e-9) + 1);
  const ny = Math.max(1, Math.floor((north - south) / dLat + 1e-9) + 1);
  return {
    nx,
    ny,
    lon0: west + (east - west - (nx - 1) * dLon) / 2,
    lat0: north - (north - south - (ny - 1) * dLat) / 2,
    dLon,
    dLat,
  };
}

/**
 * Bilinear weights from a projected raster onto a lon–lat grid: each target cell centre is projected
 * into the raster's CRS with proj4 and falls between four pixel centres. Centres outside the raster's
 * pixel centres get no weights (NaN). Computed once, applied to every band.
 */
export interface BilinearWeights {
  /** For target cell k: the upper-left source pixel index, or −1 when outside. */
  corner: Int32Array;
  /** Fractions along the row (fx) and down the column (fy) from that pixel's centre, 0–1. */
  fx: Float32Array;
  fy: Float32Array;
}

export function bilinearWeights(src: SourcePlacement, crs: string, target: LonLatGrid): BilinearWeights {
  const toSource = proj4('EPSG:4326', crs);
  const n = target.nx * target.ny;
  const corner = new Int32Array(n).fill(-1);
  const fx = new Float32Array(n);
  const fy = new Float32Array(n);
  for (let j = 0; j < target.ny; j++) {
    const lat = target.lat0 - j * target.dLat;
    for (let i = 0; i < target.nx; i++) {
      const [x, y] = toSource.forward([target.lon0 + i * target.dLon, lat]);
      // Fractional pixel position measured from pixel centres.
      const px = (x - src.x0) / src.dx - 0.5;
      const py = (y - src.y0) / src.dy - 0.5;
      if (!(px >= 0 && py >= 0 && px <= src.nx - 1 && py <= src.ny - 1)) continue;
      const ix = Math.min(Math.floor(px), src.nx - 2);
      const iy = Math.min(Math.floor(py), src.ny - 2);
      const k = j * target.nx + i;
      // One-pixel-wide rasters have no neighbour to interpolate towards.
      corner[k] = Math.max(iy, 0) * src.nx + Math.max(ix, 0);
      fx[k] = src.nx > 1 ? px - Math.max(ix, 0) : 0;
      fy[k] = src.ny > 1 ? py - Math.max(iy, 0) : 0;
    }
  }
  return { corner, fx, fy };
}

/**
 * One band resampled: the weighted mean of the four neighbours that have data. A target cell whose
 * neighbours with data carry less than half the weight stays NaN, so nodata areas do not shrink.
 */
export function resampleBand(
  band: Float32Array,
  srcNx: number,
  srcNy: number,
  w: BilinearWeights,
): Float32Array {
  const out = new Float32Array(w.corner.length).fill(Number.NaN);
  const right = srcNx > 1 ? 1 : 0;
  const down = srcNy > 1 ? srcNx : 0;
  for (let k = 0; k < out.length; k++) {
    const c = w.corner[k];
    if (c < 0) continue;
    const fx = w.fx[k];
    const fy = w.fy[k];
    let sum = 0;
    let weight = 0;
    const add = (v: number, wt: number) => {
      if (wt === 0 || Number.isNaN(v)) return;
      sum += wt * v;
      weight += wt;
    };
    add(band[c], (1 - fx) * (1 - fy));
    add(band[c + right], fx * (1 - fy));
    add(band[c + down], (1 - fx) * fy);
    add(band[c + down + right], fx * fy);
    if (weight >= 0.5) out[k] = sum / weight;
  }
  return out;
}
