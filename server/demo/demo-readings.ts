// The colour readings of the invented demo scenario: a few hundred readings by the demo recorder
// and trainer over two years at the four demo sites, taken through the readings domain (the same
// preparation, matching, season derivation and audit as the API), seeded so every load is the
// same. Every colour is invented.
//
// Two accession + character pairs are built for the drift analysis to find (or not):
// - DRIFT: HL-0001 "Violet Stripe", petiole.stripes, at RDP (Pacific/Fiji, Wet 11-01…04-30 /
//   Dry 05-01…10-31): darker and redder in the wet season (about L* 34, a* 28, b* −12) than in
//   the dry (about L* 40, a* 22, b* −8), about 6 ΔE00 apart; 8 readings per season group
//   (Dry 2025, Wet 2025, Dry 2026), scatter about ±0.4 per coordinate.
// - STEADY: HL-0002 "Cream Heart", corm.flesh.centre, at RDP: the same cream (L* 86, a* 1.5,
//   b* 16) in every season, scatter about ±0.25 per coordinate (well under 1 ΔE00).
import type { EntityManager } from 'typeorm';
import { mulberry32 } from '../../shared/random/mulberry32.js';
import { LIGHTS, type CreateReadingRequest } from '../../shared/api/reading-answers.js';
import type { CreateReadingBody } from '../../shared/api/readings.js';
import { recordAudit, SYSTEM, type Actor } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { Accession } from '../collection/accession.entity.js';
import { Character } from '../collection/character.entity.js';
import { ReferenceSet } from '../reference-sets/reference-set.entity.js';
import { ReferenceSets } from '../reference-sets/reference-sets.js';
import { prepareReading, type ColourSources } from '../readings/reading-input.js';
import { insertReading } from '../readings/readings.js';
import { Reading } from '../readings/reading.entity.js';
import { DEMO_DUPLICATE } from './demo-scenario.js';

type Lab3 = [number, number, number];

/** The accession + character pair with a real seasonal drift (wet vs dry). */
export const DEMO_DRIFT = { accessionNumber: 'HL-0001', characterCode: 'petiole.stripes', wet: [34, 28, -12] as Lab3, dry: [40, 22, -8] as Lab3 };
/** The accession + character pair that keeps its colour in every season. */
export const DEMO_STEADY = { accessionNumber: 'HL-0002', characterCode: 'corm.flesh.centre', lab: [86, 1.5, 16] as Lab3 };

/** The season groups of the two pairs at RDP: [first day, last day] of each, local dates. */
const PAIR_GROUPS: readonly [string, string][] = [
  ['2025-05-10', '2025-10-20'],
  ['2025-11-10', '2026-04-20'],
  ['2026-05-10', '2026-10-20'],
];
const PAIR_READINGS_PER_GROUP = 8;

/** Everyday readings: the characters read on every accession, with an invented base colour per accession (index) for each. */
const EVERYDAY: readonly { code: string; base: (i: number) => Lab3; cut?: boolean }[] = [
  { code: 'petiole.third.upper', base: (i) => [38 + (i % 4) * 6, 8 + (i % 3) * 9, 10 - (i % 5) * 6] },
  { code: 'leaf.blade.upper', base: (i) => [40 + (i % 3) * 4, -18 + (i % 4) * 2, 24 + (i % 2) * 6] },
  { code: 'sap.petiole', base: (i) => [88 - (i % 3) * 3, (i % 4) * 2, 6 + (i % 3) * 5], cut: true },
];
/** Days between everyday visits to one accession (our own rhythm for the demo). */
const VISIT_DAYS = 56;
const FIRST_VISIT = Date.parse('2025-03-01T00:00:00Z');
const LAST_VISIT = Date.parse('2026-11-25T00:00:00Z');
const DAY = 86_400_000;

const LEAVES = ['second leaf', 'third leaf', 'youngest open leaf'];

