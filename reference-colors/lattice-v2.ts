import { isInSrgbGamut } from '../shared/colour/display-hex.js';
import type { Lab } from '../shared/colour/lab.js';
import { BCC_STEPS, CHROMA_REACH, COVERING_FRACTION } from './bcc-lattice.js';
import { unwarp, X_MAX } from './warp.js';

/*
 * Version 2's fine chips: body-centred cubic (BCC) lattices in the warped space of warp.ts, as in
 * fine-lattice.ts (covering radius e·√5/4 for cube edge e; Bambah 1954, Conway & Sloane ch. 2,
 * cited from memory), but one lattice per density, each kept where it is wanted:
 *
 * - a dense lattice wherever a tissue region is, and up to its covering radius around it;
 * - a coarser one wherever no tissue region is, and up to its covering radius into them.
 *
 * Each lattice alone covers its own part of space with its own covering radius, and its kept
 * points reach one covering radius beyond that part, so their union covers every colour with the
 * radius of the part it lies in: there is no seam to mend, only a few extra chips at the borders.
 * The two edges need not be in a whole ratio, unlike v1's dense and sparse sub-lattice.
 */

interface Site {
  lab: Lab;
  wanted: boolean;
  inGamut: boolean;
}

/**
 * The points of a BCC lattice of cube edge `edge` (warped units) that lie in `wanted` or within the
 * lattice's covering radius of it, and inside the sRGB gamut or within that radius of it.
 * "Within the radius" is probed in the 14 neighbour directions at the radius, and only for points
 * with a neighbour on the other side (a point whose neighbours are all unwanted is farther than
 * the radius from anything wanted, up to the lattice's curvature through the warp). `offset`
 * shifts the lattice, in half-edges, so that two lattices do not share their origin.
 */
export function latticePoints(edge: number, wanted: (lab: Lab) => boolean, offset: readonly [number, number, number] = [0, 0, 0]): Lab[] {
  const half = edge / 2;
  const iMax = Math.floor(X_MAX / half);
  const jMax = Math.ceil(CHROMA_REACH / half);
  const span = 2 * jMax + 1;
  const at = (i: number, j: number, k: number) => unwarp([(i + offset[0]) * half, (j + offset[1]) * half, (k + offset[2]) * half]);
  const key = (i: number, j: number, k: number) => (i * span + (j + jMax)) * span + (k + jMax);
  const sites = new Map<number, Site>();
  for (let i = 0; i <= iMax; i++) {
    for (let j = -jMax; j <= jMax; j++) {
      for (let k = -jMax; k <= jMax; k++) {
        if ((i & 1) !== (j & 1) || (j & 1) !== (k & 1)) continue;
        const lab = at(i, j, k);
        sites.set(key(i, j, k), { lab, wanted: wanted(lab), inGamut: isInSrgbGamut(lab) });
      }
    }
  }
  const neighbours = (i: number, j: number, k: number) =>
    BCC_STEPS.map(([di, dj, dk]) => sites.get(key(i + di, j + dj, k + dk))).filter((s) => s !== undefined);
  const probe = (i: number, j: number, k: number, test: (lab: Lab) => boolean) =>
    BCC_STEPS.some(([di, dj, dk]) => {
      const f = (COVERING_FRACTION * 2) / Math.hypot(di, dj, dk);
      return test(at(i + f * di, j + f * dj, k + f * dk));
    });
  const points: Lab[] = [];
  for (let i = 0; i <= iMax; i++) {
    for (let j = -jMax; j <= jMax; j++) {
      for (let k = -jMax; k <= jMax; k++) {
        const site = sites.get(key(i, j, k));
        if (!site) continue;
        if (!site.wanted && !(neighbours(i, j, k).some((s) => s.wanted) && probe(i, j, k, wanted))) continue;
        if (site.inGamut || (neighbours(i, j, k).some((s) => s.inGamut) && probe(i, j, k, isInSrgbGamut))) points.push(site.lab);
      }
    }
  }
  return points;
}
