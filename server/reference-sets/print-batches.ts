// Print batches: a set's field card or fine-chip booklet as printed on one printer and paper, its
// patches re-measured with an instrument and compared with the chips' CIELAB by CIEDE2000. A
// printed patch stands in for its chip only as far as this distance allows. No req/res here.
import { In, type DataSource } from 'typeorm';
import type { CreatePrintBatchBody, AddPrintPatchesBody } from '../../shared/api/print-batches.js';
import { PRINT_CAUTION, type PrintBatchDetail, type PrintBatchDto, type PrintPatchDto, type PrintSummary } from '../../shared/api/print-batch-answers.js';
import { ACCEPTABILITY_THRESHOLD_DE00 } from '../../shared/colour/constants.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import { labFromTuple, type LabTuple } from '../../shared/colour/lab.js';
import { verdictFor } from '../../shared/colour/verdict.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { AppError, type FieldError } from '../core/app-error.js';
import { PrintBatch, PrintPatch } from './print-batch.entity.js';
import type { LoadedSet, ReferenceSets } from './reference-sets.js';

/** The median of some numbers (the mean of the middle two for an even count); null for none. */
export function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const sorted = [...values].sort((p, q) => p - q);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** Median, largest and how many patches lie beyond the acceptability threshold. */
export function printSummary(distances: readonly number[]): PrintSummary {
  return {
    n: distances.length,
    medianDeltaE00: median(distances),
    maxDeltaE00: distances.length ? Math.max(...distances) : null,
    overAcceptable: distances.filter((d) => d > ACCEPTABILITY_THRESHOLD_DE00).length,
  };
}

function patchOf(set: LoadedSet, p: PrintPatch): PrintPatchDto {
  const chip = set.byCode.get(p.chipCode)!;
  const measured: LabTuple = [p.l, p.a, p.b];
  const d = deltaE00(labFromTuple(chip.lab), labFromTuple(measured));
  return { chipCode: chip.code, chipName: chip.name, chipLab: chip.lab, chipHex: chip.hex, measuredLab: measured, measuredHex: displayHex(labFromTuple(measured)).hex, deltaE00: d, verdict: verdictFor(d), measuredAt: p.measuredAt.toISOString() };
}

async function namesOf(ds: DataSource, ids: (number | null)[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((x): x is number => x !== null))];
  return new Map((wanted.length ? await ds.getRepository(User).find({ where: { id: In(wanted) }, select: { id: true, name: true } }) : []).map((u) => [u.id, u.name]));
}

async function detailOf(ds: DataSource, sets: ReferenceSets, batch: PrintBatch, creator: string | null): Promise<PrintBatchDetail> {
  const set = await sets.get(batch.setId);
  const patches = (await ds.getRepository(PrintPatch).find({ where: { batchId: batch.id } })).map((p) => patchOf(set, p));
  patches.sort((p, q) => q.deltaE00 - p.deltaE00 || p.chipCode.localeCompare(q.chipCode));
  return { ...dtoOf(batch, creator, printSummary(patches.map((p) => p.deltaE00))), patches, caution: PRINT_CAUTION };
}

function dtoOf(b: PrintBatch, creator: string | null, summary: PrintSummary): PrintBatchDto {
  return { id: b.id, setId: b.setId, kind: b.kind, printedOn: b.printedOn, note: b.note, createdByName: creator, createdAt: b.createdAt.toISOString(), summary };
}

/** Every print batch, newest print first, each with its summary. */
export async function listPrintBatches(ds: DataSource, sets: ReferenceSets): Promise<PrintBatchDto[]> {
  const batches = await ds.getRepository(PrintBatch).find({ order: { printedOn: 'DESC', id: 'DESC' } });
  const names = await namesOf(ds, batches.map((b) => b.createdById));
  const out: PrintBatchDto[] = [];
  for (const b of batches) {
    const d = await detailOf(ds, sets, b, b.createdById === null ? null : (names.get(b.createdById) ?? null));
    const { patches: _patches, caution: _caution, ...dto } = d;
    out.push(dto);
  }
  return out;
}

/** One batch with its patches; 404 when there is none. */
export async function getPrintBatch(ds: DataSource, sets: ReferenceSets, id: number): Promise<PrintBatchDetail> {
  const batch = await ds.getRepository(PrintBatch).findOneBy({ id });
  if (!batch) throw AppError.notFound(`There is no print batch ${id}.`);
  const names = await namesOf(ds, [batch.createdById]);
  return detailOf(ds, sets, batch, batch.createdById === null ? null : (names.get(batch.createdById) ?? null));
}

/** Records a print batch of a stored set; 400 on `setId` for a set that is not stored, or a print date in the future. */
export async function createPrintBatch(ds: DataSource, sets: ReferenceSets, actor: Actor, body: CreatePrintBatchBody, today = new Date().toISOString().slice(0, 10)): Promise<PrintBatchDetail> {
  const errors: FieldError[] = [];
  if (!(await sets.list()).some((s) => s.id === body.setId)) errors.push({ field: 'setId', message: `reference set ${body.setId} is not loaded` });
  if (body.printedOn > today) errors.push({ field: 'printedOn', message: `is after today (${today})` });
  if (errors.length) throw AppError.badRequest(`The print batch is not valid: ${errors.map((e) => `${e.field} ${e.message}`).join('; ')}.`, errors);
  const id = await ds.transaction(async (m) => {
    const result = await m.insert(PrintBatch, { setId: body.setId, kind: body.kind, printedOn: body.printedOn, note: body.note, createdById: actor.id });
    const newId = Number(result.identifiers[0]!['id']);
    await recordAudit(m, actor, 'print-batch.created', `print-batch:${newId}`, { setId: body.setId, kind: body.kind, printedOn: body.printedOn });
    return newId;
  });
  return getPrintBatch(ds, sets, id);
}

/**
 * Adds measured patches to a batch, all or nothing: 400 naming `patches.<i>.chipCode` for a code
 * not in the batch's set or measured in this batch already. A re-measure of the same print is a
 * new batch, so each batch keeps the numbers it was measured with.
 */
export async function addPrintPatches(ds: DataSource, sets: ReferenceSets, actor: Actor, id: number, body: AddPrintPatchesBody): Promise<PrintBatchDetail> {
  await ds.transaction(async (m) => {
    const batch = await m.findOneBy(PrintBatch, { id });
    if (!batch) throw AppError.notFound(`There is no print batch ${id}.`);
    const set = await sets.get(batch.setId);
    const already = new Set((await m.find(PrintPatch, { where: { batchId: id }, select: { chipCode: true } })).map((p) => p.chipCode));
    const errors: FieldError[] = [];
    body.patches.forEach((p, i) => {
      if (!set.byCode.has(p.chipCode)) errors.push({ field: `patches.${i}.chipCode`, message: `${p.chipCode} is not a chip of set ${batch.setId}` });
      else if (already.has(p.chipCode)) errors.push({ field: `patches.${i}.chipCode`, message: `${p.chipCode} is already measured in this batch; record a re-measure as a new batch` });
    });
    if (errors.length) throw AppError.badRequest(`Nothing was saved: ${errors.map((e) => `${e.field} ${e.message}`).join('; ')}.`, errors);
    await m.insert(PrintPatch, body.patches.map((p) => ({ batchId: id, chipCode: p.chipCode, l: p.lab[0], a: p.lab[1], b: p.lab[2], measuredById: actor.id })));
    await recordAudit(m, actor, 'print-batch.measured', `print-batch:${id}`, { patches: body.patches.length });
  });
  return getPrintBatch(ds, sets, id);
}
