// Finding chips of a session's reference set by code, and the field chip a colour belongs to.
import type { ChipDto } from '../../shared/api/reference-set-answers.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { labFromTuple, type Lab } from '../../shared/colour/lab.js';
import { AppError } from '../core/app-error.js';
import type { LoadedSet } from '../reference-sets/reference-sets.js';

const indexes = new WeakMap<LoadedSet, Map<string, ChipDto>>();
const fieldChips = new WeakMap<LoadedSet, ChipDto[]>();

/** The set's chips by code, built once per loaded set. */
function byCode(set: LoadedSet): Map<string, ChipDto> {
  let index = indexes.get(set);
  if (!index) {
    index = new Map(set.chips.map((c) => [c.code, c]));
    indexes.set(set, index);
  }
  return index;
}

/** The chip with this code; a 400 naming `field` when the set has none. */
export function chipOf(set: LoadedSet, code: string, field = 'chipCode'): ChipDto {
  const chip = byCode(set).get(code);
  if (!chip) throw AppError.badRequest(`${code} is not a chip of reference set ${set.summary.id}.`, [{ field, message: `is not a chip of reference set ${set.summary.id}` }]);
  return chip;
}

/**
 * The field chip of a chip: its parent for a fine chip, itself for a field chip. Kappa counts
 * agreement on field chips, the ones printed on the card: with thousands of fine chips two
 * observers rarely pick the same one even when they see the same colour, so fine-chip agreement
 * would say more about the set's density than about the observers (our own reasoning, no source).
 */
export function fieldCodeOf(chip: ChipDto): string {
  return chip.parent ?? chip.code;
}

/** The field chip nearest a colour by ΔE00: the category a specimen's reference falls in. A scan over the set's field chips (a few hundred). */
export function nearestFieldChip(set: LoadedSet, lab: Lab): ChipDto {
  let fields = fieldChips.get(set);
  if (!fields) {
    fields = set.chips.filter((c) => c.parent === null);
    fieldChips.set(set, fields);
  }
  let best: ChipDto | null = null;
  let bestDe = Infinity;
  for (const chip of fields) {
    const de = deltaE00(lab, labFromTuple(chip.lab));
    if (de < bestDe) [best, bestDe] = [chip, de];
  }
  if (!best) throw new AppError(503, 'No field chips', `Reference set ${set.summary.id} has no field chips.`, undefined, 'no-field-chips');
  return best;
}
