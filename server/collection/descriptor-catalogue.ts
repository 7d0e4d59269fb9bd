/*
 * The seeded catalogue of non-colour descriptors: lengths, masses, counts, categories and the
 * ratios computed from them. Wording and category labels are our own.
 *
 * Each entry names its object (the exact part), condition (growth stage) and sampling, after
 * Bioversity International (2007), Technical Bulletin 13, "Developing crop descriptor lists".
 * "Full vegetative development, about 4–6 months after planting" is an approximate timing from
 * memory, not a quoted figure. Comparing sheath length with petiole length is common practice
 * with no source we can cite; so is measuring on the third fully opened leaf from the top.
 *
 * Codes are our own, lowercase and dotted, and never change once seeded: observations refer to
 * them. A few codes were once non-colour characters of the character catalogue; they live here now.
 */
import type { Descriptor } from '../../shared/api/descriptor-answers.js';
import { RAW_TISSUE_CAUTION } from './character-catalogue.js';

/** One entry of the seeded descriptor catalogue: the catalogue's fields of a descriptor, and the colour character read on the same part (so the plant sheet shows both as one row). */
export type DescriptorSeed = Pick<Descriptor, 'code' | 'label' | 'object' | 'kind' | 'categories' | 'numeratorCode' | 'denominatorCode' | 'howToMeasure' | 'caution'> & { characterCode?: string };

const LEAF = 'the third fully opened leaf from the top';
const FULL_GROWTH = 'at full vegetative development (about 4–6 months after planting)';
const HARVEST = 'At harvest, wash the main corm and trim off the roots, leaf bases and cormels.';

function measured(kind: 'length' | 'mass' | 'count', code: string, label: string, object: string, howToMeasure: string, caution: string | null = null): DescriptorSeed {
  return { code, label, object, kind, categories: [], numeratorCode: null, denominatorCode: null, howToMeasure, caution };
}

function ratio(code: string, label: string, object: string, numeratorCode: string, denominatorCode: string): DescriptorSeed {
  return {
    code,
    label,
    object,
    kind: 'ratio',
    categories: [],
    numeratorCode,
    denominatorCode,
    howToMeasure: `Computed, never typed: the latest ${numeratorCode} divided by the latest ${denominatorCode} of the same plant.`,
    caution: null,
  };
}

function category(code: string, label: string, object: string, howToMeasure: string, categories: [string, string][], caution: string | null = null): DescriptorSeed {
  return { code, label, object, kind: 'category', categories: categories.map(([id, text]) => ({ id, label: text })), numeratorCode: null, denominatorCode: null, howToMeasure, caution };
}

/** The catalogue seeded into every database; admins may add more descriptors later. */
export const DESCRIPTOR_CATALOGUE: readonly DescriptorSeed[] = [
  measured('length', 'plant.height', 'Plant height', 'whole plant',
    `Measure ${FULL_GROWTH} from the soil surface to the highest point of the leaves as they stand, without straightening them.`),
  measured('length', 'petiole.length', 'Petiole length', `petiole of ${LEAF}`,
    `Measure ${FULL_GROWTH} along the petiole from its base at the corm to where it joins the blade.`),
  // How far the basal ring's colour reaches up the petiole: a length and a colour of one part, one row on the plant sheet.
  { ...measured('length', 'petiole.ring.basal.reach', 'Basal ring reach', `petiole of ${LEAF}`,
    `Measure ${FULL_GROWTH} from the base of the petiole, where it joins the corm, up to where the colour of the basal ring ends.`),
    characterCode: 'petiole.ring.basal' },
  measured('length', 'sheath.length', 'Sheath length', `sheath of ${LEAF}`,
    `Measure ${FULL_GROWTH} on the same leaf as the petiole length, from the base of the petiole to the top of the sheath, where its two edges end.`),
  // Sheath over petiole, so a 28 in sheath on a 40 in petiole gives 0.70 (common practice, no source).
  ratio('sheath.petiole.ratio', 'Sheath-to-petiole length ratio', `petiole and sheath of ${LEAF}`, 'sheath.length', 'petiole.length'),
  measured('length', 'leaf.blade.length', 'Leaf blade length', `blade of ${LEAF}`,
    `Measure ${FULL_GROWTH} from the tip of the blade to the end of the longer lobe at its base, along the line of the midrib.`),
  measured('length', 'leaf.blade.width', 'Leaf blade width', `blade of ${LEAF}`,
    `Measure ${FULL_GROWTH} across the blade at its widest point, at right angles to the length.`),
  ratio('leaf.blade.length.width.ratio', 'Blade length-to-width ratio', `blade of ${LEAF}`, 'leaf.blade.length', 'leaf.blade.width'),
  category('leaf.blade.position', 'Leaf blade position', `blade of ${LEAF}`,
    `Look ${FULL_GROWTH} at the blade from the side, in still air, and choose how its tip sits against the point where the petiole joins it.`,
    [['tip-up', 'Tip held above the join'], ['level', 'Held about level'], ['tip-down', 'Tip hanging below the join']]),
  measured('count', 'suckers.count', 'Number of suckers', 'side shoots at the base of the plant',
    `Count ${FULL_GROWTH} the side shoots growing from the base of the plant, including small ones with a single opened leaf.`),
  measured('count', 'stolons.count', 'Number of runners', 'runners (stolons) along the soil surface',
    `Count ${FULL_GROWTH} the runners leaving the base of the plant along or just under the soil surface.`),
  measured('mass', 'corm.mass', 'Corm mass', 'main corm, fresh, trimmed',
    `${HARVEST} Weigh it fresh, within a few hours of lifting, on a balance reading to at least 10 g.`, RAW_TISSUE_CAUTION),
  measured('length', 'corm.length', 'Corm length', 'main corm, trimmed',
    `${HARVEST} Measure from the base to the top of the corm, where the leaf bases were.`, RAW_TISSUE_CAUTION),
  category('corm.shape', 'Corm shape', 'main corm, trimmed',
    `${HARVEST} Lay it on its side and choose the outline it comes closest to.`,
    [
      ['round', 'Round'],
      ['cone', 'Cone, narrowing to the top'],
      ['cylinder', 'Cylinder, about as wide all along'],
      ['egg', 'Egg-shaped'],
      ['long', 'Long and narrow'],
      ['waisted', 'Narrow in the middle'],
      ['flattened', 'Flattened'],
      ['clustered', 'Several corms joined'],
    ],
    RAW_TISSUE_CAUTION),
  measured('count', 'cormels.count', 'Number of cormels', 'cormels around the main corm',
    'At harvest, count the cormels around the main corm that are at least the size of a thumb tip.', RAW_TISSUE_CAUTION),
  measured('mass', 'cormels.mass', 'Cormel mass, all together', 'cormels around the main corm',
    'At harvest, wash and trim the cormels counted for the number of cormels and weigh them together, fresh.', RAW_TISSUE_CAUTION),
];

/**
 * Codes of the non-colour characters the character catalogue once held; the descriptor catalogue
 * replaces them, and the collection-management migration marks any stored ones inactive.
 */
export const RETIRED_DESCRIPTOR_CHARACTERS = ['plant.height', 'petiole.length', 'leaf.blade.ratio', 'corm.suckers', 'corm.weight'] as const;
