// Look-alike accessions (issue 14): how far two accessions' characterisations lie apart over the
// characters both have, and the collection's pairs that may be one variety under two numbers.
import type { DataSource } from 'typeorm';
import type { DescriptorSummary, DuplicatePair, DuplicatesAnswer, SharedCharacterDistance, SimilarAccession, SimilarAnswer } from '../../shared/api/profile-answers.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import type { Lab } from '../../shared/colour/lab.js';
import { AppError } from '../core/app-error.js';
import { Accession } from '../collection/accession.entity.js';
import { Character } from '../collection/character.entity.js';
import { describeDescriptors } from './descriptor-summary.js';
import { centreOf, groupBy, profileReadings } from './profile-readings.js';

/**
 * A descriptor's Gower dissimilarity at or below which two accessions count as the same on it: a
 * tenth of the collection's range for a number (our own choice, about the plant-to-plant scatter of
 * the demo's measurements); categories must match exactly.
 */
export const GOWER_SAME = 0.1;

/** The method in words, for the answers and the page. */
export const SIMILARITY_METHOD =
  'Colour: ΔE00 (CIEDE2000) between the two accepted colours of each shared character, divided by its threshold. ' +
  'Descriptors: Gower (1971, Biometrics 27:857–871) dissimilarity per shared descriptor, |x − y| / R for numbers (R the range of the accessions\' medians over the collection), 0 or 1 for categories (same commonest category or not), divided by 0.1. ' +
  'Distance: the mean of those scaled parts over every shared character; 1 means "at the threshold" on average. ' +
  'Possible duplicate: every shared character within its threshold (ΔE00 ≤ threshold; Gower ≤ 0.1) and at least the minimum number of characters shared.';

/** One accession's characterisation as the comparison needs it. */
interface Fingerprint {
  id: number;
  accessionNumber: string;
  name: string;
  colours: Map<number, { centre: Lab; code: string; hex: string }>;
  descriptors: Map<number, DescriptorSummary>;
}

interface CharacterInfo {
  code: string;
  label: string;
  threshold: number;
}

/** Every accession's fingerprint: the centre of each colour character and the summary of each descriptor. */
async function fingerprints(ds: DataSource): Promise<{ prints: Fingerprint[]; characters: Map<number, CharacterInfo> }> {
  const characters = new Map(
    (await ds.getRepository(Character).find({ where: { colour: true } })).map((c) => [c.id, { code: c.code, label: c.label, threshold: c.driftThreshold }]),
  );
  const accessions = await ds.getRepository(Accession).find({ order: { accessionNumber: 'ASC' } });
  const byAccession = groupBy(await profileReadings(ds), (r) => r.accessionId);
  const prints: Fingerprint[] = [];
  for (const a of accessions) {
    const colours = new Map<number, { centre: Lab; code: string; hex: string }>();
    for (const [characterId, rows] of groupBy(byAccession.get(a.id) ?? [], (r) => r.characterId)) {
      const character = characters.get(characterId);
      if (!character) continue;
      const { centre } = centreOf(rows);
      colours.set(characterId, { centre, code: character.code, hex: displayHex(centre).hex });
    }
    const descriptors = new Map((await describeDescriptors(ds, a.id)).map((d) => [d.descriptorId, d]));
    prints.push({ id: a.id, accessionNumber: a.accessionNumber, name: a.name, colours, descriptors });
  }
  return { prints, characters };
}

/** For each numeric descriptor, the range R of the accessions' medians over the collection (Gower's R_k). */
function rangesOf(prints: readonly Fingerprint[]): Map<number, number> {
  const lo = new Map<number, number>();
  const hi = new Map<number, number>();
  for (const p of prints) {
    for (const d of p.descriptors.values()) {
      if (d.median === null) continue;
      lo.set(d.descriptorId, Math.min(lo.get(d.descriptorId) ?? Infinity, d.median));
      hi.set(d.descriptorId, Math.max(hi.get(d.descriptorId) ?? -Infinity, d.median));
    }
  }
  return new Map([...lo].map(([id, min]) => [id, hi.get(id)! - min]));
}

/**
 * Gower's per-variable dissimilarity (Gower 1971, eq. for s_ijk, as 1 − s): |x − y| / R for a
 * quantitative character, 0 or 1 for a qualitative one; a range of 0 (every accession alike) gives 0.
 */
export function gowerPart(a: DescriptorSummary, b: DescriptorSummary, range: number | undefined): number {
  if (a.kind === 'category') return a.mode === b.mode ? 0 : 1;
  if (a.median === null || b.median === null) return 0;
  return range ? Math.abs(a.median - b.median) / range : 0;
}

