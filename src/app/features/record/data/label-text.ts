// Reading an accession (and plant) out of a label's text, typed or pasted from the phone's own
// text recognition: labels carry the accession number and often the plant label beside it.
import type { Accession, Plant } from '../../../../../shared/api/collection-answers.js';

/** What a label's text names. */
export interface LabelMatch {
  accession: Accession;
  /** The plant whose label follows the number on the label, if one does. */
  plant: Plant | null;
}

/** Upper case, letters and digits only, so "hl 0001", "HL-0001" and "HL0001" read alike. */
function squash(text: string): string {
  return text.toUpperCase().replace(/[^A-Z0-9]/g, '');
}

/**
 * The accession whose number appears in the text (the longest number wins, so HL-0012 is not read
 * as HL-001), not running on into further digits; then the plant whose label comes right after it.
 * Null when no accession number is in the text.
 */
export function readLabel(text: string, accessions: readonly Accession[]): LabelMatch | null {
  const squashed = squash(text);
  if (!squashed) return null;
  let best: { accession: Accession; end: number; length: number } | null = null;
  for (const accession of accessions) {
    const number = squash(accession.accessionNumber);
    if (!number) continue;
    for (let at = squashed.indexOf(number); at >= 0; at = squashed.indexOf(number, at + 1)) {
      const end = at + number.length;
      if (runsOn(number, squashed[end])) continue;
      if (!best || number.length > best.length) best = { accession, end, length: number.length };
      break;
    }
  }
  if (!best) return null;
  return { accession: best.accession, plant: plantAfter(squashed.slice(best.end), best.accession.plants) };
}

/** Whether the character after a match continues it (a digit after a number ending in a digit). */
function runsOn(number: string, next: string | undefined): boolean {
  if (next === undefined) return false;
  return /\d/.test(number.at(-1)!) && /\d/.test(next);
}

/** The plant whose squashed label starts the rest of the text (longest first), not running on into more digits. */
function plantAfter(rest: string, plants: readonly Plant[]): Plant | null {
  const ordered = [...plants].sort((a, b) => squash(b.label).length - squash(a.label).length);
  for (const plant of ordered) {
    const label = squash(plant.label);
    if (label && rest.startsWith(label) && !runsOn(label, rest[label.length])) return plant;
  }
  return null;
}

/** Accessions whose number or any name contains the typed text (case and separators ignored), number matches first. */
export function filterAccessions(text: string, accessions: readonly Accession[], limit = 20): Accession[] {
  const query = text.trim().toLowerCase();
  if (!query) return accessions.slice(0, limit);
  const squashedQuery = squash(query);
  const byNumber: Accession[] = [];
  const byName: Accession[] = [];
  for (const accession of accessions) {
    if (squashedQuery && squash(accession.accessionNumber).includes(squashedQuery)) byNumber.push(accession);
    else if ([accession.name, ...accession.otherNames].some((name) => name.toLowerCase().includes(query))) byName.push(accession);
  }
  return [...byNumber, ...byName].slice(0, limit);
}
