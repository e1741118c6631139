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
      // Outside a run, sixteen quiet floats are passed over with one test.
      if (!inRun && i + 16 <= nx) {
        const p = rowPtr + (<usize>i << 2);
        const any = v128.or(
          v128.or(f32x4.ge(v128.load(p), lo), f32x4.ge(v128.load(p, 16), lo)),
          v128.or(f32x4.ge(v128.load(p, 32), lo), f32x4.ge(v128.load(p, 48), lo)),
        );
        if (!v128.any_true(any)) {
          i += 8;
          continue;
        }
      }
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

/** One layer's term for the columns at k (one lane), added into vil[k]: the scalar path. */
@inline
function addLayer(tablesPtr: usize, vilPtr: usize, belowPtr: usize, k: i32, v: f64, dh: f64, capDbz: f64): void {
  const p = vilPtr + (<usize>k << 3);
  store<f64>(p, load<f64>(p) + vilLayer(tablesPtr, load<f64>(belowPtr + (<usize>k << 3)), v, dh, capDbz));
}

/**
 * For each listed column: the highest level ≥ echoTopDbz (−1 if none) and VIL summed level by level
 * (identify.ts's column loop). Reads go level by level along the sorted column list. Two columns at a
 * time in f64x2 lanes with the same operations as the scalar vilLayer (IEEE 754 per lane, so the same
 * results); a pair with a value outside the tables' range takes the scalar path.
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
  const pairs = nCols & ~1;
  const zero = f64x2.splat(0);
  const nanV = f64x2.splat(NaN);
  const nodataV = f64x2.splat(nodata);
  const capV = f64x2.splat(capDbz);
  const gOffset = f64x2.splat(G_LIMIT_DB);
  const gSteps = f64x2.splat(G_STEPS_PER_DB);
  const ten = f64x2.splat(10);
  const fourSevenths = f64x2.splat(4.0 / 7.0);
  const fractionSteps = f64x2.splat(FRACTION_STEPS);
  const scale = f64x2.splat(3.44e-6);
  const gPtr = tablesPtr + ((4097 + 61) << 3);
  const intPtr = tablesPtr + (4097 << 3);
  for (let z = 0; z < nz; z++) {
    const base = dataPtr + (<usize>z * <usize>plane << 2);
    const dh = z > 0 ? load<f64>(heightsPtr + (<usize>z << 3)) - load<f64>(heightsPtr + (<usize>(z - 1) << 3)) : 0;
    const dhV = f64x2.splat(dh);
    let k = 0;
    for (; k < pairs; k += 2) {
      const c = columnsPtr + (<usize>k << 2);
      const raw0 = <f64>load<f32>(base + (<usize>load<i32>(c) << 2));
      const raw1 = <f64>load<f32>(base + (<usize>load<i32>(c, 4) << 2));
      let v = f64x2.replace_lane(f64x2.splat(raw0), 1, raw1);
      if (useNodata) v = v128.bitselect(nanV, v, f64x2.eq(v, nodataV));
      const top = i64x2.bitmask(f64x2.ge(v, f64x2.splat(echoTopDbz)));
      if (top & 1) store<i32>(topLevelPtr + (<usize>k << 2), z);
      if (top & 2) store<i32>(topLevelPtr + (<usize>k << 2), z, 4);
      const bp = belowPtr + (<usize>k << 3);
      if (z > 0) {
        const lo = v128.load(bp);
        const finite = v128.and(f64x2.eq(f64x2.sub(lo, lo), zero), f64x2.eq(f64x2.sub(v, v), zero));
        // Lanes without echo at both ends add 0; give them harmless values meanwhile.
        const a = v128.and(f64x2.min(lo, capV), finite);
        const b = v128.and(f64x2.min(v, capV), finite);
        const d = f64x2.sub(b, a);
        const t = f64x2.mul(f64x2.add(d, gOffset), gSteps);
        const tInRange = v128.and(f64x2.ge(t, zero), f64x2.lt(t, f64x2.splat(<f64>(G_LENGTH - 1))));
        const vp = vilPtr + (<usize>k << 3);
        if (!i64x2.all_true(tInRange)) {
          addLayer(tablesPtr, vilPtr, belowPtr, k, f64x2.extract_lane(v, 0), dh, capDbz);
          addLayer(tablesPtr, vilPtr, belowPtr, k + 1, f64x2.extract_lane(v, 1), dh, capDbz);
        } else {
          const ti = i32x4.trunc_sat_f64x2_s_zero(t);
          const i0 = i32x4.extract_lane(ti, 0);
          const i1 = i32x4.extract_lane(ti, 1);
          const f = f64x2.sub(t, f64x2.convert_low_i32x4_s(ti));
          const g0 = gPtr + (<usize>i0 << 3);
          const g1 = gPtr + (<usize>i1 << 3);
          const gLo = f64x2.replace_lane(f64x2.splat(load<f64>(g0)), 1, load<f64>(g1));
          const gHi = f64x2.replace_lane(f64x2.splat(load<f64>(g0, 8)), 1, load<f64>(g1, 8));
          const mean = f64x2.add(gLo, f64x2.mul(f, f64x2.sub(gHi, gLo)));
          const y = f64x2.mul(fourSevenths, f64x2.add(f64x2.div(a, ten), mean));
          const nf = f64x2.floor(y);
          const nInRange = v128.and(
            f64x2.ge(nf, f64x2.splat(<f64>N_LO)),
            f64x2.le(nf, f64x2.splat(<f64>N_HI)),
          );
          if (!i64x2.all_true(nInRange)) {
            addLayer(tablesPtr, vilPtr, belowPtr, k, f64x2.extract_lane(v, 0), dh, capDbz);
            addLayer(tablesPtr, vilPtr, belowPtr, k + 1, f64x2.extract_lane(v, 1), dh, capDbz);
          } else {
            const ni = i32x4.trunc_sat_f64x2_s_zero(nf);
            const t2 = f64x2.mul(f64x2.sub(y, nf), fractionSteps);
            const ti2 = i32x4.trunc_sat_f64x2_s_zero(t2);
            const f2 = f64x2.sub(t2, f64x2.convert_low_i32x4_s(ti2));
            const p0 = tablesPtr + (<usize>i32x4.extract_lane(ti2, 0) << 3);
            const p1 = tablesPtr + (<usize>i32x4.extract_lane(ti2, 1) << 3);
            const pLo = f64x2.replace_lane(f64x2.splat(load<f64>(p0)), 1, load<f64>(p1));
            const pHi = f64x2.replace_lane(f64x2.splat(load<f64>(p0, 8)), 1, load<f64>(p1, 8));
            const n0 = intPtr + (<usize>(i32x4.extract_lane(ni, 0) - N_LO) << 3);
            const n1 = intPtr + (<usize>(i32x4.extract_lane(ni, 1) - N_LO) << 3);
            const pInt = f64x2.replace_lane(f64x2.splat(load<f64>(n0)), 1, load<f64>(n1));
            const pow = f64x2.mul(pInt, f64x2.add(pLo, f64x2.mul(f2, f64x2.sub(pHi, pLo))));
            const term = v128.and(f64x2.mul(f64x2.mul(scale, pow), dhV), finite);
            v128.store(vp, f64x2.add(v128.load(vp), term));
          }
        }
      }
      v128.store(bp, v);
    }
    for (; k < nCols; k++) {
      const raw = <f64>load<f32>(base + (<usize>load<i32>(columnsPtr + (<usize>k << 2)) << 2));
      const v = useNodata && raw == nodata ? NaN : raw;
      if (v >= echoTopDbz) store<i32>(topLevelPtr + (<usize>k << 2), z);
      if (z > 0) addLayer(tablesPtr, vilPtr, belowPtr, k, v, dh, capDbz);
      store<f64>(belowPtr + (<usize>k << 3), v);
    }
  }
}

/**
 * identify.ts's per-run sums over the voxels of kept cells, run by run in scan order, with the same
 * operations: volume, core volume (≥ coreDbz), Z-weighted sums for the centroid, maximum dBZ and its
 * level, top level. Runs as (z, y, x0, x1) at runsPtr, labels at labelPtr, kept flags (u8) per
 * component; per column f64 area, x and y; f64 thickness per level. Outputs per component: f64 volume,
 * core, wz, wx, wy, maxDbz (pre-set to −∞ by this function) and i32 maxZ, topZ.
 */
