import { cellKernel } from './cell-kernel.js';
import { equivalentEllipse } from './ellipse.js';
import { layerThicknessesM, type PlacedGrid } from './grid.js';
import { labelGrid, type Runs } from './label.js';
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

const runningSumsCache = new WeakMap<Float64Array, Float64Array>();

/**
 * Per row y, the sums of the first x column areas at y·(nx + 1) + x. The same grid serves every scan of
 * a site, so the sums are kept beside its area array.
 */
function rowRunningSums(areaKm2: Float64Array, nx: number, ny: number): Float64Array {
  const cached = runningSumsCache.get(areaKm2);
  if (cached && cached.length === ny * (nx + 1)) return cached;
  const sums = new Float64Array(ny * (nx + 1));
  for (let y = 0; y < ny; y++) {
    let sum = 0;
    for (let x = 0; x < nx; x++) {
      sums[y * (nx + 1) + x] = sum;
      sum += areaKm2[y * nx + x];
    }
    sums[y * (nx + 1) + nx] = sum;
  }
  runningSumsCache.set(areaKm2, sums);
  return sums;
}

/** The per-run sums of identifyCells in plain JS (the WebAssembly kernel's reference). */
function runSums(grid: PlacedGrid, runs: Runs, kept: Uint8Array, thicknessKm: number[], coreDbz: number) {
  const { nx, ny, data, areaKm2, xKm, yKm } = grid;
  const plane = nx * ny;
  const is3d = grid.nz > 1;
  const components = kept.length;
  const rz = runs.z;
  const ry = runs.y;
  const rx0 = runs.x0;
  const rx1 = runs.x1;
  const rl = runs.label;
  const volume = new Float64Array(components);
  const core = new Float64Array(components);
  const wz = new Float64Array(components);
  const wx = new Float64Array(components);
  const wy = new Float64Array(components);
  const maxDbz = new Float64Array(components).fill(-Infinity);
  const maxZ = new Int32Array(components);
  const topZ = new Int32Array(components);
  for (let run = 0; run < runs.count; run++) {
    const c = rl[run];
    if (kept[c] === 0) continue;
    const z = rz[run];
    const rowBase = ry[run] * nx;
    if (z > topZ[c]) topZ[c] = z;
    const thickness = thicknessKm[z];
    const base = z * plane;
    let vol = volume[c];
    let cor = core[c];
    let sw = wz[c];
    let sx = wx[c];
    let sy = wy[c];
    let mx = maxDbz[c];
    for (let x = rx0[run]; x < rx1[run]; x++) {
      const col = rowBase + x;
      const v = data[base + col];
      const cellVolume = areaKm2[col] * thickness;
      vol += cellVolume;
      if (v >= coreDbz) cor += cellVolume;
      if (v > mx) {
        mx = v;
        maxZ[c] = z;
      }
      const w = dbzToZ(v) * (is3d ? cellVolume : areaKm2[col]);
      sw += w;
      sx += w * xKm[col];
      sy += w * yKm[col];
    }
    volume[c] = vol;
    core[c] = cor;
    wz[c] = sw;
    wx[c] = sx;
    wy[c] = sy;
    maxDbz[c] = mx;
  }

  return { volume, core, wz, wx, wy, maxDbz, maxZ, topZ };
}

/**
 * Footprints of the kept cells: each cell's runs marked on a scratch map of its bounding box, then read
 * back row by row, which gives the columns already in ascending order (no sort, no plane-sized stamp).
 * Runs are grouped by cell with a stable counting sort first. A function of its own so that the engine
 * optimises its loops early.
 */
