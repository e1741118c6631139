import { describe, expect, it } from 'vitest';
import { pythonWithScipy, runPython } from '../../testing/scipy.js';
import {
  domainMean,
  flowClass,
  moistureClass,
  mostFrequentRegime,
  quantile,
  terciles,
  windFrom,
} from './regime-math.js';

describe('windFrom', () => {
  it.each([
    // NCAR NCL wind_direction documentation, example 1 (published; REFERENCES §11).
    [10, 0, 270],
    [0, 10, 180],
    [0, -10, 0],
    [-10, 0, 90],
    [10, 10, 225],
    [10, -10, 315],
    [-10, 10, 135],
    [-10, -10, 45],
  ])('u = %d, v = %d blows from %d°', (u, v, deg) => {
    const w = windFrom(u, v);
    expect(w.fromDeg).toBeCloseTo(deg, 10);
    expect(w.speed).toBeCloseTo(Math.hypot(u, v), 12);
  });

  it('gives calm a direction of 0 and speed 0 (NCL convention)', () => {
    expect(windFrom(0, 0)).toEqual({ speed: 0, fromDeg: 0 });
  });
});

describe('quantile and terciles', () => {
  it.each([
    // Hyndman & Fan (1996) type 7 by hand: h = (n − 1)p.
    [[1, 2, 3, 4], 0.5, 2.5],
    [[1, 2, 3, 4], 1 / 3, 2],
    [[10, 20, 30], 0.25, 15],
    [[5], 0.9, 5],
  ])('type-7 quantile of %j at %d is %d', (xs, p, q) => {
    expect(quantile(xs, p)).toBeCloseTo(q, 12);
  });

  const python = pythonWithScipy();
  it.skipIf(!python)('agrees with numpy.quantile (default linear method) on a sample', () => {
    const xs = Array.from({ length: 101 }, (_, i) => Math.sin(i * 1.7) * 3 + i / 50);
    const [lo, hi] = runPython<number[]>(
      python as string,
      'import json,sys\nimport numpy as np\nx=json.load(sys.stdin)\nprint(json.dumps([float(np.quantile(x,1/3)),float(np.quantile(x,2/3))]))',
      xs,
    );
    const ours = terciles(xs);
    expect(ours[0]).toBeCloseTo(lo, 12);
    expect(ours[1]).toBeCloseTo(hi, 12);
  });
});

describe('classes', () => {
  const sectors = [
    { name: 'onshore', fromDeg: 100, toDeg: 190 },
    { name: 'offshore', fromDeg: 280, toDeg: 10 },
  ];
  it.each([
    [3, 150, 'onshore'],
    [3, 350, 'offshore'],
    [3, 5, 'offshore'],
    [3, 10, null],
    [0.5, 150, 'weak'],
  ])('speed %d from %d° is %s', (speed, deg, cls) => {
    expect(flowClass(speed, deg, sectors, 1)).toBe(cls);
  });

  it.each([
    [-1, 'dry'],
    [0, 'near-normal'],
    [0.6, 'moist'],
  ])('q′ = %d g/kg is %s with bounds ±0.5', (q, cls) => {
    expect(moistureClass(q, [-0.5, 0.5])).toBe(cls);
  });
});

describe('domainMean', () => {
  it('weights cells by cos(latitude) and leaves missing cells out of the mean', () => {
    // Two rows at 60° N and 0°: cos 60° = 0.5 and cos 0° = 1, so the mean of 2 and 8 is (1 + 8)/1.5 = 6.
    const g = { nx: 1, ny: 2, lon0: 0, lat0: 60, dLon: 1, dLat: 60 };
    expect(domainMean([2, 8], g, Uint8Array.from([1, 1]))).toEqual({ mean: 6, share: 1 });
    const partial = domainMean([Number.NaN, 8], g, Uint8Array.from([1, 1]));
    expect(partial.mean).toBe(8);
    expect(partial.share).toBeCloseTo(1 / 1.5, 12);
    expect(domainMean([2, 8], g, Uint8Array.from([0, 1])).mean).toBe(8);
  });
});

describe('domainMean against the sphere', () => {
  it('averages sin(latitude) over a latitude band to the analytic spherical mean within 0.5 %', () => {
    // On a sphere the area element is cos φ dφ dλ, so the mean of sin φ over φ1…φ2 is
    // ∫ sin φ cos φ dφ / ∫ cos φ dφ = (sin φ1 + sin φ2) / 2 (analytic).
    const [south, north] = [10, 40];
    const step = 0.25;
    const g = { nx: 8, ny: (north - south) / step, lon0: 80, lat0: north - step / 2, dLon: step, dLat: step };
    const values = new Float64Array(g.nx * g.ny);
    for (let j = 0; j < g.ny; j++)
      for (let i = 0; i < g.nx; i++) values[j * g.nx + i] = Math.sin(((g.lat0 - j * step) * Math.PI) / 180);
    const exact = (Math.sin((south * Math.PI) / 180) + Math.sin((north * Math.PI) / 180)) / 2;
    const { mean } = domainMean(values, g, new Uint8Array(g.nx * g.ny).fill(1));
    expect(Math.abs((mean as number) - exact) / exact).toBeLessThan(0.005);
    // Without the weighting the plain mean is off by more than that: the check can fail.
    const plain = values.reduce((a, b) => a + b, 0) / values.length;
    expect(Math.abs(plain - exact) / exact).toBeGreaterThan(0.005);
  });
});

describe('mostFrequentRegime', () => {
  it('takes the regime of most days, a tie going to the earliest day’s, and ignores unknown days', () => {
    const r = (...names: (string | null)[]) => names.map((regime) => ({ regime }));
    expect(mostFrequentRegime(r('moist / onshore', 'dry / weak', 'dry / weak'))).toBe('dry / weak');
    expect(mostFrequentRegime(r('dry / weak', 'moist / onshore', 'moist / onshore', 'dry / weak'))).toBe(
      'dry / weak',
    );
    expect(mostFrequentRegime(r(null, 'moist / onshore', null))).toBe('moist / onshore');
    expect(mostFrequentRegime(r(null))).toBeNull();
  });
});
