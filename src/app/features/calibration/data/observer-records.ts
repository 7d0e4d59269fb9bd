// One row per person for the trainer's view of certificates and screening.
import type { Certification, Screening, ScreeningSummary } from '../../../../../shared/api/calibration-answers.js';

/** A person with their latest screening (null: not screened) and their certifications. */
export interface ObserverRecord {
  userId: number;
  name: string;
  screening: ScreeningSummary | null;
  certifications: Certification[];
}

/**
 * Everyone known (given people first, e.g. an admin's user list, then anyone with a screening or
 * a certification), by name, each with their newest screening and certifications newest first.
 */
export function observerRecords(people: readonly { id: number; name: string }[], screenings: readonly Screening[], certifications: readonly Certification[]): ObserverRecord[] {
  const rows = new Map<number, ObserverRecord>();
  const row = (userId: number, name: string) => {
    let r = rows.get(userId);
    if (!r) rows.set(userId, (r = { userId, name, screening: null, certifications: [] }));
    return r;
  };
  for (const p of people) row(p.id, p.name);
  // Screenings come newest first: the first seen for a person is their latest.
  for (const s of screenings) {
    const r = row(s.userId, s.name);
    if (!r.screening) r.screening = { screenedOn: s.screenedOn, method: s.method, result: s.result };
  }
  for (const c of certifications) row(c.userId, c.name).certifications.push(c);
  return [...rows.values()].sort((a, b) => a.name.localeCompare(b.name));
}
