// Colour correction from references in the same photo (docs/colour.md, Correction): von Kries gains from a
// neutral card, or a 3×3 matrix fitted by least squares to patches of known CIELAB.
import { Matrix, SingularValueDecomposition, solve } from 'ml-matrix';
import type { PatchResidual } from '../../shared/api/photo-answers.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { labToTuple, type Lab } from '../../shared/colour/lab.js';
import { applyMatrix, diagonal, labToLinear, linearToLab, vonKriesGains, type LinearRgb, type Matrix3 } from '../../shared/photo/region-stats.js';
import { NEUTRAL_GAIN_MAX, NEUTRAL_MIN_L, PATCH_RESIDUAL_MAX_DE00 } from '../../shared/photo/sampling-rules.js';
import { AppError } from '../core/app-error.js';

/**
 * Von Kries gains in linear RGB, gain = target / measured per channel, so the neutral region comes
 * out as `targetLab` — or, without one, as the grey of its own luminance. Refuses a card darker
 * than `NEUTRAL_MIN_L` or one that would need a gain beyond `NEUTRAL_GAIN_MAX`.
 */
export function neutralGains(measured: LinearRgb, targetLab?: Lab): { gains: LinearRgb; target: Lab } {
  const measuredLab = linearToLab(measured);
  if (measuredLab.l < NEUTRAL_MIN_L) {
    throw refused('neutral', `The neutral card reads L* ${measuredLab.l.toFixed(1)}, too dark to balance from (at least L* ${NEUTRAL_MIN_L}). Photograph it in the same light, not in shadow.`);
  }
  const gains = vonKriesGains(measured, targetLab ? labToLinear(targetLab) : undefined);
  const target = applyMatrix(diagonal(gains), measured);
  if (!gains.every((g) => Number.isFinite(g) && g <= NEUTRAL_GAIN_MAX && g >= 1 / NEUTRAL_GAIN_MAX)) {
    throw refused('neutral', `Balancing on this region would need channel gains of ${gains.map((g) => g.toFixed(2)).join(', ')}; that is not a neutral grey or white card.`);
  }
  return { gains, target: linearToLab(target) };
}

/**
 * Least-squares 3×3 matrix M with corrected = M · measured, over patches of known CIELAB:
 * M = ((PᵀP)⁻¹PᵀR)ᵀ with P and R the measured and target linear RGB as rows (least squares by the normal equations),
 * solved by QR (ml-matrix `solve`). Refused when the patches do not span three independent
 * colours or when any residual exceeds `PATCH_RESIDUAL_MAX_DE00`.
 */
export function fitPatchMatrix(measured: readonly LinearRgb[], targets: readonly Lab[]): { matrix: Matrix3; residuals: PatchResidual[]; max: number } {
  const p = new Matrix(measured.map((v) => [...v]));
  const r = new Matrix(targets.map((lab) => [...labToLinear(lab)]));
  if (new SingularValueDecomposition(p).rank < 3) {
    throw refused('patches', 'The patches do not hold three independent colours (all greys, or one hue); include coloured patches.');
  }
  const x = solve(p, r);
  const matrix = x.transpose().to2DArray() as Matrix3;
  const residuals = measured.map((v, i) => {
    const fitted = linearToLab(applyMatrix(matrix, v));
    return { lab: labToTuple(targets[i]!), fittedLab: labToTuple(fitted), deltaE00: deltaE00(targets[i]!, fitted) };
  });
  const max = Math.max(...residuals.map((res) => res.deltaE00));
  if (max > PATCH_RESIDUAL_MAX_DE00) {
    const worst = residuals.findIndex((res) => res.deltaE00 === max);
    throw refused(
      'patches',
      `The fit misses patch ${worst + 1} by ΔE00 ${max.toFixed(1)} (at most ${PATCH_RESIDUAL_MAX_DE00} accepted; residuals ${residuals.map((res) => res.deltaE00.toFixed(1)).join(', ')}). ` +
        'Check each region sits on its patch and the target is evenly lit.',
    );
  }
  return { matrix, residuals, max };
}

function refused(field: string, detail: string): AppError {
  return new AppError(400, 'Correction refused', detail, [{ field, message: detail }], 'correction-refused');
}
