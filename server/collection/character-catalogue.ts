/*
 * The seeded character catalogue: what a recorder reads, on which part, and how.
 *
 * Each "how to read it" names the object (the exact part), the condition (growth stage) and the
 * sampling, after Bioversity International (2007), Technical Bulletin 13, "Developing crop
 * descriptor lists". Leaf and petiole colours are read at full vegetative development, roughly
 * 4–6 months after planting (an approximate timing, not a quoted figure). Reading in open shade or
 * overcast light rather than direct sun is common field practice, not a standard.
 *
 * Cut corm and cormel flesh browns within minutes by polyphenol oxidase (Xiao et al. 2022,
 * Scientia Horticulturae 291:110613), so cut surfaces are read within about a minute; that limit
 * is our own threshold. Raw tissue and sap carry calcium oxalate raphides (Paull & Chen 2015,
 * University of Hawaii CTAHR VC-5), hence the caution on every corm, cormel and sap character.
 *
 * Codes are our own, lowercase and dotted; once seeded they never change, because readings refer
 * to them. Non-colour descriptors (lengths, masses, counts, shapes) are in descriptor-catalogue.ts.
 */
import type { Organ } from '../../shared/api/collection.js';

/** One entry of the seeded character catalogue. */
export interface CharacterSeed {
  code: string;
  organ: Organ;
  label: string;
  howToRead: string;
  caution: string | null;
  /** Whether this is a colour character (false: a non-colour descriptor whose label names its unit). */
  colour: boolean;
}

/** Shown on every corm, cormel and sap character (Paull & Chen 2015, CTAHR VC-5; docs/architecture.md, safety notes). */
export const RAW_TISSUE_CAUTION: string =
  'Wear gloves and never taste raw tissue: calcium oxalate crystals in raw corm and sap irritate ' +
  'skin, mouth and eyes. Wash hands and tools afterwards, and follow local health guidance.';

/** Shown where a sheath is opened, because torn leaf bases release the same irritant sap. */
const OPENED_SHEATH_CAUTION =
  'Opening the sheath releases sap that irritates skin and eyes: wear gloves and wash hands afterwards.';

const LEAF = 'the third fully opened leaf from the top, at full vegetative development (about 4–6 months after planting)';
const SHADE = 'Read in open shade or overcast light, not direct sun.';
const HARVEST_CUT = 'At harvest, wash the main corm and cut it lengthwise through the middle with a clean knife.';
const WITHIN_A_MINUTE = 'within about a minute of the cut, before the flesh browns';
const SAP_WITHIN_A_MINUTE = 'within about a minute of the cut';

function colour(code: string, organ: Organ, label: string, howToRead: string, caution: string | null = null): CharacterSeed {
  return { code, organ, label, howToRead, caution, colour: true };
}

const LEAF_CHARACTERS: readonly CharacterSeed[] = [
  colour('leaf.blade.upper', 'leaf', 'Leaf blade, upper surface',
    `Use ${LEAF}. Read the upper surface halfway between the midrib and the margin, away from veins, tears and disease spots. ${SHADE}`),
  colour('leaf.blade.lower', 'leaf', 'Leaf blade, lower surface',
    `Use ${LEAF}, turned over gently without creasing it. Read the lower surface halfway between the midrib and the margin, away from the veins. ${SHADE}`),
  colour('leaf.margin', 'leaf', 'Leaf margin',
    `Use ${LEAF}. Read the narrow band along the edge of the blade, on the upper side, halfway along one lobe. ${SHADE}`),
  colour('leaf.vein.junction', 'leaf', 'Vein junction (upper side)',
    `Use ${LEAF}. Read the spot on the upper side of the blade where the petiole joins it and the main veins meet. ${SHADE}`),
  colour('leaf.vein.upper', 'leaf', 'Main veins, upper side',
    `Use ${LEAF}. Read the main veins on the upper side, about halfway between the vein junction and the margin. ${SHADE}`),
  colour('leaf.vein.lower', 'leaf', 'Main veins, lower side',
    `Use ${LEAF}, turned over gently. Read the main veins on the lower side, about halfway between the vein junction and the margin. ${SHADE}`),
];

const PETIOLE_CHARACTERS: readonly CharacterSeed[] = [
  colour('petiole.third.upper', 'petiole', 'Petiole, upper third',
    `Use the petiole of ${LEAF}. Read the outer face of the third just below the blade, after wiping off dust. ${SHADE}`),
  colour('petiole.third.middle', 'petiole', 'Petiole, middle third',
    `Use the petiole of ${LEAF}. Read the outer face at the middle of its length, after wiping off dust. ${SHADE}`),
  colour('petiole.third.lower', 'petiole', 'Petiole, lower third',
    `Use the petiole of ${LEAF}. Read the outer face of the third just above where the sheath opens, after wiping off soil. ${SHADE}`),
  colour('petiole.stripes', 'petiole', 'Petiole stripes',
    `Use the petiole of ${LEAF}. Where it has stripes or streaks, read the colour of a stripe itself, not the ground colour around it. ${SHADE}`),
  colour('petiole.ring.basal', 'petiole', 'Basal ring',
    `Use the petiole of ${LEAF}. Clear the soil and read the ring at the very base of the petiole, where it joins the corm. ${SHADE}`),
];

