// Words for the characterisation record, kept out of the templates so they can be tested.
import type { CharacterProfile, DescriptorSummary, ProfilePhoto, ProfileSetChip } from '../../../../../shared/api/profile-answers.js';
import type { UnitSystem } from '../../../../../shared/units/units.js';
import { deltaEText, formatNumber } from '../../../shared/chips/chip-words';

/** "8 readings by 2 observers on 3 plants" (the basis), with how many are approved when that is the basis. */
export function countsText(c: Pick<CharacterProfile, 'basis' | 'nReadings' | 'nObservers' | 'nPlants' | 'nCurrent'>): string {
  const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
  const basis = c.basis === 'approved' ? `${plural(c.nReadings, 'approved reading', 'approved readings')} of ${c.nCurrent}` : plural(c.nReadings, 'reading', 'readings');
  return `${basis} by ${plural(c.nObservers, 'observer', 'observers')} on ${plural(c.nPlants, 'plant', 'plants')}`;
}

/** "F-182.063 deep red-purple, ΔE00 0.62 (indistinguishable)". */
export function chipText(c: Pick<CharacterProfile, 'chip'>): string {
  return `${c.chip.code} ${c.chip.name}, ΔE00 ${deltaEText(c.chip.deltaE00)} (${c.chip.verdict})`;
}

/** "In set v2 (current): F-301.017 plum 40 · 22, ΔE00 0.41", saying which set the record above is shown in. */
export function setChipText(s: ProfileSetChip): string {
  const marks = [s.current ? 'current' : '', s.shown ? 'shown above' : ''].filter(Boolean);
  return `In set ${s.setId}${marks.length ? ` (${marks.join(', ')})` : ''}: ${s.chip.code} ${s.chip.name}, ΔE00 ${deltaEText(s.chip.deltaE00)}`;
}

/** "steady across 3 season groups and 2 sites", or how many differences are flagged. */
export function stabilityText(c: Pick<CharacterProfile, 'flags' | 'seasons' | 'sites'>): string {
  const drift = c.flags.filter((f) => f.kind === 'season-drift').length;
  const site = c.flags.filter((f) => f.kind === 'site-difference').length;
  if (!drift && !site) return `steady across ${c.seasons.length} season ${c.seasons.length === 1 ? 'group' : 'groups'} and ${c.sites.length} ${c.sites.length === 1 ? 'site' : 'sites'}`;
  const parts = [drift ? `${drift} season ${drift === 1 ? 'change' : 'changes'}` : '', site ? `${site} site ${site === 1 ? 'difference' : 'differences'} within a season` : ''];
  return `flagged: ${parts.filter(Boolean).join(' and ')}`;
}

/** A descriptor's summary in the person's units: "median 101.6 cm (96.5–106.7 cm, 4 plants)" or "Level (3 of 4 plants)". */
export function descriptorText(d: DescriptorSummary, system: UnitSystem): string {
  const plants = `${d.n} ${d.n === 1 ? 'plant' : 'plants'}`;
  if (d.kind === 'category') {
    const count = Math.round((d.share ?? 0) * d.n);
    return `${d.modeLabel ?? '—'} (${count} of ${plants})`;
  }
  if (!d.formatted) return '—';
  if (d.n === 1) return `${d.formatted.median[system]} (1 plant)`;
  return `median ${d.formatted.median[system]} (${d.formatted.min[system]} – ${d.formatted.max[system]}, ${plants})`;
}

/**
 * CSS for showing the photo crop in a square box of `size` pixels: the display image scaled so the
 * region's box fills the square (the longer side fits), centred on the region.
 */
export function cropStyle(photo: ProfilePhoto, size: number): { backgroundSize: string; backgroundPosition: string } {
  const side = Math.max(photo.box.width, photo.box.height, 1);
  const scale = size / side;
  const cx = photo.box.x + photo.box.width / 2;
  const cy = photo.box.y + photo.box.height / 2;
  return {
    backgroundSize: `${formatNumber(photo.width * scale, 1)}px ${formatNumber(photo.height * scale, 1)}px`,
    backgroundPosition: `${formatNumber(size / 2 - cx * scale, 1).replace('−', '-')}px ${formatNumber(size / 2 - cy * scale, 1).replace('−', '-')}px`,
  };
}
