/**
 * The cell step's hot loops as a WebAssembly kernel (AssemblyScript, built by `npm run build:wasm -w server`
 * into wasm/build/cells.wasm). Every function works on the caller's memory through byte offsets; the
 * TypeScript side (src/radar/engine/cell-kernel.ts) lays the arrays out and keeps the plain-JS path as the
 * fallback and the reference. Arithmetic follows the JS code operation by operation, so results are equal.
 */

// Exact fallbacks outside the tables' range, from the JS side (so both paths use the same functions).
@external('cells', 'pow10Exact')
declare function pow10Exact(y: f64): f64;
@external('cells', 'meanLogOffsetExact')
declare function meanLogOffsetExact(d: f64): f64;

/**
 * Runs of voxels with value ≥ `lowest` (the smallest float32 at or above the threshold, so one float32
 * comparison decides) and, when `useNodata`, ≠ `nodata`, in rows rowFrom ≤ row < rowTo of a volume laid
 * out row by row. Appends (z, y, x0, x1) per run at runsPtr from index `count` and the first run of each
 * row to rowStart; returns the new count. Eight floats at a time: one compare skips a quiet stretch.
 */
export function scanRows(
  dataPtr: usize,
  nx: i32,
  ny: i32,
  rowFrom: i32,
  rowTo: i32,
  lowest: f32,
  useNodata: i32,
  nodata: f32,
  runsPtr: usize,
  count: i32,
  rowStartPtr: usize,
): i32 {
  const lo = f32x4.splat(lowest);
  const nd = f32x4.splat(nodata);
  const chunks = nx & ~7;
  for (let row = rowFrom; row < rowTo; row++) {
    store<i32>(rowStartPtr + (<usize>row << 2), count);
    const z = row / ny;
    const y = row - z * ny;
    const rowPtr = dataPtr + (<usize>row * <usize>nx << 2);
    let inRun = false;
    let start = 0;
    let i = 0;
    for (; i < chunks; i += 8) {
      const a = v128.load(rowPtr + (<usize>i << 2));
      const b = v128.load(rowPtr + (<usize>i << 2), 16);
      let pa = f32x4.ge(a, lo);
      let pb = f32x4.ge(b, lo);
      if (useNodata) {
        pa = v128.and(pa, f32x4.ne(a, nd));
        pb = v128.and(pb, f32x4.ne(b, nd));
      }
      const m = i32x4.bitmask(pa) | (i32x4.bitmask(pb) << 4);
      if (m == (inRun ? 0xff : 0)) continue;
      // Walk the transitions inside the chunk: the next bit that differs from the current state.
      let from = 0;
      while (true) {
        const look = (inRun ? ~m : m) & (0xff << from) & 0xff;
        if (look == 0) break;
        const q = ctz<i32>(look);
        if (inRun) {
          const p = runsPtr + (<usize>count << 4);
          store<i32>(p, z);
          store<i32>(p, y, 4);
          store<i32>(p, start, 8);
          store<i32>(p, i + q, 12);
          count++;
          inRun = false;
        } else {
          start = i + q;
          inRun = true;
        }
        from = q;
      }
    }
    for (; i < nx; i++) {
      const v = load<f32>(rowPtr + (<usize>i << 2));
      const pass = v >= lowest && !(useNodata && v == nodata);
      if (pass != inRun) {
        if (inRun) {
          const p = runsPtr + (<usize>count << 4);
          store<i32>(p, z);
          store<i32>(p, y, 4);
          store<i32>(p, start, 8);
          store<i32>(p, i, 12);
          count++;
        } else start = i;
        inRun = pass;
      }
    }
    if (inRun) {
      const p = runsPtr + (<usize>count << 4);
      store<i32>(p, z);
      store<i32>(p, y, 4);
      store<i32>(p, start, 8);
      store<i32>(p, nx, 12);
      count++;
    }
  }
  return count;
}

@inline
function find(parentPtr: usize, i: i32): i32 {
  let root = i;
  while (load<i32>(parentPtr + (<usize>root << 2)) != root) root = load<i32>(parentPtr + (<usize>root << 2));
  // Path halving keeps later finds short.
  while (load<i32>(parentPtr + (<usize>i << 2)) != root) {
    const next = load<i32>(parentPtr + (<usize>i << 2));
    store<i32>(parentPtr + (<usize>i << 2), root);
    i = next;
  }
  return root;
}

/**
 * Joins runs that touch in the neighbouring rows listed at neighboursPtr as (dz, dy, slack) triples,
 * then numbers components in order of first appearance into labelPtr (rootLabel is scratch of `count`
 * i32). Same union–find as label.ts, so the numbering is identical. Returns the number of components.
 */
