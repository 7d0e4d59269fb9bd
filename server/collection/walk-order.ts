/*
 * The order in which a recorder walks one plant: the whole plant, then leaf → petiole → basal ring
 * and sheath → corm → cormels → roots → flowers. Colour characters and descriptors share one
 * numbering, so the plant sheet interleaves them (a leaf's colours beside its lengths). This order
 * is our own, following the plant from the top down and from what needs no cutting to what does
 * (common practice, no source). Admins change it later under Collection → Walk order; this table
 * only seeds new rows and the migration that introduced it.
 */

/** Seeded catalogue code → its place in the walk (steps of ten leave room for admins' additions). */
export const WALK_ORDER: Readonly<Record<string, number>> = {
  'plant.height': 100,
  'suckers.count': 110,
  'stolons.count': 120,
  'leaf.blade.upper': 200,
  'leaf.blade.lower': 210,
  'leaf.margin': 220,
  'leaf.vein.junction': 230,
  'leaf.vein.upper': 240,
  'leaf.vein.lower': 250,
  'leaf.blade.length': 260,
  'leaf.blade.width': 270,
  'leaf.blade.length.width.ratio': 275,
  'leaf.blade.position': 280,
  'petiole.third.upper': 300,
  'petiole.third.middle': 310,
  'petiole.third.lower': 320,
  'petiole.stripes': 330,
  'petiole.length': 340,
  'sap.petiole': 350,
  'petiole.ring.basal': 400,
  'petiole.ring.basal.reach': 405,
  'sheath.inside': 410,
  'sheath.edge': 420,
  'sheath.length': 430,
  'sheath.petiole.ratio': 435,
  'corm.flesh.centre': 500,
  'corm.flesh.upper': 510,
  'corm.flesh.lower': 520,
  'corm.cortex': 530,
  'corm.skin': 540,
  'corm.scars': 550,
  'corm.buds': 560,
  'corm.mass': 570,
  'corm.length': 580,
  'corm.shape': 590,
  'cormel.flesh': 600,
  'cormel.skin': 610,
  'cormels.count': 620,
  'cormels.mass': 630,
  'root': 700,
  'flower.spathe': 800,
  'flower.spadix': 810,
};

/** Where a row the walk table does not know goes: after everything seeded, keeping its old relative order. */
export const UNLISTED_FROM = 1000;

/** The walk position of a seeded code, or one after the seeded ones for a code the table lacks. */
export function walkOrderOf(code: string, fallback: number): number {
  return WALK_ORDER[code] ?? UNLISTED_FROM + fallback;
}
