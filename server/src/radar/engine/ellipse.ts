/**
 * The equivalent ellipse of a set of points (a cell's footprint) from its second central moments
 * (Hu 1962): semi-axes 2√λ of the covariance eigenvalues, which gives a uniform ellipse the same
 * moments, and the major axis's orientation.
 */
export interface Ellipse {
  cx: number;
  cy: number;
  semiMajor: number;
  semiMinor: number;
  /** Major axis counter-clockwise from +x, degrees in (−90, 90]. */
  angleFromX: number;
  /** Major axis clockwise from north (+y), degrees in [0, 180): how storms are usually described. */
  orientationFromNorth: number;
}

/** x and y in any planar unit with y pointing north; optional weights (default 1). */
export function equivalentEllipse(
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  weights?: ArrayLike<number>,
): Ellipse {
  const n = xs.length;
  let w = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    const wi = weights ? weights[i] : 1;
    w += wi;
    sx += wi * xs[i];
    sy += wi * ys[i];
  }
  const cx = sx / w;
  const cy = sy / w;
  let m20 = 0;
  let m02 = 0;
  let m11 = 0;
  for (let i = 0; i < n; i++) {
    const wi = weights ? weights[i] : 1;
    const dx = xs[i] - cx;
    const dy = ys[i] - cy;
    m20 += wi * dx * dx;
    m02 += wi * dy * dy;
    m11 += wi * dx * dy;
  }
  return fromMoments(cx, cy, m20 / w, m02 / w, m11 / w);
}

/** From normalised central moments (covariance entries). */
export function fromMoments(cx: number, cy: number, c20: number, c02: number, c11: number): Ellipse {
  const mean = (c20 + c02) / 2;
  const spread = Math.sqrt(((c20 - c02) / 2) ** 2 + c11 * c11);
  const l1 = mean + spread;
  const l2 = Math.max(mean - spread, 0);
  const theta = (0.5 * Math.atan2(2 * c11, c20 - c02) * 180) / Math.PI;
  return {
    cx,
    cy,
    semiMajor: 2 * Math.sqrt(l1),
    semiMinor: 2 * Math.sqrt(l2),
    angleFromX: theta === -90 ? 90 : theta,
    orientationFromNorth: (((90 - theta) % 180) + 180) % 180,
  };
}