export function joinRuns(
  runsPtr: usize,
  count: i32,
  rowStartPtr: usize,
  nz: i32,
  ny: i32,
  neighboursPtr: usize,
  nNeighbours: i32,
  parentPtr: usize,
  labelPtr: usize,
): i32 {
  for (let i = 0; i < count; i++) store<i32>(parentPtr + (<usize>i << 2), i);
  for (let z = 0; z < nz; z++) {
    for (let y = 0; y < ny; y++) {
      const row = z * ny + y;
      const aStart = load<i32>(rowStartPtr + (<usize>row << 2));
      const aEnd = load<i32>(rowStartPtr + (<usize>(row + 1) << 2));
      if (aStart == aEnd) continue;
      for (let k = 0; k < nNeighbours; k++) {
        const nzIdx = z + load<i32>(neighboursPtr + (<usize>k * 12));
        const nyIdx = y + load<i32>(neighboursPtr + (<usize>k * 12), 4);
        const slack = load<i32>(neighboursPtr + (<usize>k * 12), 8);
        if (nzIdx < 0 || nyIdx < 0 || nyIdx >= ny) continue;
        const other = nzIdx * ny + nyIdx;
        let b = load<i32>(rowStartPtr + (<usize>other << 2));
        const bEnd = load<i32>(rowStartPtr + (<usize>(other + 1) << 2));
        let a = aStart;
        while (a < aEnd && b < bEnd) {
          const pa = runsPtr + (<usize>a << 4);
          const pb = runsPtr + (<usize>b << 4);
          const ax0 = load<i32>(pa, 8);
          const ax1 = load<i32>(pa, 12);
          const bx0 = load<i32>(pb, 8);
          const bx1 = load<i32>(pb, 12);
          if (ax0 < bx1 + slack && bx0 < ax1 + slack) {
            const ra = find(parentPtr, a);
            const rb = find(parentPtr, b);
            // The smaller index becomes the root, so labels follow scan order.
            if (ra < rb) store<i32>(parentPtr + (<usize>rb << 2), ra);
            else if (rb < ra) store<i32>(parentPtr + (<usize>ra << 2), rb);
          }
          if (ax1 < bx1) a++;
          else b++;
        }
      }
    }
  }
  // Roots come before their members, so a root's label is set before any member asks for it; the
  // label array doubles as the root → label map.
  let components = 0;
  for (let i = 0; i < count; i++) {
    const root = find(parentPtr, i);
    const label = root == i ? components++ : load<i32>(labelPtr + (<usize>root << 2));
    store<i32>(labelPtr + (<usize>i << 2), label);
  }
  return components;
}

// Tables of fast-math.ts, copied in by the caller at tablesPtr: 10^f (4097), 10^n for n = −30…30 (61),
// g(d) (16385), all f64.
const FRACTION_STEPS: f64 = 4096;
const N_LO: i32 = -30;
const N_HI: i32 = 30;
const G_LIMIT_DB: f64 = 64;
const G_STEPS_PER_DB: f64 = 128;
const G_LENGTH: i32 = 16385;

@inline
function pow10(tablesPtr: usize, y: f64): f64 {
  const nf = Math.floor(y);
  if (!(nf >= <f64>N_LO && nf <= <f64>N_HI)) return pow10Exact(y);
  const n = <i32>nf;
  const t = (y - nf) * FRACTION_STEPS;
  const i = <i32>t;
  const f = t - <f64>i;
  const lo = load<f64>(tablesPtr + (<usize>i << 3));
  const hi = load<f64>(tablesPtr + (<usize>(i + 1) << 3));
  return load<f64>(tablesPtr + (<usize>(4097 + n - N_LO) << 3)) * (lo + f * (hi - lo));
}

@inline
function meanLogOffset(tablesPtr: usize, d: f64): f64 {
  const t = (d + G_LIMIT_DB) * G_STEPS_PER_DB;
  if (!(t >= 0 && t < <f64>(G_LENGTH - 1))) return meanLogOffsetExact(d);
  const i = <i32>t;
  const f = t - <f64>i;
  const g = tablesPtr + ((4097 + 61) << 3);
  const lo = load<f64>(g + (<usize>i << 3));
  return lo + f * (load<f64>(g + (<usize>(i + 1) << 3)) - lo);
}

/** reflectivity.ts vilLayer, operation by operation. */
@inline
function vilLayer(tablesPtr: usize, lo: f64, hi: f64, dhM: f64, capDbz: f64): f64 {
  if (!isFinite(lo) || !isFinite(hi)) return 0;
  const a = Math.min(lo, capDbz);
  const b = Math.min(hi, capDbz);
  return 3.44e-6 * pow10(tablesPtr, (4.0 / 7.0) * (a / 10 + meanLogOffset(tablesPtr, b - a))) * dhM;
}

/**
 * For each listed column: the highest level ≥ echoTopDbz (−1 if none) and VIL summed level by level
 * (identify.ts's column loop). Reads go level by level along the sorted column list.
 */
export function columnQuantities(
  dataPtr: usize,
  plane: i32,
  nz: i32,
  columnsPtr: usize,
  nCols: i32,
  heightsPtr: usize,
  echoTopDbz: f64,
  capDbz: f64,
  useNodata: i32,
  nodata: f64,
  tablesPtr: usize,
  topLevelPtr: usize,
  vilPtr: usize,
  belowPtr: usize,
): void {
  for (let k = 0; k < nCols; k++) {
    store<i32>(topLevelPtr + (<usize>k << 2), -1);
    store<f64>(vilPtr + (<usize>k << 3), 0);
  }
  for (let z = 0; z < nz; z++) {
    const base = dataPtr + (<usize>z * <usize>plane << 2);
    const dh = z > 0 ? load<f64>(heightsPtr + (<usize>z << 3)) - load<f64>(heightsPtr + (<usize>(z - 1) << 3)) : 0;
    for (let k = 0; k < nCols; k++) {
      const raw = <f64>load<f32>(base + (<usize>load<i32>(columnsPtr + (<usize>k << 2)) << 2));
      const v = useNodata && raw == nodata ? NaN : raw;
      if (v >= echoTopDbz) store<i32>(topLevelPtr + (<usize>k << 2), z);
      if (z > 0) {
        const p = vilPtr + (<usize>k << 3);
        store<f64>(p, load<f64>(p) + vilLayer(tablesPtr, load<f64>(belowPtr + (<usize>k << 3)), v, dh, capDbz));
      }
      store<f64>(belowPtr + (<usize>k << 3), v);
    }
  }
}
