import { isInSrgbGamut } from '../shared/colour/display-hex.js';
import { labToLch, type Lab } from '../shared/colour/lab.js';
import { inTissueRegion, TISSUE_REGIONS } from '../shared/colour/tissue-regions.js';
import { BCC_STEPS, CHROMA_REACH, COVERING_FRACTION } from './bcc-lattice.js';
import { unwarp, X_MAX } from './warp.js';

/*
 * The fine chips sit on a body-centred cubic (BCC) lattice in the warped space of warp.ts — the
 * lattice that covers 3-D space with the fewest points for a given covering radius (Bambah 1954;
 * Conway & Sloane, "Sphere Packings, Lattices and Groups", ch. 2 — both cited from memory): with
 * cube edge e every point of space is within e·√5/4 ≈ 0.559·e of a lattice point.
 *
 * Coordinates are counted in half-edges, so the lattice is the points whose three integer
 * coordinates are all even or all odd; its 14 nearest neighbours are (±1, ±1, ±1) and (±2, 0, 0)
 * and permutations. The sparse lattice, cube edge 2e, is the dense points whose coordinates are
 * all ≡ 0 (mod 4) or all ≡ 2 (mod 4): a sub-lattice, so the two meet without seams.
 *
 * A dense point is kept when it lies in a tissue region or within the covering radius of one
 * (probed in the 14 neighbour directions), so that colours at a region's edge still find a chip
 * on each side; any other point only when it is also on the sparse lattice. A point outside the
 * sRGB gamut is kept when it lies within its own lattice's covering radius of the gamut (probed the
 * same way), for the same reason at the gamut surface.
 */

/** Settings of the fine lattice (our own; the edge is what sets the tissue regions' coverage). */
export const FINE_LATTICE = {
  /** Dense cube edge in warped units (≈ ΔE00): covering radius 0.559·e. */
  denseEdge: 2.78,
  /** Largest |y|, |z| in warped units: beyond the chroma of any sRGB colour. */
  chromaReach: CHROMA_REACH,
} as const;

interface Site {
  lab: Lab;
  inGamut: boolean;
  inTissue: boolean;
}

const mod = (v: number, m: number) => ((v % m) + m) % m;

function onSparse(i: number, j: number, k: number): boolean {
  const r = mod(i, 4);
  return (r === 0 || r === 2) && mod(j, 4) === r && mod(k, 4) === r;
}

/** The fine-chip positions (CIELAB D65, unrounded), in lattice order. */
export function fineLatticeChips(edge: number = FINE_LATTICE.denseEdge): Lab[] {
  const half = edge / 2;
  const iMax = Math.floor(X_MAX / half);
  const jMax = Math.ceil(FINE_LATTICE.chromaReach / half);
  const sites = new Map<string, Site>();
  const key = (i: number, j: number, k: number) => `${i},${j},${k}`;
  for (let i = 0; i <= iMax; i++) {
    for (let j = -jMax; j <= jMax; j++) {
      for (let k = -jMax; k <= jMax; k++) {
        if (mod(i, 2) !== mod(j, 2) || mod(j, 2) !== mod(k, 2)) continue;
        const lab = unwarp([i * half, j * half, k * half]);
        const lch = labToLch(lab);
        sites.set(key(i, j, k), {
          lab,
          inGamut: isInSrgbGamut(lab),
          inTissue: TISSUE_REGIONS.some((region) => inTissueRegion(lch, region)),
        });
      }
    }
  }
  // A point of space is at most 0.559·e from its nearest lattice point, so a lattice point farther
  // than that from a region (or from the gamut) is never any of its colours' nearest: probing the
  // 14 neighbour directions at that distance decides whether the point is needed at the edge.
  const probe = (i: number, j: number, k: number, scale: number, test: (lab: Lab) => boolean) =>
    BCC_STEPS.some(([di, dj, dk]) => {
      const f = (COVERING_FRACTION * scale * 2) / Math.hypot(di, dj, dk);
      return test(unwarp([(i + f * di) * half, (j + f * dj) * half, (k + f * dk) * half]));
    });
  const inAnyRegion = (lab: Lab) => {
    const lch = labToLch(lab);
    return TISSUE_REGIONS.some((region) => inTissueRegion(lch, region));
  };
  const chips: Lab[] = [];
  for (let i = 0; i <= iMax; i++) {
    for (let j = -jMax; j <= jMax; j++) {
      for (let k = -jMax; k <= jMax; k++) {
        const site = sites.get(key(i, j, k));
        if (!site) continue;
        const near = (scale: number) =>
          BCC_STEPS.map(([di, dj, dk]) => sites.get(key(i + scale * di, j + scale * dj, k + scale * dk))).filter((s) => s !== undefined);
        const dense =
          site.inTissue || (near(1).some((s) => s.inTissue) && probe(i, j, k, 1, inAnyRegion));
        if (!dense && !onSparse(i, j, k)) continue;
        const scale = dense ? 1 : 2;
        if (site.inGamut || (near(scale).some((s) => s.inGamut) && probe(i, j, k, scale, isInSrgbGamut))) chips.push(site.lab);
      }
    }
  }
  return chips;
}
