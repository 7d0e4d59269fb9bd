// The non-colour part of the invented demo scenario: a few measurements per demo accession,
// typed as a recorder would, some in inches and some in centimetres, stored in SI. The figures
// are invented. A petiole of about 40 in on a sheath of about 28 in (ratio 0.70) is common
// practice for a vigorous plant, no source.
import type { EntityManager } from 'typeorm';
import { toSi, type Unit } from '../../shared/units/units.js';
import { recordAudit, SYSTEM } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { Accession } from '../collection/accession.entity.js';
import { Descriptor } from '../collection/descriptor.entity.js';
import { Observation } from '../collection/observation.entity.js';
import { DEMO_DUPLICATE } from './demo-scenario.js';

/** Who took the demo measurements: the demo recorder. */
const DEMO_OBSERVER_EMAIL = 'recorder@demo.test';

/** Days after planting the measurements are taken: about five months, at full vegetative development. */
const DAYS_AFTER_PLANTING = 150;

/** One typed measurement of the demo. */
interface DemoMeasure {
  code: string;
  value?: number;
  unit?: Unit;
  category?: string;
}

/** The measurements of the n-th demo plant, alternately in inches and centimetres (invented figures). */
function measuresOf(n: number): DemoMeasure[] {
  const step = n % 5;
  const imperial = n % 2 === 0;
  // The first plant is the worked example: 40 in and 28 in, ratio 0.70.
  const petioleIn = 40 - step * 2;
  const sheathIn = 28 - step;
  const length = (inches: number): DemoMeasure['value'] => (imperial ? inches : Math.round(inches * 2.54 * 10) / 10);
  const unit: Unit = imperial ? 'in' : 'cm';
  return [
    { code: 'petiole.length', value: length(petioleIn), unit },
    { code: 'sheath.length', value: length(sheathIn), unit },
    { code: 'leaf.blade.length', value: length(24 - step), unit },
    { code: 'leaf.blade.width', value: length(18 - step), unit },
    { code: 'plant.height', value: imperial ? 52 - step * 3 : 130 - step * 8, unit },
    { code: 'suckers.count', value: 2 + (n % 4), unit: 'count' },
    { code: 'leaf.blade.position', category: ['tip-up', 'level', 'tip-down'][n % 3]! },
  ];
}

/**
 * Adds the demo observations inside the demo's transaction: the first two plants of every demo
 * accession, measured about five months after planting (skipped when that is still ahead), and
 * one correction of a mistyped petiole, so the history view has something to show.
 */
export async function seedDemoObservations(m: EntityManager): Promise<number> {
  const observer = await m.findOneByOrFail(User, { email: DEMO_OBSERVER_EMAIL });
  const descriptors = new Map((await m.find(Descriptor)).map((d) => [d.code, d]));
  const accessions = await m.find(Accession, { relations: { plants: true }, order: { accessionNumber: 'ASC' } });
  const now = Date.now();
  let n = 0;
  let added = 0;
  const firstMeasure = new Map<string, number>();
  for (const accession of accessions) {
    // The planted duplicate measures as its twin does: the same variety under another number.
    const twin = accession.accessionNumber === DEMO_DUPLICATE.accessionNumber ? firstMeasure.get(DEMO_DUPLICATE.sameAs) : undefined;
    firstMeasure.set(accession.accessionNumber, n);
    let k = twin ?? n;
    const plants = [...accession.plants].sort((a, b) => a.label.localeCompare(b.label, 'en', { numeric: true })).slice(0, 2);
    for (const plant of plants) {
      const observedAt = new Date(Date.parse(`${plant.plantedOn}T10:00:00Z`) + DAYS_AFTER_PLANTING * 86_400_000);
      const measures = measuresOf(k++);
      n++;
      if (observedAt.getTime() > now) continue;
      for (const measure of measures) {
        const descriptor = descriptors.get(measure.code);
        if (!descriptor) continue;
        // The worked-example petiole was first typed with a slipped decimal point, then corrected.
        const mistyped = added === 0 && measure.code === 'petiole.length' ? await save(m, { accession, plant, descriptor, observer, observedAt }, { ...measure, value: measure.value! / 10 }, null) : null;
        const saved = await save(m, { accession, plant, descriptor, observer, observedAt }, measure, mistyped);
        if (mistyped) await m.update(Observation, { id: mistyped.id }, { supersededBy: { id: saved.id } });
        added += mistyped ? 2 : 1;
      }
    }
  }
  await recordAudit(m, SYSTEM, 'demo.observations.loaded', null, { observations: added });
  return added;
}

type Where = Pick<Observation, 'accession' | 'plant' | 'descriptor' | 'observer' | 'observedAt'>;

/** Stores one typed measurement (or category) in SI, with what was typed. */
function save(m: EntityManager, where: Where, measure: DemoMeasure, supersedes: Observation | null): Promise<Observation> {
  const typed = measure.category === undefined;
  return m.save(
    m.create(Observation, {
      ...where,
      valueSi: typed ? toSi(measure.value!, measure.unit!) : null,
      category: measure.category ?? null,
      enteredValue: typed ? measure.value! : null,
      enteredUnit: typed ? measure.unit! : null,
      notes: supersedes ? 'Corrected: the decimal point slipped on the first entry.' : null,
      supersedes,
      supersededBy: null,
    }),
  );
}