/**
 * Adds the demo readings inside the demo's transaction, as the demo recorder and trainer;
 * readings that would lie in the future (a demo loaded on an early clock) are skipped. Returns how
 * many were added; 0 when no reference set is loaded.
 */
export async function seedDemoReadings(m: EntityManager): Promise<number> {
  if (!(await m.findOne(ReferenceSet, { where: {} }))) return 0;
  const random = mulberry32(20260210);
  const jitter = (lab: Lab3, by: number): Lab3 => lab.map((v) => Math.round((v + (random() * 2 - 1) * by) * 100) / 100) as Lab3;
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(random() * xs.length)]!;

  const src: ColourSources = { referenceSets: new ReferenceSets(m.connection), photos: null };
  const users = await m.find(User);
  const observers = ['recorder@demo.test', 'trainer@demo.test'].map((e) => users.find((u) => u.email === e)!);
  const actorOf = (u: User): Actor => ({ id: u.id, email: u.email, ip: null });
  const characters = new Map((await m.find(Character)).map((c) => [c.code, c]));
  const accessions = await m.find(Accession, { relations: { plants: true, site: true }, order: { accessionNumber: 'ASC' } });
  const now = Date.now();
  let added = 0;

  const take = async (observer: User, body: CreateReadingBody): Promise<Reading | null> => {
    if (Date.parse(body.observedAt!) > now) return null;
    const values = await prepareReading(m, src, body, observer.id, new Date(now));
    const id = await insertReading(m, actorOf(observer), values, { demo: true });
    added++;
    return m.findOneByOrFail(Reading, { id });
  };
  const colourFields = async (lab: Lab3): Promise<Pick<CreateReadingRequest, 'method' | 'lab' | 'chipCode' | 'hex' | 'eyeChipCode' | 'instrument'>> => {
    const roll = random();
    if (roll < 0.55) {
      // Some instrument readings also carry the field chip the observer picked by eye.
      const eye = roll < 0.25 ? (await src.referenceSets.match({ l: lab[0], a: lab[1], b: lab[2] }, 1)).matches[0] : undefined;
      return { method: 'instrument', lab, instrument: 'Demo handheld colorimeter', eyeChipCode: eye ? (eye.parent ?? eye.code) : undefined };
    }
    const best = (await src.referenceSets.match({ l: lab[0], a: lab[1], b: lab[2] }, 3)).matches;
    if (roll < 0.8) return { method: 'chip', chipCode: best[Math.floor(random() * best.length)]!.code };
    return { method: 'swatch', hex: best[0]!.hex };
  };

  // The drift and steady pairs: instrument readings only, so their scatter is the tissue's.
  const pairs = [
    { ...DEMO_DRIFT, colourOf: (wet: boolean) => (wet ? DEMO_DRIFT.wet : DEMO_DRIFT.dry), scatter: 0.4 },
    { ...DEMO_STEADY, colourOf: () => DEMO_STEADY.lab, scatter: 0.25 },
  ];
  for (const pair of pairs) {
    const accession = accessions.find((a) => a.accessionNumber === pair.accessionNumber)!;
    const character = characters.get(pair.characterCode)!;
    const plants = [...accession.plants].sort((a, b) => a.label.localeCompare(b.label, 'en', { numeric: true })).slice(0, 2);
    for (const [gi, [from, to]] of PAIR_GROUPS.entries()) {
      const start = Date.parse(`${from}T09:00:00+12:00`);
      const span = Date.parse(`${to}T09:00:00+12:00`) - start;
      for (let k = 0; k < PAIR_READINGS_PER_GROUP; k++) {
        const at = new Date(start + Math.round((span * k) / (PAIR_READINGS_PER_GROUP - 1) / DAY) * DAY + Math.floor(random() * 4) * 3_600_000);
        const growing = plants.filter((p) => Date.parse(`${p.plantedOn}T00:00:00Z`) + 30 * DAY <= at.getTime());
        await take(observers[k % 2]!, {
          accessionId: accession.id,
          plantId: growing.length ? growing[k % growing.length]!.id : null,
          siteId: accession.site.id,
          characterId: character.id,
          observedAt: at.toISOString(),
          method: 'instrument',
          lab: jitter(pair.colourOf(gi % 2 === 1), pair.scatter),
          instrument: 'Demo bench spectrophotometer',
          light: 'viewing-booth',
          secondsSinceCut: pair.characterCode.startsWith('corm') ? 20 + Math.floor(random() * 30) : undefined,
        });
      }
    }
  }

  // Everyday readings: each accession visited every eight weeks once its first plant is two months in the ground.
  const colourIndex = (i: number) =>
    accessions[i]!.accessionNumber === DEMO_DUPLICATE.accessionNumber ? accessions.findIndex((a) => a.accessionNumber === DEMO_DUPLICATE.sameAs) : i;
  for (const [i, accession] of accessions.entries()) {
    const plants = [...accession.plants].sort((a, b) => a.label.localeCompare(b.label, 'en', { numeric: true }));
    const firstPlanted = Date.parse(`${plants[0]!.plantedOn}T00:00:00Z`);
    for (let t = Math.max(FIRST_VISIT, firstPlanted + 60 * DAY) + i * 3 * DAY; t <= LAST_VISIT; t += VISIT_DAYS * DAY) {
      const growing = plants.filter((p) => Date.parse(`${p.plantedOn}T00:00:00Z`) + 30 * DAY <= t);
      const plant = pick(growing);
      const observer = observers[Math.floor(t / DAY / VISIT_DAYS + i) % 2]!;
      for (const ch of EVERYDAY) {
        const character = characters.get(ch.code)!;
        await take(observer, {
          accessionId: accession.id,
          plantId: plant.id,
          characterId: character.id,
          observedAt: new Date(t + (7 + Math.floor(random() * 8)) * 3_600_000).toISOString(),
          // The planted duplicate takes its twin's colours: the same variety under another number.
          ...(await colourFields(jitter(ch.base(colourIndex(i)), 1.5))),
          light: pick(LIGHTS),
          secondsSinceCut: ch.cut ? 10 + Math.floor(random() * 80) : undefined,
          leafPosition: ch.code.startsWith('leaf') ? pick(LEAVES) : undefined,
        });
      }
    }
  }

  // Two corrections, so the history and versions views have something to show.
  const recorder = observers[0]!;
  const everyday = characters.get(EVERYDAY[0]!.code)!;
  const mine = await m.find(Reading, { where: { observerId: recorder.id, method: 'instrument', characterId: everyday.id }, order: { id: 'ASC' }, take: 12 });
  for (const [n, old] of [mine[3], mine[8]].filter((r): r is Reading => !!r).entries()) {
    const body: CreateReadingBody = {
      accessionId: old.accessionId,
      plantId: old.plantId,
      characterId: old.characterId,
      siteId: old.siteId,
      observedAt: old.observedAt.toISOString(),
      method: 'instrument',
      lab: [old.l + (n === 0 ? 10 : 0), old.a, old.b],
      instrument: old.instrument,
      light: old.light,
      secondsSinceCut: old.secondsSinceCut,
    };
    // The first was typed with L* ten too low; the second is re-read under better light.
    const corrected = n === 0 ? { ...body } : { ...body, light: 'viewing-booth' as const };
    const values = await prepareReading(m, src, corrected, old.observerId, new Date(now));
    const reason = n === 0 ? 'L* typed ten too low' : 'Re-read in the viewing booth';
    // As supersedeReading does, inside the demo's own transaction: the new row, both links, both events.
    const created = await insertReading(m, actorOf(recorder), { ...values, supersedesId: old.id, supersedeReason: reason }, { supersedes: old.id, reason, demo: true });
    await m.update(Reading, { id: old.id }, { supersededById: created });
    await recordAudit(m, actorOf(recorder), 'reading.superseded', `reading:${old.id}`, { by: created, reason });
    added++;
  }
  await recordAudit(m, SYSTEM, 'demo.readings.loaded', null, { readings: added });
  return added;
}
