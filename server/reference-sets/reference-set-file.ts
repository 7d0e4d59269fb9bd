import { z } from 'zod';
import { OBSERVER_NAME, WHITE_NAME } from '../../shared/colour/constants.js';
import { FIELD_CODE_PATTERN, FINE_CODE_PATTERN, type ReferenceSetFile } from '../../shared/colour/reference-set.js';
import { REFERENCE_SET_ID_PATTERN } from '../../shared/api/reference-set-answers.js';

const finite = z.number().refine(Number.isFinite, { message: 'must be a finite number' });

const chipSchema = z.object({
  code: z.string().refine((c) => FIELD_CODE_PATTERN.test(c) || FINE_CODE_PATTERN.test(c), { message: 'must be F-001 or F-001.001' }),
  parent: z.string().regex(FIELD_CODE_PATTERN).nullable(),
  name: z.string().min(1).max(80),
  lab: z.tuple([finite, finite, finite]),
  hex: z.string().regex(/^#[0-9a-f]{6}$/),
  inGamut: z.boolean(),
});

/** The shape of `reference-colors/reference-set-*.json` (shared/colour/reference-set.ts), checked before loading. */
const fileSchema = z.object({
  id: z.string().regex(REFERENCE_SET_ID_PATTERN),
  version: z.number().int().positive(),
  name: z.string().min(1).max(120),
  white: z.literal(WHITE_NAME),
  observer: z.literal(OBSERVER_NAME),
  generatedBy: z.string(),
  chips: z.array(chipSchema).min(1),
});

/**
 * Reads a reference-set file's JSON, or throws an Error naming the file and what is wrong: its
 * shape, a repeated code, a fine chip whose code or parent does not name a field chip of the file.
 */
export function readReferenceSetFile(json: string, fileName: string): ReferenceSetFile {
  let data: unknown;
  try {
    data = JSON.parse(json);
  } catch (err) {
    throw new Error(`${fileName} is not valid JSON: ${err instanceof Error ? err.message : err}`);
  }
  const result = fileSchema.safeParse(data);
  if (!result.success) {
    const issue = result.error.issues[0]!;
    throw new Error(`${fileName} is not a reference-set file: ${issue.path.join('.') || 'file'} ${issue.message}.`);
  }
  const file = result.data as ReferenceSetFile;
  const codes = new Set<string>();
  for (const chip of file.chips) {
    if (codes.has(chip.code)) throw new Error(`${fileName}: code ${chip.code} appears twice.`);
    codes.add(chip.code);
  }
  for (const chip of file.chips) {
    const field = FIELD_CODE_PATTERN.test(chip.code);
    const consistent = field ? chip.parent === null : chip.parent !== null && chip.code.startsWith(`${chip.parent}.`) && codes.has(chip.parent);
    if (!consistent) throw new Error(`${fileName}: chip ${chip.code} has parent ${chip.parent}, which does not fit its code.`);
  }
  return file;
}
