import { describe, expect, it } from 'vitest';
import type { PlacedGrid } from './grid.js';
import { layerThicknessesM } from './grid.js';
import { cellType, DEFAULT_IDENTIFY, identifyCells } from './identify.js';

/** A 1 km grid on the site plane with the radar at the origin. */
function plainGrid(nx: number, ny: number, levelHeightsM: number[]): PlacedGrid {
  const nz = Math.max(levelHeightsM.length, 1);
  const xKm = new Float64Array(nx * ny);
  const yKm = new Float64Array(nx * ny);
  for (let y = 0; y < ny; y++)
    for (let x = 0; x < nx; x++) {
      xKm[y * nx + x] = x;
      yKm[y * nx + x] = y;
    }
  return {
    nx,
    ny,
    nz,
    data: new Float32Array(nx * ny * nz).fill(Number.NaN),
    levelHeightsM,
    xKm,
    yKm,
    areaKm2: new Float64Array(nx * ny).fill(1),
    toLonLat: (x, y) => [88 + x / 100, 14 + y / 100],
  };
}

function fillBox(g: PlacedGrid, [x0, x1]: number[], [y0, y1]: number[], [z0, z1]: number[], dbz: number) {
  for (let z = z0; z <= z1; z++)
    for (let y = y0; y <= y1; y++) for (let x = x0; x <= x1; x++) g.data[(z * g.ny + y) * g.nx + x] = dbz;
}

// The expected values are worked by hand from the definitions (DESIGN §3.1) and the checked VIL and
// Marshall–Palmer values of REFERENCES §1–2.
describe('identifyCells on a volume', () => {
  const heights = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10].map((km) => km * 1000);
  const g = plainGrid(20, 12, heights);
  // Cell: 5 × 4 columns, levels 2–6 km at 45 dBZ, with a 10 dBZ echo at 8 km above it.
  fillBox(g, [2, 6], [3, 6], [1, 5], 45);
  fillBox(g, [2, 6], [3, 6], [7, 7], 10);
  // Too small: 2 × 2 columns, 2 levels = 8 km³ < 15 km³.
  fillBox(g, [14, 15], [2, 3], [1, 2], 50);
  const { cells, rejectedTooSmall } = identifyCells(g);

  it('keeps the cell over the minimum volume and rejects the small one', () => {
    expect(cells).toHaveLength(1);
    expect(rejectedTooSmall).toBe(1);
  });

  it('measures area, volume, tops, core and maximum', () => {
    const [c] = cells;
    expect(c.areaKm2).toBe(20);
    expect(c.volumeKm3).toBeCloseTo(100, 9);
    expect(c.coreVolumeKm3).toBeCloseTo(100, 9);
    expect(c.top35Km).toBe(6);
    expect(c.echoTopKm).toBe(8);
    expect(c.maxDbz).toBe(45);
    expect(c.type).toBe('congestus');
  });

  it('takes VIL per column: four 1 km layers at 45 dBZ give 4 × 1.28229 kg/m²', () => {
    const [c] = cells;
    expect(c.vilMaxKgM2).toBeCloseTo(4 * 1.28229, 4);
    expect((c.vilMassKg as number) / (4 * 1.28229 * 20e6)).toBeCloseTo(1, 5);
  });

  it('places the centroid at the box centre and fits the footprint ellipse', () => {
    const [c] = cells;
    expect(c.xKm).toBeCloseTo(4, 9);
    expect(c.yKm).toBeCloseTo(4.5, 9);
    expect(c.lon).toBeCloseTo(88.04, 9);
    // Footprint x in 2..6 (variance 2), y in 3..6 (variance 1.25): semi-axes 2√2 and 2√1.25, major east–west.
    expect(c.semiMajorKm).toBeCloseTo(2 * Math.SQRT2, 9);
    expect(c.semiMinorKm).toBeCloseTo(2 * Math.sqrt(1.25), 9);
    expect(c.orientationDeg).toBeCloseTo(90, 9);
  });
});

describe('identifyCells on a 2-D field', () => {
  it('uses the minimum area and gives rain rate and flux from Marshall–Palmer', () => {
    const g = plainGrid(10, 10, []);
    fillBox(g, [1, 3], [1, 3], [0, 0], 40);
    fillBox(g, [7, 8], [7, 8], [0, 0], 50);
    const { cells, rejectedTooSmall } = identifyCells(g);
    expect(cells).toHaveLength(1);
    expect(rejectedTooSmall).toBe(1);
    const [c] = cells;
    expect(c.volumeKm3).toBeNull();
    expect(c.echoTopKm).toBeNull();
    // 40 dBZ → 11.5307 mm/h (REFERENCES §1); over 9 km²: 11.5307 / 3.6e6 m/s × 9e6 m².
    expect(c.rainRateMaxMmH).toBeCloseTo(11.5307, 3);
    expect(c.precipFluxM3s).toBeCloseTo((11.5307 / 3.6e6) * 9e6, 3);
  });
});

describe('layer thickness and cell type', () => {
  it('splits the column half-way between level centres', () => {
    expect(layerThicknessesM([500, 1000, 2000, 4000])).toEqual([500, 750, 1500, 2000]);
    expect(() => layerThicknessesM([1000, 900])).toThrow(/must increase/);
  });

  it.each([
    // Project default edges 4 and 9 km (common practice in radar climatologies), and the published set
    // of Kumar et al. 2013 (congestus 3–6.5 km) to show the edges are settings.
    [3.9, [4, 9], 'shallow'],
    [4, [4, 9], 'congestus'],
    [9, [4, 9], 'deep'],
    [3.5, [3, 6.5], 'congestus'],
    [7, [3, 6.5], 'deep'],
  ] as [number, [number, number], string][])('%d km with edges %j is %s', (h, edges, type) => {
    expect(cellType(h, edges)).toBe(type);
  });

  it('keeps the defaults of the design', () => {
    expect(DEFAULT_IDENTIFY).toMatchObject({
      thresholdDbz: 35,
      minVolumeKm3: 15,
      minAreaKm2: 5,
      connectivity3d: 26,
    });
  });
});
