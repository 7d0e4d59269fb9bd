// Small words and numbers the calibration pages share.
import type { CalibrationSessionSummary } from '../../../../../shared/api/calibration-answers.js';
import type { Role } from '../../../../../shared/api/roles.js';
import { KAPPA_BAND_LABELS, type KappaBand } from '../../../../../shared/stats/landis-koch.js';
import { formatNumber } from '../../../shared/chips/chip-words';

/** Whether a role runs sessions and reads everybody's results. */
export function runsSessions(role: Role | null): boolean {
  return role === 'trainer' || role === 'admin';
}

/** Responses expected so far: every specimen by every participant. */
export function expectedResponses(s: Pick<CalibrationSessionSummary, 'specimenCount' | 'participantCount'>): number {
  return s.specimenCount * s.participantCount;
}

/** "κ 0.43, moderate agreement (Landis & Koch 1977)", or why there is no κ yet. */
export function kappaWords(kappa: number | null, band: KappaBand | null): string {
  if (kappa === null || band === null) return 'κ not defined yet: it needs two observers on a specimen and more than one chip picked';
  return `κ ${formatNumber(kappa, 2)}, ${KAPPA_BAND_LABELS[band]} agreement (Landis & Koch 1977)`;
}

/** A share 0…1 as a whole percentage, or a dash. */
export function percentText(share: number | null): string {
  return share === null ? '–' : `${Math.round(share * 100)} %`;
}