function footprintsOf(runs: Runs, kept: Uint8Array, nx: number, ny: number, areaKm2: Float64Array) {
  const components = kept.length;
  const { y: ry, x0: rx0, x1: rx1, label: rl } = runs;
  const firstRun = new Int32Array(components + 1);
  for (let i = 0; i < runs.count; i++) if (kept[rl[i]]) firstRun[rl[i] + 1]++;
  for (let c = 0; c < components; c++) firstRun[c + 1] += firstRun[c];
  const order = new Int32Array(firstRun[components]);
  const fill = firstRun.slice(0, components);
  for (let i = 0; i < runs.count; i++) if (kept[rl[i]]) order[fill[rl[i]]++] = i;
  const footprints: Int32Array[] = [];
  const areas: number[] = [];
  let marks = new Uint8Array(4096);
  for (let c = 0; c < components; c++) {
    if (kept[c] === 0) continue;
    let yLo = ny;
    let yHi = -1;
    let xLo = nx;
    let xHi = -1;
    for (let r = firstRun[c]; r < firstRun[c + 1]; r++) {
      const run = order[r];
      if (ry[run] < yLo) yLo = ry[run];
      if (ry[run] > yHi) yHi = ry[run];
      if (rx0[run] < xLo) xLo = rx0[run];
      if (rx1[run] > xHi) xHi = rx1[run];
    }
    const width = xHi - xLo;
    const boxSize = (yHi - yLo + 1) * width;
    if (boxSize > marks.length) marks = new Uint8Array(boxSize);
    else marks.fill(0, 0, boxSize);
    for (let r = firstRun[c]; r < firstRun[c + 1]; r++) {
      const run = order[r];
      const at = (ry[run] - yLo) * width - xLo;
      marks.fill(1, at + rx0[run], at + rx1[run]);
    }
    let n = 0;
    for (let i = 0; i < boxSize; i++) n += marks[i];
    const columns = new Int32Array(n);
    let area = 0;
    for (let y = yLo, i = 0, k = 0; y <= yHi; y++)
      for (let x = xLo; x < xHi; x++, i++)
        if (marks[i] === 1) {
          const col = y * nx + x;
          columns[k++] = col;
          area += areaKm2[col];
        }
    areas.push(area);
    footprints.push(columns);
  }

  return { footprints, areas };
}

/** Rain rate at the lowest level of each listed column (NaN where there is no echo). */
function rainAt(data: Float32Array, columns: Int32Array, nodata: number | undefined, zr: ZR): Float64Array {
  const rain = new Float64Array(columns.length).fill(Number.NaN);
  for (let k = 0; k < columns.length; k++) {
    const lowest = data[columns[k]];
    if (Number.isFinite(lowest) && lowest !== nodata) rain[k] = rainRate(lowest, zr);
  }
  return rain;
}

/**
 * Rain, echo top and VIL over one cell's footprint columns, and the columns' positions for the ellipse
 * (`topLevel` null for 2-D input).
 */
function footprintStats(
  columns: Int32Array,
  colIndex: Int32Array,
  rain: Float64Array,
  topLevel: Int32Array | null,
  vil: Float64Array,
  grid: PlacedGrid,
) {
  const { xKm, yKm, areaKm2 } = grid;
  const n = columns.length;
  let rainMax = 0;
  let flux = 0;
  let echoTopLevel = -1;
  let vilMax = 0;
  let vilMass = 0;
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const col = columns[i];
    const k = colIndex[col];
    xs[i] = xKm[col];
    ys[i] = yKm[col];
    const r = rain[k];
    if (!Number.isNaN(r)) {
      if (r > rainMax) rainMax = r;
      flux += (r / 3.6e6) * areaKm2[col] * 1e6;
    }
  }
  if (topLevel) {
    for (let i = 0; i < n; i++) {
      const k = colIndex[columns[i]];
      if (topLevel[k] > echoTopLevel) echoTopLevel = topLevel[k];
      if (vil[k] > vilMax) vilMax = vil[k];
      vilMass += vil[k] * areaKm2[columns[i]] * 1e6;
    }
  }
  return { rainMax, flux, echoTopLevel, vilMax, vilMass, xs, ys };
}

