import { equivalentEllipse } from './ellipse.js';
import { layerThicknessesM, type PlacedGrid } from './grid.js';
import { labelGrid } from './label.js';
import { dbzToZ, rainRate, vilLayer, type ZR } from './reflectivity.js';

export interface IdentifySettings {
  thresholdDbz: number;
  /** 3-D input: keep regions of at least this volume. */
  minVolumeKm3: number;
  /** 2-D input: keep regions of at least this area. */
  minAreaKm2: number;
  connectivity3d: 6 | 18 | 26;
  connectivity2d: 4 | 8;
  echoTopDbz: number;
  coreDbz: number;
  vilCapDbz: number;
  zr: ZR;
  /** Cell-type edges on the chosen height, km: below the first shallow, from the second deep. */
  typeEdgesKm: [number, number];
  typeHeight: 'echoTop' | 'top35';
}

export const DEFAULT_IDENTIFY: IdentifySettings = {
  thresholdDbz: 35,
  minVolumeKm3: 15,
  minAreaKm2: 5,
  connectivity3d: 26,
  connectivity2d: 8,
  echoTopDbz: 0,
  coreDbz: 40,
  vilCapDbz: 56,
  zr: { a: 200, b: 1.6 },
  typeEdgesKm: [4, 9],
  typeHeight: 'echoTop',
};

export type CellType = 'shallow' | 'congestus' | 'deep';

export interface IdentifiedCell {
  /** Reflectivity-weighted centroid (linear Z). */
  xKm: number;
  yKm: number;
  lon: number;
  lat: number;
  areaKm2: number;
  /** Null for 2-D input, which has no volume, tops or VIL. */
  volumeKm3: number | null;
  maxDbz: number;
  maxDbzHeightKm: number | null;
  /** Centre of the highest level holding the cell: the top of its ≥ threshold echo. */
  top35Km: number | null;
  /** Highest level ≥ the echo-top threshold in the cell's columns. */
  echoTopKm: number | null;
  coreVolumeKm3: number | null;
  vilMaxKgM2: number | null;
  /** Σ VIL × column area, kg. */
  vilMassKg: number | null;
  rainRateMaxMmH: number;
  /** Rain reaching the lowest level over the footprint, m³ s⁻¹. */
  precipFluxM3s: number;
  semiMajorKm: number;
  semiMinorKm: number;
  orientationDeg: number;
  type: CellType | null;
  /** Footprint columns (y·nx + x), for overlap and block placement. */
  columns: Int32Array;
}

export interface IdentifyResult {
  cells: IdentifiedCell[];
  /** Regions at or above the threshold that were too small to count. */
  rejectedTooSmall: number;
}