export function runSums(
  dataPtr: usize,
  plane: i32,
  nx: i32,
  runsPtr: usize,
  labelPtr: usize,
  count: i32,
  keptPtr: usize,
  components: i32,
  thicknessPtr: usize,
  areaPtr: usize,
  xPtr: usize,
  yPtr: usize,
  is3d: i32,
  coreDbz: f64,
  tablesPtr: usize,
  volumePtr: usize,
  corePtr: usize,
  wzPtr: usize,
  wxPtr: usize,
  wyPtr: usize,
  maxPtr: usize,
  maxZPtr: usize,
  topZPtr: usize,
): void {
  for (let c = 0; c < components; c++) {
    const o = <usize>c << 3;
    store<f64>(volumePtr + o, 0);
    store<f64>(corePtr + o, 0);
    store<f64>(wzPtr + o, 0);
    store<f64>(wxPtr + o, 0);
    store<f64>(wyPtr + o, 0);
    store<f64>(maxPtr + o, -Infinity);
    store<i32>(maxZPtr + (<usize>c << 2), 0);
    store<i32>(topZPtr + (<usize>c << 2), 0);
  }
  for (let run = 0; run < count; run++) {
    const c = load<i32>(labelPtr + (<usize>run << 2));
    if (load<u8>(keptPtr + <usize>c) == 0) continue;
    const r = runsPtr + (<usize>run << 4);
    const z = load<i32>(r);
    const rowBase = load<i32>(r, 4) * nx;
    const x0 = load<i32>(r, 8);
    const x1 = load<i32>(r, 12);
    const ci = <usize>c << 2;
    const co = <usize>c << 3;
    if (z > load<i32>(topZPtr + ci)) store<i32>(topZPtr + ci, z);
    const thickness = load<f64>(thicknessPtr + (<usize>z << 3));
    const base = dataPtr + (<usize>z * <usize>plane << 2);
    let vol = load<f64>(volumePtr + co);
    let cor = load<f64>(corePtr + co);
    let sw = load<f64>(wzPtr + co);
    let sx = load<f64>(wxPtr + co);
    let sy = load<f64>(wyPtr + co);
    let mx = load<f64>(maxPtr + co);
    for (let x = x0; x < x1; x++) {
      const col = <usize>(rowBase + x);
      const v = <f64>load<f32>(base + (col << 2));
      const area = load<f64>(areaPtr + (col << 3));
      const cellVolume = area * thickness;
      vol += cellVolume;
      if (v >= coreDbz) cor += cellVolume;
      if (v > mx) {
        mx = v;
        store<i32>(maxZPtr + ci, z);
      }
      const w = pow10(tablesPtr, v / 10) * (is3d ? cellVolume : area);
      sw += w;
      sx += w * load<f64>(xPtr + (col << 3));
      sy += w * load<f64>(yPtr + (col << 3));
    }
    store<f64>(volumePtr + co, vol);
    store<f64>(corePtr + co, cor);
    store<f64>(wzPtr + co, sw);
    store<f64>(wxPtr + co, sx);
    store<f64>(wyPtr + co, sy);
    store<f64>(maxPtr + co, mx);
  }
}

