// The calibration part of the invented demo scenario: one closed session with results and
// certifications, one open session with a few answers, and some screening records. Invented
// people only; the specimens' colours are invented instrument readings of taro tissue.
import type { EntityManager } from 'typeorm';
import type { ScreeningMethod, ScreeningResult } from '../../shared/api/calibration-answers.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import type { Lab } from '../../shared/colour/lab.js';
import { SYSTEM } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { certifyAndClose } from '../calibration/calibration-close.js';
import { CalibrationResponse, CalibrationSession, Participant, Specimen } from '../calibration/calibration-session.entity.js';
import { ColourVisionScreening } from '../calibration/certification.entity.js';
import { Chip, ReferenceSet } from '../reference-sets/reference-set.entity.js';
import { CALIBRATION_DEFAULT_THRESHOLDS } from '../../shared/api/calibration-answers.js';

/** Two more invented observers, so a demo session has a group to compare. */
export const DEMO_OBSERVERS = [
  { email: 'observer.tamsin@demo.test', name: 'Tamsin Orrowby', role: 'recorder' },
  { email: 'observer.ilario@demo.test', name: 'Ilario Fenwhistle', role: 'recorder' },
] as const;

/** Specimens of the closed session: label and an invented CIELAB reading (D65). */
const CLOSED_SPECIMENS: readonly { label: string; lab: Lab }[] = [
  { label: 'A — petiole, middle third, dark purple accession', lab: { l: 32, a: 24, b: -10 } },
  { label: 'B — corm flesh centre, cream', lab: { l: 86, a: 1.5, b: 16 } },
  { label: 'C — leaf blade, upper surface, mid green', lab: { l: 46, a: -20, b: 26 } },
  { label: 'D — basal ring, pink', lab: { l: 62, a: 30, b: 4 } },
  { label: 'E — corm flesh centre, yellow', lab: { l: 80, a: 4, b: 38 } },
];

const OPEN_SPECIMENS: readonly { label: string; lab: Lab }[] = [
  { label: '1 — leaf blade, lower surface, pale green', lab: { l: 62, a: -14, b: 24 } },
  { label: '2 — petiole stripe, plum', lab: { l: 38, a: 30, b: -2 } },
  { label: '3 — sap, milky white', lab: { l: 90, a: 0, b: 6 } },
];

/**
 * Each observer's pick per specimen: n ≥ 0 is the n-th nearest chip inside the reference's field
 * chip, −n the n-th nearest chip of another field chip. Invented so the demo shows steady
 * observers, one who drifts within the right field chips, and one who misreads some specimens.
 */
const PICK_RANKS: Readonly<Record<string, readonly number[]>> = {
  'recorder@demo.test': [0, 1, 0, 2, 1],
  'reviewer@demo.test': [1, 0, 2, 1, 0],
  'observer.tamsin@demo.test': [6, 5, 8, 7, 9],
  'observer.ilario@demo.test': [-3, 2, 1, -6, 3],
};

const SCREENINGS: readonly { email: string; screenedOn: string; method: ScreeningMethod; result: ScreeningResult }[] = [
  { email: 'recorder@demo.test', screenedOn: '2025-09-02', method: 'pseudoisochromatic-plates', result: 'normal' },
  { email: 'reviewer@demo.test', screenedOn: '2025-06-18', method: 'arrangement-test', result: 'normal' },
  { email: 'observer.ilario@demo.test', screenedOn: '2025-10-01', method: 'pseudoisochromatic-plates', result: 'unsure' },
];

