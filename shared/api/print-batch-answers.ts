// Answers of the print-batch routes: a printed field card or booklet re-measured with an
// instrument, patch by patch, and how far each printed patch is from its chip. No zod here, so the
// client may import them; the body schemas are in print-batches.ts.
import type { LabTuple } from '../colour/lab.js';
import type { Verdict } from '../colour/verdict.js';

/** What was printed. */
export const PRINT_KINDS = ['card', 'booklet'] as const;
export type PrintKind = (typeof PRINT_KINDS)[number];

/** Most patches one request may add (the card holds a few hundred field chips; our own bound). */
export const PRINT_PATCHES_MAX = 500;
/** Longest printer/paper note. */
export const PRINT_NOTE_MAX = 500;

/** The caution shown wherever printed colours are compared. */
export const PRINT_CAUTION =
  'Printed and on-screen colours are approximate: printers, paper, ink batches and ageing all move them. Trust the chip codes and the CIELAB values; use a printed patch only as far as its ΔE00 from the chip allows, and re-measure each print batch.';

/** How far a batch's measured patches are from their chips. */
export interface PrintSummary {
  /** Patches measured. */
  n: number;
  /** Median and largest ΔE00 (CIEDE2000) of the measured patches from their chips; null before any is measured. */
  medianDeltaE00: number | null;
  maxDeltaE00: number | null;
  /** Patches further than ΔE00 1.8 (the acceptability threshold) from their chip. */
  overAcceptable: number;
}

/** One print batch as listed. */
export interface PrintBatchDto {
  id: number;
  setId: string;
  kind: PrintKind;
  /** ISO date "YYYY-MM-DD" the batch was printed. */
  printedOn: string;
  /** Printer, paper, ink, settings. */
  note: string;
  createdByName: string | null;
  /** ISO 8601. */
  createdAt: string;
  summary: PrintSummary;
}

/** One printed patch measured: the chip's CIELAB, the measured CIELAB, their ΔE00. */
export interface PrintPatchDto {
  chipCode: string;
  chipName: string;
  chipLab: LabTuple;
  chipHex: string;
  measuredLab: LabTuple;
  /** Display hex of the measured colour, gamut-mapped when out of sRGB. */
  measuredHex: string;
  deltaE00: number;
  verdict: Verdict;
  /** ISO 8601. */
  measuredAt: string;
}

/** `GET /api/print-batches/:id`: the batch and every patch measured, furthest first. */
export interface PrintBatchDetail extends PrintBatchDto {
  patches: PrintPatchDto[];
  caution: string;
}
