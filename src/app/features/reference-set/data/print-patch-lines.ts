// The measured patches as typed or pasted from an instrument's export: one patch per line, a chip
// code and L*, a*, b*. Parsed here so a slip is shown on its line before anything is sent.
import type { FieldError } from '../../../../../shared/api/problem.js';
import type { LabTuple } from '../../../../../shared/colour/lab.js';

/** One parsed line. */
export interface PatchLine {
  /** 1-based line number in the text, for messages. */
  line: number;
  chipCode: string;
  lab: LabTuple;
}

/** Lines that parsed, and a message for each that did not. */
export interface ParsedPatchLines {
  patches: PatchLine[];
  problems: string[];
}

const NUMBER = /^[-−+]?\d+(?:[.,]\d+)?$/;

/**
 * "F-190 52.1 −10.3 20.4" per line; spaces, tabs, semicolons or commas between the four values
 * (a comma also works as the decimal mark when the values are separated by spaces or tabs); the
 * code is upper-cased; blank lines are skipped.
 */
export function parsePatchLines(text: string): ParsedPatchLines {
  const patches: PatchLine[] = [];
  const problems: string[] = [];
  text.split(/\r?\n/).forEach((raw, i) => {
    const line = raw.trim();
    if (!line) return;
    const parts = (/[\t ;]/.test(line) ? line.split(/[\t ;]+/) : line.split(',')).filter(Boolean);
    const [code, ...numbers] = parts;
    const values = numbers.map((n) => (NUMBER.test(n) ? Number(n.replace('−', '-').replace(',', '.')) : NaN));
    if (!code || !/^F-\d{3}(\.\d{3})?$/i.test(code) || values.length !== 3 || values.some((v) => !Number.isFinite(v))) {
      problems.push(`Line ${i + 1}: give a chip code (like F-190 or F-190.004) and three numbers, L* a* b*.`);
      return;
    }
    patches.push({ line: i + 1, chipCode: code.toUpperCase(), lab: [values[0]!, values[1]!, values[2]!] });
  });
  return { patches, problems };
}

/** The server's refusals of `patches.<i>.…` as messages naming the line the patch came from. */
export function patchRefusals(errors: readonly FieldError[], patches: readonly PatchLine[]): string[] {
  return errors.map(({ field, message }) => {
    const m = /^patches\.(\d+)\.(.+)$/.exec(field);
    const patch = m ? patches[Number(m[1])] : undefined;
    if (!m || !patch) return `${field} ${message}`;
    const what = m[2]!.startsWith('lab') ? 'CIELAB' : 'chip code';
    return `Line ${patch.line} (${what}): ${message}`;
  });
}