/** Two fingerprints compared over what both have. */
function compare(me: Fingerprint, other: Fingerprint, characters: ReadonlyMap<number, CharacterInfo>, ranges: ReadonlyMap<number, number>, minShared: number): SimilarAccession {
  const parts: (SharedCharacterDistance & { scaled: number })[] = [];
  for (const [characterId, mine] of me.colours) {
    const theirs = other.colours.get(characterId);
    if (!theirs) continue;
    const c = characters.get(characterId)!;
    const de = deltaE00(mine.centre, theirs.centre);
    parts.push({ code: c.code, label: c.label, kind: 'colour', distance: de, threshold: c.threshold, separates: de > c.threshold, mine: labWords(mine.centre), theirs: labWords(theirs.centre), mineHex: mine.hex, theirsHex: theirs.hex, scaled: de / c.threshold });
  }
  const colourParts = parts.length;
  let gowerSum = 0;
  for (const [descriptorId, mine] of me.descriptors) {
    const theirs = other.descriptors.get(descriptorId);
    if (!theirs) continue;
    const g = gowerPart(mine, theirs, ranges.get(descriptorId));
    gowerSum += g;
    parts.push({ code: mine.code, label: mine.label, kind: mine.kind, distance: g, threshold: GOWER_SAME, separates: g > GOWER_SAME, mine: descriptorWords(mine), theirs: descriptorWords(theirs), scaled: g / GOWER_SAME });
  }
  const descriptorParts = parts.length - colourParts;
  parts.sort((x, y) => y.scaled - x.scaled);
  const colourDistance = colourParts ? parts.filter((p) => p.kind === 'colour').reduce((s, p) => s + p.scaled, 0) / colourParts : null;
  return {
    accessionId: other.id,
    accessionNumber: other.accessionNumber,
    name: other.name,
    colourDistance,
    gowerDistance: descriptorParts ? gowerSum / descriptorParts : null,
    distance: parts.length ? parts.reduce((s, p) => s + p.scaled, 0) / parts.length : Infinity,
    sharedColour: colourParts,
    sharedDescriptors: descriptorParts,
    possibleDuplicate: colourParts > 0 && parts.length >= minShared && parts.every((p) => !p.separates),
    characters: parts.map(({ scaled: _scaled, ...p }) => p),
  };
}

function labWords(lab: Lab): string {
  return `L* ${lab.l.toFixed(1)}, a* ${lab.a.toFixed(1)}, b* ${lab.b.toFixed(1)}`;
}

function descriptorWords(d: DescriptorSummary): string {
  return d.kind === 'category' ? (d.modeLabel ?? '—') : (d.formatted?.median.metric ?? '—');
}

/** `GET /api/accessions/:id/similar`: the other accessions nearest this one, with the characters that separate them. */
export async function similarAccessions(ds: DataSource, accessionId: number, limit: number, minShared: number): Promise<SimilarAnswer> {
  const { prints, characters } = await fingerprints(ds);
  const me = prints.find((p) => p.id === accessionId);
  if (!me) throw AppError.notFound(`No accession ${accessionId}.`);
  const ranges = rangesOf(prints);
  const items = prints
    .filter((p) => p.id !== accessionId)
    .map((p) => compare(me, p, characters, ranges, minShared))
    .filter((s) => s.sharedColour + s.sharedDescriptors > 0)
    .sort((a, b) => a.distance - b.distance || a.accessionNumber.localeCompare(b.accessionNumber))
    .slice(0, limit);
  return { accessionId, accessionNumber: me.accessionNumber, name: me.name, method: SIMILARITY_METHOD, minShared, items };
}

/** `GET /api/accessions/duplicates`: every pair of the collection that may be one variety, closest first. */
export async function possibleDuplicates(ds: DataSource, minShared: number): Promise<DuplicatesAnswer> {
  const { prints, characters } = await fingerprints(ds);
  const ranges = rangesOf(prints);
  const pairs: DuplicatePair[] = [];
  for (let i = 0; i < prints.length; i++) {
    for (let j = i + 1; j < prints.length; j++) {
      const s = compare(prints[i]!, prints[j]!, characters, ranges, minShared);
      if (!s.possibleDuplicate) continue;
      const colourRatios = s.characters.filter((c) => c.kind === 'colour').map((c) => c.distance / c.threshold);
      pairs.push({
        a: { accessionId: prints[i]!.id, accessionNumber: prints[i]!.accessionNumber, name: prints[i]!.name },
        b: { accessionId: prints[j]!.id, accessionNumber: prints[j]!.accessionNumber, name: prints[j]!.name },
        distance: s.distance,
        sharedColour: s.sharedColour,
        sharedDescriptors: s.sharedDescriptors,
        worstColourRatio: Math.max(...colourRatios),
      });
    }
  }
  pairs.sort((x, y) => x.distance - y.distance);
  return { method: SIMILARITY_METHOD, minShared, pairs };
}
