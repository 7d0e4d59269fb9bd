// The spread ellipse drawn around each season group on the a*b* plane, computed here from the
// group's own points (the server sends the points, not their covariance).

/** How many standard deviations the drawn ellipse spans along each principal axis. */
export const ELLIPSE_SIGMAS = 2;

/**
 * The share of a two-dimensional normal distribution inside the k-σ ellipse: 1 − e^(−k²/2)
 * (the squared Mahalanobis distance follows χ² with 2 degrees of freedom). For k = 2, about 0.865.
 */
export function ellipseCoverage(k: number): number {
  return 1 - Math.exp((-k * k) / 2);
}

/** A 2×2 sample covariance of a* and b*. */
export interface Covariance2 {
  aa: number;
  bb: number;
  ab: number;
}

/** An ellipse by its centre, semi-axes (major ≥ minor) and the major axis's angle from +a* in radians. */
export interface Ellipse {
  centre: [number, number];
  major: number;
  minor: number;
  angle: number;
}

/** The mean and the sample covariance (n − 1 denominator) of points; null below 2 points. */
export function covarianceOf(points: readonly (readonly [number, number])[]): { mean: [number, number]; cov: Covariance2 } | null {
  const n = points.length;
  if (n < 2) return null;
  const ma = points.reduce((s, p) => s + p[0], 0) / n;
  const mb = points.reduce((s, p) => s + p[1], 0) / n;
  let aa = 0;
  let bb = 0;
  let ab = 0;
  for (const [a, b] of points) {
    aa += (a - ma) ** 2;
    bb += (b - mb) ** 2;
    ab += (a - ma) * (b - mb);
  }
  return { mean: [ma, mb], cov: { aa: aa / (n - 1), bb: bb / (n - 1), ab: ab / (n - 1) } };
}

/**
 * The k-σ ellipse of a covariance: semi-axes k·√λ of its two eigenvalues
 * λ = (aa+bb)/2 ± √(((aa−bb)/2)² + ab²), major axis at ½·atan2(2ab, aa−bb) (closed form for a
 * symmetric 2×2 matrix).
 */
export function ellipseOf(centre: [number, number], cov: Covariance2, k = ELLIPSE_SIGMAS): Ellipse {
  const half = (cov.aa + cov.bb) / 2;
  const root = Math.hypot((cov.aa - cov.bb) / 2, cov.ab);
  // Rounding can push the smaller eigenvalue a hair below zero for points on a line.
  const big = Math.max(half + root, 0);
  const small = Math.max(half - root, 0);
  const angle = root === 0 ? 0 : Math.atan2(2 * cov.ab, cov.aa - cov.bb) / 2;
  return { centre, major: k * Math.sqrt(big), minor: k * Math.sqrt(small), angle };
}

/** The k-σ spread ellipse of a group's a*b* points, or null when it has fewer than 3 (two points give only a line). */
export function spreadEllipse(points: readonly (readonly [number, number])[], k = ELLIPSE_SIGMAS): Ellipse | null {
  if (points.length < 3) return null;
  const stats = covarianceOf(points);
  return stats ? ellipseOf(stats.mean, stats.cov, k) : null;
}

/** The ellipse's outline as `steps` points plus the first again (closed), for a line chart. */
export function ellipseOutline(e: Ellipse, steps = 72): { x: number; y: number }[] {
  const cos = Math.cos(e.angle);
  const sin = Math.sin(e.angle);
  const out: { x: number; y: number }[] = [];
  for (let i = 0; i <= steps; i++) {
    const t = (2 * Math.PI * i) / steps;
    const u = e.major * Math.cos(t);
    const v = e.minor * Math.sin(t);
    out.push({ x: e.centre[0] + u * cos - v * sin, y: e.centre[1] + u * sin + v * cos });
  }
  return out;
}
