import { covarianceOf, ellipseCoverage, ellipseOf, ellipseOutline, spreadEllipse } from './spread-ellipse';

// Worked by hand: a symmetric 2×2 matrix [[p, q], [q, p]] has eigenvalues p ± q with eigenvectors
// along the diagonals (±45°); a diagonal matrix's eigenvalues are its diagonal.
describe('spread ellipse', () => {
  it('should give the axes of a diagonal covariance along a* and b*', () => {
    const e = ellipseOf([10, -5], { aa: 4, bb: 1, ab: 0 }, 2);
    expect(e.major).toBeCloseTo(4, 12); // 2·√4
    expect(e.minor).toBeCloseTo(2, 12); // 2·√1
    expect(e.angle).toBeCloseTo(0, 12);
    expect(e.centre).toEqual([10, -5]);
  });

  it('should put the major axis along b* when b* varies more', () => {
    const e = ellipseOf([0, 0], { aa: 1, bb: 9, ab: 0 }, 1);
    expect(e.major).toBeCloseTo(3, 12);
    expect(e.minor).toBeCloseTo(1, 12);
    expect(Math.abs(e.angle)).toBeCloseTo(Math.PI / 2, 12);
  });

  it('should turn a correlated covariance 45° with axes from its eigenvalues p ± q', () => {
    // [[2.5, 1.5], [1.5, 2.5]] → λ = 4 and 1.
    const e = ellipseOf([0, 0], { aa: 2.5, bb: 2.5, ab: 1.5 }, 2);
    expect(e.major).toBeCloseTo(4, 12);
    expect(e.minor).toBeCloseTo(2, 12);
    expect(e.angle).toBeCloseTo(Math.PI / 4, 12);
    const negative = ellipseOf([0, 0], { aa: 2.5, bb: 2.5, ab: -1.5 }, 2);
    expect(negative.angle).toBeCloseTo(-Math.PI / 4, 12);
  });

  it('should compute the sample covariance with the n − 1 denominator', () => {
    // Points (±2, 0), (0, ±1): mean 0; Σa² = 8, Σb² = 2, Σab = 0; over n − 1 = 3.
    const stats = covarianceOf([[2, 0], [-2, 0], [0, 1], [0, -1]])!;
    expect(stats.mean).toEqual([0, 0]);
    expect(stats.cov.aa).toBeCloseTo(8 / 3, 12);
    expect(stats.cov.bb).toBeCloseTo(2 / 3, 12);
    expect(stats.cov.ab).toBeCloseTo(0, 12);
  });

  it('should draw no ellipse for fewer than three points', () => {
    expect(spreadEllipse([[1, 2], [3, 4]])).toBeNull();
    expect(spreadEllipse([])).toBeNull();
    expect(covarianceOf([[1, 2]])).toBeNull();
  });

  it('should flatten to a line for points on a line, never NaN', () => {
    const e = spreadEllipse([[0, 0], [1, 1], [2, 2]])!;
    expect(e.minor).toBeCloseTo(0, 6);
    expect(e.major).toBeGreaterThan(0);
    expect(e.angle).toBeCloseTo(Math.PI / 4, 12);
  });

  it('should outline a closed curve at the axes’ ends', () => {
    const outline = ellipseOutline({ centre: [1, 1], major: 3, minor: 1, angle: 0 }, 4);
    expect(outline).toHaveLength(5);
    expect(outline[0].x).toBeCloseTo(4, 12);
    expect(outline[1].y).toBeCloseTo(2, 12);
    expect(outline[4].x).toBeCloseTo(outline[0].x, 12);
  });

  it('should cover about 86.5 % of a normal spread at 2σ (χ² with 2 degrees of freedom)', () => {
    expect(ellipseCoverage(2)).toBeCloseTo(0.8647, 4);
    expect(ellipseCoverage(1)).toBeCloseTo(0.3935, 4);
  });
});
