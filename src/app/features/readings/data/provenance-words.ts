// Plain words for a reading's provenance on the detail page.
import type { SampleCorrection } from '../../../../../shared/api/photo-answers.js';

/** What correction a photo reading used, in words; null when the reading has no photo. */
export function correctionText(correction: SampleCorrection | null): string | null {
  if (!correction) return null;
  if (correction.kind === 'neutral') return `Balanced on a grey card: linear-light gains ${correction.gains.map((g) => g.toFixed(2)).join(' · ')} (von Kries).`;
  if (correction.kind === 'patches') return `Corrected with a ${correction.residuals.length}-patch target: 3 × 3 matrix by least squares, worst patch ΔE00 ${correction.maxResidualDeltaE00.toFixed(1)}.`;
  return 'No correction: the colours as the camera saw the light.';
}

/** "5 months", "1 month", "under a month". */
export function ageWords(months: number | null): string {
  if (months === null) return 'not known (no plant or planting date)';
  const whole = Math.floor(months);
  if (whole < 1) return 'under a month';
  return `${whole} ${whole === 1 ? 'month' : 'months'}`;
}

/** An audit event's detail as "key: value" pairs on one line; a dash when there is none. */
export function eventDetailText(detail: Record<string, unknown> | null): string {
  if (!detail || Object.keys(detail).length === 0) return '—';
  return Object.entries(detail)
    .map(([key, value]) => `${key}: ${typeof value === 'string' ? value : JSON.stringify(value)}`)
    .join('; ');
}