/** Finds the cells of one scan and describes each (DESIGN §3.1). */
export function identifyCells(
  grid: PlacedGrid,
  s: IdentifySettings = DEFAULT_IDENTIFY,
  options: { useWasm?: boolean } = {},
): IdentifyResult {
  const { nx, ny, nz, data, nodata } = grid;
  const is3d = nz > 1;
  const wanted = options.useWasm === false ? null : cellKernel();
  const labelling = labelGrid(
    data,
    { nx, ny, nz },
    s.thresholdDbz,
    is3d ? s.connectivity3d : s.connectivity2d,
    nodata,
    { useWasm: wanted !== null },
  );
  // The later kernel steps read the floats the kernel labelled; each falls back to JS on a null.
  const kernel = wanted?.holds(data) ? wanted : null;
  const thicknessKm = is3d ? layerThicknessesM(grid.levelHeightsM).map((m) => m / 1000) : [0];
  const heightsKm = grid.levelHeightsM.map((m) => m / 1000);
  const { runs, components } = labelling;

  const plane = nx * ny;
  const areaKm2 = grid.areaKm2;
  const rz = runs.z;
  const ry = runs.y;
  const rx0 = runs.x0;
  const rx1 = runs.x1;
  const rl = runs.label;
  const is3dSize = is3d ? 1 : 0;

  // Size first, from the runs alone: most regions are speckle and are dropped without reading a value.
  // A run's area is a difference of its row's running sums of column areas.
  const rowSums = rowRunningSums(areaKm2, nx, ny);
  let size = kernel?.runSizes(data, rowSums, thicknessKm, is3d);
  if (!size) {
    size = new Float64Array(components);
    for (let i = 0; i < runs.count; i++) {
      const rowBase = ry[i] * (nx + 1);
      const thickness = is3dSize ? thicknessKm[rz[i]] : 1;
      size[rl[i]] += (rowSums[rowBase + rx1[i]] - rowSums[rowBase + rx0[i]]) * thickness;
    }
  }
  // 2-D runs never share a column, so their summed area is the footprint.
  const minSize = is3d ? s.minVolumeKm3 : s.minAreaKm2;
  const kept = new Uint8Array(components);
  let rejectedTooSmall = 0;
  for (let c = 0; c < components; c++) {
    if (size[c] < minSize) rejectedTooSmall++;
    else kept[c] = 1;
  }

  // Sums over each kept cell's voxels in one pass over the runs in scan order, i.e. along memory.
  // Each cell still sees its own voxels in scan order, so every sum is the same as cell by cell.
  const xKm = grid.xKm;
  const yKm = grid.yKm;
  const { volume, core, wz, wx, wy, maxDbz, maxZ, topZ } =
    kernel?.runSums(data, nx, kept, thicknessKm, areaKm2, xKm, yKm, is3d, s.coreDbz) ??
    runSums(grid, runs, kept, thicknessKm, s.coreDbz);

  const { footprints, areas } = footprintsOf(runs, kept, nx, ny, areaKm2);

  // Column quantities (echo top, VIL, rain at the lowest level) depend on the column alone: work
  // them out once for every column under a kept cell, level by level so reads run along rows.
  const colIndex = new Int32Array(plane).fill(-1);
  let nCols = 0;
  for (const f of footprints)
    for (let i = 0; i < f.length; i++)
      if (colIndex[f[i]] < 0) {
        colIndex[f[i]] = 0;
        nCols++;
      }
  const allColumns = new Int32Array(nCols);
  for (let col = 0, k = 0; col < plane; col++)
    if (colIndex[col] === 0) {
      colIndex[col] = k;
      allColumns[k++] = col;
    }
  let topLevel = new Int32Array(nCols).fill(-1);
  let vil = new Float64Array(nCols);
  const rain = rainAt(data, allColumns, nodata, s.zr);
  const fromKernel = is3d
    ? kernel?.columnQuantities(
        data,
        plane,
        nz,
        allColumns,
        grid.levelHeightsM,
        s.echoTopDbz,
        s.vilCapDbz,
        nodata,
      )
    : null;
  if (fromKernel) ({ topLevel, vil } = fromKernel);
  else if (is3d) {
    const below = new Float64Array(nCols);
    const echoTopDbz = s.echoTopDbz;
    const vilCapDbz = s.vilCapDbz;
    for (let z = 0; z < nz; z++) {
      const base = z * plane;
      const dh = z > 0 ? grid.levelHeightsM[z] - grid.levelHeightsM[z - 1] : 0;
      for (let k = 0; k < nCols; k++) {
        const raw = data[base + allColumns[k]];
        const v = raw === nodata ? Number.NaN : raw;
        if (v >= echoTopDbz) topLevel[k] = z;
        if (z > 0) vil[k] += vilLayer(below[k], v, dh, vilCapDbz);
        below[k] = v;
      }
    }
  }

  const cells: IdentifiedCell[] = [];
  for (let c = 0, f = 0; c < components; c++) {
    if (kept[c] === 0) continue;
    const columns = footprints[f];
    const area = areas[f++];
    const { rainMax, flux, echoTopLevel, vilMax, vilMass, xs, ys } = footprintStats(
      columns,
      colIndex,
      rain,
      is3d ? topLevel : null,
      vil,
      grid,
    );
    const ellipse = equivalentEllipse(xs, ys);
    const cx = wx[c] / wz[c];
    const cy = wy[c] / wz[c];
    const [lon, lat] = grid.toLonLat(cx, cy);
    const top35Km = is3d ? heightsKm[topZ[c]] : null;
    const echoTopKm = is3d ? heightsKm[Math.max(echoTopLevel, topZ[c])] : null;
    const typeHeight = s.typeHeight === 'echoTop' ? echoTopKm : top35Km;
    cells.push({
      xKm: cx,
      yKm: cy,
      lon,
      lat,
      areaKm2: area,
      volumeKm3: is3d ? volume[c] : null,
      maxDbz: maxDbz[c],
      maxDbzHeightKm: is3d ? heightsKm[maxZ[c]] : null,
      top35Km,
      echoTopKm,
      coreVolumeKm3: is3d ? core[c] : null,
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