/**
 * Size of every component from its runs alone (identify.ts's first pass): each run's area is a
 * difference of its row's running sums of column areas (rowSums, ny · (nx + 1) f64), times the level's
 * thickness in a volume. Sizes (f64 per component) in run order, as the JS path adds them.
 */
export function runSizes(
  runsPtr: usize,
  labelPtr: usize,
  count: i32,
  components: i32,
  nx: i32,
  rowSumsPtr: usize,
  thicknessPtr: usize,
  is3d: i32,
  sizePtr: usize,
): void {
  for (let c = 0; c < components; c++) store<f64>(sizePtr + (<usize>c << 3), 0);
  for (let run = 0; run < count; run++) {
    const r = runsPtr + (<usize>run << 4);
    const rowBase = rowSumsPtr + (<usize>(load<i32>(r, 4) * (nx + 1)) << 3);
    const thickness = is3d ? load<f64>(thicknessPtr + (<usize>load<i32>(r) << 3)) : 1;
    const p = sizePtr + (<usize>load<i32>(labelPtr + (<usize>run << 2)) << 3);
    const area = load<f64>(rowBase + (<usize>load<i32>(r, 12) << 3)) - load<f64>(rowBase + (<usize>load<i32>(r, 8) << 3));
    store<f64>(p, load<f64>(p) + area * thickness);
  }
}