const SHEATH_CHARACTERS: readonly CharacterSeed[] = [
  colour('sheath.inside', 'sheath', 'Sheath, inside',
    `Use the sheath of ${LEAF}. Ease it gently away from the stem and read its inner face at mid-length. ${SHADE}`,
    OPENED_SHEATH_CAUTION),
  colour('sheath.edge', 'sheath', 'Sheath edge',
    `Use the sheath of ${LEAF}. Read the thin edge of the sheath at mid-length, without opening it. ${SHADE}`),
];

const SAP_CHARACTERS: readonly CharacterSeed[] = [
  colour('sap.petiole', 'sap', 'Sap on a cut petiole',
    `Cut across the middle third of the petiole of ${LEAF} with a clean knife. Read the sap that gathers on the cut face ${SAP_WITHIN_A_MINUTE}, against a white card. ${SHADE}`,
    RAW_TISSUE_CAUTION),
];

const CORM_CHARACTERS: readonly CharacterSeed[] = [
  colour('corm.flesh.centre', 'corm', 'Corm flesh, centre',
    `${HARVEST_CUT} Read the flesh at the centre of the cut face ${WITHIN_A_MINUTE}. ${SHADE}`,
    RAW_TISSUE_CAUTION),
  colour('corm.flesh.upper', 'corm', 'Corm flesh, upper part',
    `${HARVEST_CUT} Read the flesh in the upper part of the cut face, towards the shoot, ${WITHIN_A_MINUTE}. ${SHADE}`,
    RAW_TISSUE_CAUTION),
  colour('corm.flesh.lower', 'corm', 'Corm flesh, lower part',
    `${HARVEST_CUT} Read the flesh in the lower part of the cut face, towards the roots, ${WITHIN_A_MINUTE}. ${SHADE}`,
    RAW_TISSUE_CAUTION),
  colour('corm.cortex', 'corm', 'Corm cortex',
    `${HARVEST_CUT} Read the thin layer just inside the skin, at the widest part of the cut face, ${WITHIN_A_MINUTE}. ${SHADE}`,
    RAW_TISSUE_CAUTION),
  colour('corm.skin', 'corm', 'Corm skin',
    `At harvest, wash the main corm and let it dry. Read the skin between the leaf scars at its widest part, without cutting it. ${SHADE}`,
    RAW_TISSUE_CAUTION),
  colour('corm.scars', 'corm', 'Leaf scars (rings on the corm)',
    `At harvest, wash the main corm and let it dry. Read the rings left by old leaf bases, at the widest part of the corm. ${SHADE}`,
    RAW_TISSUE_CAUTION),
  colour('corm.buds', 'corm', 'Buds',
    `At harvest, wash the main corm and let it dry. Read the buds along the leaf scars at mid-height on the corm. ${SHADE}`,
    RAW_TISSUE_CAUTION),
];

const CORMEL_CHARACTERS: readonly CharacterSeed[] = [
  colour('cormel.flesh', 'cormel', 'Cormel flesh',
    `At harvest, wash the largest cormel and cut it lengthwise through the middle with a clean knife. Read the flesh at the centre of the cut face ${WITHIN_A_MINUTE}. ${SHADE}`,
    RAW_TISSUE_CAUTION),
  colour('cormel.skin', 'cormel', 'Cormel skin',
    `At harvest, wash the largest cormel and let it dry. Read the skin at its widest part, without cutting it. ${SHADE}`,
    RAW_TISSUE_CAUTION),
];

const ROOT_AND_FLOWER_CHARACTERS: readonly CharacterSeed[] = [
  colour('root', 'root', 'Roots',
    `At harvest, rinse the soil off the roots. Read young, unbroken roots a few centimetres from where they leave the corm. ${SHADE}`),
  colour('flower.spathe', 'flower', 'Flower, spathe',
    `Where the plant flowers, use a spathe that has just opened. Read the outer face of the spathe blade at mid-length. ${SHADE}`),
  colour('flower.spadix', 'flower', 'Flower, spadix',
    `Where the plant flowers, use a spathe that has just opened. Read the spadix inside it at mid-length, without breaking the spathe. ${SHADE}`),
];

/** The catalogue seeded into a new database; the admin may add more characters later. */
export const CHARACTER_CATALOGUE: readonly CharacterSeed[] = [
  ...LEAF_CHARACTERS,
  ...PETIOLE_CHARACTERS,
  ...SHEATH_CHARACTERS,
  ...SAP_CHARACTERS,
  ...CORM_CHARACTERS,
  ...CORMEL_CHARACTERS,
  ...ROOT_AND_FLOWER_CHARACTERS,
];
