import { converter, type Lab as CuloriLabD50, type Xyz50, type Xyz65 } from 'culori';

import { fromCulori, type Lab } from './lab.js';

const toXyz50 = converter('xyz50');
const toXyz65 = converter('xyz65');
const toLab65 = converter('lab65');

/**
 * CIELAB measured against a D50 white (2° observer) → CIELAB against D65 (2°), by the linear
 * Bradford chromatic adaptation: culori's CIELAB D50 → XYZ D50, its Bradford matrix XYZ D50 → XYZ
 * D65 (culori cites Lindbloom's "Chromatic Adaptation" page and CSS Color 4, whose matrix is
 * M_A⁻¹·diag(ρ_D65/ρ_D50)·M_A with Lam's 1985 Bradford cone matrix M_A), then XYZ D65 → CIELAB D65.
 * Each step is one of culori's direct conversions, never the detour through sRGB.
 */
export function labD50ToD65(lab: Lab): Lab {
  const d50: CuloriLabD50 = { mode: 'lab', l: lab.l, a: lab.a, b: lab.b };
  const xyz50: Xyz50 = toXyz50(d50);
  const xyz65: Xyz65 = toXyz65(xyz50);
  return fromCulori(toLab65(xyz65));
}
