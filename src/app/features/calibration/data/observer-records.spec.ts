import type { Certification, Screening } from '../../../../../shared/api/calibration-answers.js';
import { observerRecords } from './observer-records';

const screening = (id: number, userId: number, name: string, screenedOn: string): Screening => ({
  id, userId, name, screenedOn, method: 'anomaloscope', result: 'normal', notes: null, recordedById: userId, recordedByName: name, createdAt: `${screenedOn}T09:00:00Z`,
});
const cert = (id: number, userId: number, name: string): Certification => ({
  id, userId, name, referenceSetId: 'v1', sessionId: 1, sessionTitle: 'Spring', certifiedOn: '2026-03-02', kappa: 0.7, meanDeltaE00: 1.2, n: 5, thresholds: { kappa: 0.61, deltaE00: 1.8 }, screening: null, validUntil: '2027-03-02', status: 'current', lapsedOn: null, lapseReason: null,
});

describe('observer records', () => {
  it('should list unscreened people with a null screening so they can be shown as not screened', () => {
    const rows = observerRecords([{ id: 3, name: 'Wren Hallowquist' }], [], []);
    expect(rows).toEqual([{ userId: 3, name: 'Wren Hallowquist', screening: null, certifications: [] }]);
  });

  it('should keep only the newest screening of each person (the list comes newest first)', () => {
    const rows = observerRecords([], [screening(9, 4, 'Oona Birchley', '2026-01-10'), screening(2, 4, 'Oona Birchley', '2025-05-01')], []);
    expect(rows[0].screening?.screenedOn).toBe('2026-01-10');
  });

  it('should gather people from certifications too, sorted by name', () => {
    const rows = observerRecords([{ id: 1, name: 'Zed Marlow' }], [screening(1, 2, 'Bea Quint', '2026-01-01')], [cert(5, 7, 'Ada Fenn')]);
    expect(rows.map((r) => r.name)).toEqual(['Ada Fenn', 'Bea Quint', 'Zed Marlow']);
    expect(rows[0].certifications.map((c) => c.id)).toEqual([5]);
    expect(rows[0].screening).toBeNull();
  });
});
