import type { LabTuple } from './lab.js';

/** One chip of a reference set as stored in `reference-colors/reference-set-v*.json`. */
export interface ReferenceChip {
  /** `F-001` for a field chip, `F-001.001` for a fine chip inside field chip F-001's cell. */
  code: string;
  /** The field chip whose cell a fine chip lies in; `null` for a field chip. */
  parent: string | null;
  /** The name written into the file; shown names are derived (`chipName` in chip-name.ts). */
  name: string;
  /** CIELAB D65, 2° observer, two decimals. */
  lab: LabTuple;
  /** Display hex, gamut-mapped when out of sRGB. */
  hex: string;
  /** Whether the chip lies inside the sRGB gamut. */
  inGamut: boolean;
}

/** A reference-set file. A new version is a new file with a new id; old files are never rewritten. */
export interface ReferenceSetFile {
  id: string;
  version: number;
  name: string;
  white: 'D65';
  observer: '2°';
  /** The script that wrote the file, as a repository path. */
  generatedBy: string;
  chips: ReferenceChip[];
}

/** Field-chip code pattern, `F-` and three digits. */
export const FIELD_CODE_PATTERN = /^F-\d{3}$/;
/** Fine-chip code pattern, a field code, a dot and three digits. */
export const FINE_CODE_PATTERN = /^F-\d{3}\.\d{3}$/;