/** Loads the calibration demo inside the demo seed's transaction; skips when no reference set is loaded. */
export async function seedDemoCalibration(m: EntityManager, passwordHash: string): Promise<void> {
  const [set] = await m.find(ReferenceSet, { order: { version: 'DESC' }, take: 1 });
  if (!set) return;
  for (const o of DEMO_OBSERVERS) await m.insert(User, { ...o, passwordHash, active: true, lastLoginAt: null });
  const users = new Map((await m.find(User)).map((u) => [u.email, u]));
  const trainer = users.get('trainer@demo.test')!;
  const chips = (await m.find(Chip, { where: { setId: set.id } })).map((c) => ({ code: c.code, field: c.parent ?? c.code, lab: { l: c.l, a: c.a, b: c.b }, isField: c.parent === null }));
  const fields = chips.filter((c) => c.isField);
  const ranked = new Map<number, typeof chips>();
  // Each specimen's chips by ΔE00, computed once: sorting with ΔE00 in the comparator would cost seconds.
  const nearest = (specimen: Specimen) => {
    let list = ranked.get(specimen.id);
    if (!list) {
      const lab = { l: specimen.l, a: specimen.a, b: specimen.b };
      list = chips.map((c) => ({ c, d: deltaE00(lab, c.lab) })).sort((p, q) => p.d - q.d).map((x) => x.c);
      ranked.set(specimen.id, list);
    }
    return list;
  };
  const fieldOf = (lab: Lab) => fields.reduce((best, c) => (deltaE00(lab, c.lab) < deltaE00(lab, best.lab) ? c : best)).code;

  const addSession = async (title: string, heldOn: string, restricted: boolean, specimens: readonly { label: string; lab: Lab }[]) => {
    const session = await m.save(m.create(CalibrationSession, { title, heldOn, referenceSetId: set.id, restricted, kappaThreshold: CALIBRATION_DEFAULT_THRESHOLDS.kappa, deltaE00Threshold: CALIBRATION_DEFAULT_THRESHOLDS.deltaE00, status: 'open', createdBy: trainer, closedAt: null, kappaAtClose: null }));
    const rows = [];
    for (const [i, s] of specimens.entries()) {
      rows.push(await m.save(m.create(Specimen, { session, label: s.label, position: i + 1, source: 'lab', ...s.lab, referenceFieldCode: fieldOf(s.lab), chipCode: null, photo: null, region: null })));
    }
    return { session, specimens: rows };
  };
  const answer = async (session: CalibrationSession, specimen: Specimen, email: string, rank: number) => {
    const list = nearest(specimen);
    const chip = rank >= 0 ? list.filter((c) => c.field === specimen.referenceFieldCode)[rank]! : list.filter((c) => c.field !== specimen.referenceFieldCode)[-rank - 1]!;
    await m.insert(CalibrationResponse, { session, specimen, observer: users.get(email)!, chipCode: chip.code, fieldCode: chip.field, ...chip.lab });
  };

  const closed = await addSession('Petiole and corm colours, morning group', '2025-11-14', false, CLOSED_SPECIMENS);
  for (const [email, ranks] of Object.entries(PICK_RANKS)) {
    await m.insert(Participant, { session: closed.session, user: users.get(email)!, invited: email.startsWith('observer.') });
    for (const [i, specimen] of closed.specimens.entries()) await answer(closed.session, specimen, email, ranks[i]!);
  }
  await certifyAndClose(m, SYSTEM, closed.session.id, new Date('2025-11-14T11:30:00Z'));

  const open = await addSession('Leaf blade greens, new observers', '2026-01-20', true, OPEN_SPECIMENS);
  for (const email of ['recorder@demo.test', 'observer.tamsin@demo.test', 'observer.ilario@demo.test']) await m.insert(Participant, { session: open.session, user: users.get(email)!, invited: true });
  await answer(open.session, open.specimens[0]!, 'observer.tamsin@demo.test', 1);
  await answer(open.session, open.specimens[1]!, 'observer.tamsin@demo.test', 0);

  for (const s of SCREENINGS) {
    const user = users.get(s.email)!;
    await m.insert(ColourVisionScreening, { user, screenedOn: s.screenedOn, method: s.method, result: s.result, notes: null, recordedBy: user });
  }
}