/** Finds the cells of one scan and describes each (DESIGN §3.1). */
export function identifyCells(grid: PlacedGrid, s: IdentifySettings = DEFAULT_IDENTIFY): IdentifyResult {
  const { nx, ny, nz, data, nodata } = grid;
  const is3d = nz > 1;
  const labelling = labelGrid(
    data,
    { nx, ny, nz },
    s.thresholdDbz,
    is3d ? s.connectivity3d : s.connectivity2d,
    nodata,
  );
  const thicknessKm = is3d ? layerThicknessesM(grid.levelHeightsM).map((m) => m / 1000) : [0];
  const heightsKm = grid.levelHeightsM.map((m) => m / 1000);
  const { runs, components } = labelling;

  // Group runs by component (counting sort) so each cell is described in one pass over its runs.
  const firstRun = new Int32Array(components + 1);
  for (let i = 0; i < runs.count; i++) firstRun[runs.label[i] + 1]++;
  for (let c = 0; c < components; c++) firstRun[c + 1] += firstRun[c];
  const order = new Int32Array(runs.count);
  const fill = firstRun.slice(0, components);
  for (let i = 0; i < runs.count; i++) order[fill[runs.label[i]]++] = i;

  const plane = nx * ny;
  const stamp = new Int32Array(plane).fill(-1);
  const cells: IdentifiedCell[] = [];
  let rejectedTooSmall = 0;

  // Size first, from the runs alone: most regions are speckle and are dropped without reading a value.
  const size = new Float64Array(components);
  for (let i = 0; i < runs.count; i++) {
    const rowBase = runs.y[i] * nx;
    const thickness = is3d ? thicknessKm[runs.z[i]] : 1;
    let area = 0;
    for (let x = runs.x0[i]; x < runs.x1[i]; x++) area += grid.areaKm2[rowBase + x];
    size[runs.label[i]] += area * thickness;
  }

  for (let c = 0; c < components; c++) {
    // 2-D runs never share a column, so their summed area is the footprint.
    if (size[c] < (is3d ? s.minVolumeKm3 : s.minAreaKm2)) {
      rejectedTooSmall++;
      continue;
    }
    let volume = 0;
    let core = 0;
    let wz = 0;
    let wx = 0;
    let wy = 0;
    let maxDbz = -Infinity;
    let maxZ = 0;
    let topZ = 0;
    const cols: number[] = [];
    for (let r = firstRun[c]; r < firstRun[c + 1]; r++) {
      const run = order[r];
      const z = runs.z[run];
      const rowBase = runs.y[run] * nx;
      if (z > topZ) topZ = z;
      for (let x = runs.x0[run]; x < runs.x1[run]; x++) {
        const col = rowBase + x;
        const v = data[z * plane + col];
        const cellVolume = grid.areaKm2[col] * thicknessKm[z];
        volume += cellVolume;
        if (v >= s.coreDbz) core += cellVolume;
        if (v > maxDbz) {
          maxDbz = v;
          maxZ = z;
        }
        const w = dbzToZ(v) * (is3d ? cellVolume : grid.areaKm2[col]);
        wz += w;
        wx += w * grid.xKm[col];
        wy += w * grid.yKm[col];
        if (stamp[col] !== c) {
          stamp[col] = c;
          cols.push(col);
        }
      }
    }
    let area = 0;
    for (const col of cols) area += grid.areaKm2[col];

    // Columns in memory order, then one pass per level: the reads run along rows, not down the
    // 40 levels of a column that lie a whole plane apart.
    const columns = Int32Array.from(cols).sort();
    const n = columns.length;
    const topLevel = new Int32Array(n).fill(-1);
    const below = new Float64Array(n);
    const vil = new Float64Array(n);
    let rainMax = 0;
    let flux = 0;
    const xs = new Float64Array(n);
    const ys = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const col = columns[i];
      xs[i] = grid.xKm[col];
      ys[i] = grid.yKm[col];
      const lowest = data[col];
      if (Number.isFinite(lowest) && lowest !== nodata) {
        const r = rainRate(lowest, s.zr);
        if (r > rainMax) rainMax = r;
        flux += (r / 3.6e6) * grid.areaKm2[col] * 1e6;
      }
    }
    if (is3d) {
      for (let z = 0; z < nz; z++) {
        const base = z * plane;
        const dh = z > 0 ? grid.levelHeightsM[z] - grid.levelHeightsM[z - 1] : 0;
        for (let i = 0; i < n; i++) {
          const raw = data[base + columns[i]];
          const v = raw === nodata ? Number.NaN : raw;
          if (v >= s.echoTopDbz) topLevel[i] = z;
          if (z > 0) vil[i] += vilLayer(below[i], v, dh, s.vilCapDbz);
          below[i] = v;
        }
      }
    }
    let echoTopLevel = -1;
    let vilMax = 0;
    let vilMass = 0;
    for (let i = 0; i < n; i++) {
      if (topLevel[i] > echoTopLevel) echoTopLevel = topLevel[i];
      if (vil[i] > vilMax) vilMax = vil[i];
      vilMass += vil[i] * grid.areaKm2[columns[i]] * 1e6;
    }
    const ellipse = equivalentEllipse(xs, ys);
    const cx = wx / wz;
    const cy = wy / wz;
    const [lon, lat] = grid.toLonLat(cx, cy);
    const top35Km = is3d ? heightsKm[topZ] : null;
    const echoTopKm = is3d ? heightsKm[Math.max(echoTopLevel, topZ)] : null;
    const typeHeight = s.typeHeight === 'echoTop' ? echoTopKm : top35Km;
    cells.push({
      xKm: cx,
      yKm: cy,
      lon,
      lat,
      areaKm2: area,
      volumeKm3: is3d ? volume : null,
      maxDbz,
      maxDbzHeightKm: is3d ? heightsKm[maxZ] : null,
      top35Km,
      echoTopKm,
      coreVolumeKm3: is3d ? core : null,
      vilMaxKgM2: is3d ? vilMax : null,
      vilMassKg: is3d ? vilMass : null,
      rainRateMaxMmH: rainMax,
      precipFluxM3s: flux,
      semiMajorKm: ellipse.semiMajor,
      semiMinorKm: ellipse.semiMinor,
      orientationDeg: ellipse.orientationFromNorth,
      type: typeHeight === null ? null : cellType(typeHeight, s.typeEdgesKm),
      columns,
    });
  }
  return { cells, rejectedTooSmall };
}

/** Trimodal classes of tropical convection (Johnson et al. 1999); the edges are settings. */
export function cellType(heightKm: number, [shallowBelow, deepFrom]: [number, number]): CellType {
  if (heightKm < shallowBelow) return 'shallow';
  return heightKm >= deepFrom ? 'deep' : 'congestus';
}
