// The numbers of a calibration session: agreement (Fleiss' κ over field chips, Cohen's κ for each
// pair of observers), each observer's mean ΔE00 and bias against the specimens' reference colours,
// and who meets the thresholds. Pure: the caller loads the rows (calibration-load.ts).
import type {
  CalibrationResults,
  ChipCount,
  ObserverResult,
  PairAgreement,
  ScreeningSummary,
  SpecimenAgreement,
  SpecimenPick,
} from '../../shared/api/calibration-answers.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import type { Lab, LabTuple } from '../../shared/colour/lab.js';
import { cohenKappa, pairTable } from '../../shared/stats/cohen-kappa.js';
import { countTable, fleissKappa, subjectAgreement } from '../../shared/stats/fleiss-kappa.js';
import { fleissKappaInterval } from '../../shared/stats/kappa-interval.js';
import { landisKochBand } from '../../shared/stats/landis-koch.js';
import { failedRules, observerAdvice, sampleWarnings } from './calibration-advice.js';

/** What the results are computed from. */
export interface ResultsInput {
  session: { id: number; title: string; status: 'open' | 'closed'; referenceSetId: string; kappaThreshold: number; deltaE00Threshold: number };
  /** In position order. */
  specimens: { id: number; label: string; position: number; lab: Lab; referenceFieldCode: string }[];
  /** Everybody invited or answering, in the order rows are shown. */
  observers: { userId: number; name: string }[];
  responses: { specimenId: number; observerId: number; chipCode: string; fieldCode: string; lab: Lab }[];
  /** Observers with a stored certification from this session. */
  certified: ReadonlySet<number>;
  /** Each user's latest screening; missing: not screened. */
  screenings: ReadonlyMap<number, ScreeningSummary>;
  /** When these numbers count from (now while open, the close time after). */
  computedAt: Date;
}

/** One observer's answer against its specimen's reference. */
export interface Scored {
  specimenId: number;
  observerId: number;
  chipCode: string;
  fieldCode: string;
  deltaE00: number;
  delta: LabTuple;
  fieldHit: boolean;
}

/** Computes the whole results table of a session. */
export function computeResults(input: ResultsInput): CalibrationResults {
  const { session, specimens, observers } = input;
  const specimenById = new Map(specimens.map((s) => [s.id, s]));
  const scored: Scored[] = input.responses.flatMap((r) => {
    const specimen = specimenById.get(r.specimenId);
    return specimen ? [score(r, specimen)] : [];
  });

  const picks = specimens.map((s) => scored.filter((x) => x.specimenId === s.id).map((x) => x.fieldCode));
  const { table } = countTable(picks);
  const fleiss = fleissKappa(table.length ? table : [[]]);
  const kappa = fleiss.kappa;
  const band = kappa === null ? null : landisKochBand(kappa);
  const kappaInterval = kappa === null ? null : fleissKappaInterval(table);

  const observerRows = observers.map((o) => observerRow(o, scored, specimens.length, kappa, input));
  return {
    sessionId: session.id,
    title: session.title,
    status: session.status,
    referenceSetId: session.referenceSetId,
    thresholds: { kappa: session.kappaThreshold, deltaE00: session.deltaE00Threshold },
    fleissKappa: kappa,
    band,
    kappaSpecimens: fleiss.subjects,
    kappaInterval,
    sampleWarnings: sampleWarnings(fleiss.subjects, observers.length, kappaInterval, session.kappaThreshold),
    observedAgreement: kappa === null ? null : fleiss.observed,
    chanceAgreement: kappa === null ? null : fleiss.chance,
    progress: { specimens: specimens.length, observers: observers.length, responses: scored.length, expected: specimens.length * observers.length },
    observers: observerRows,
    specimens: specimens.map((s, i) => specimenRow(s, scored.filter((x) => x.specimenId === s.id), picks[i]!, observers, input.responses)),
    pairs: pairRows(observers, specimens, scored),
    computedAt: input.computedAt.toISOString(),
  };
}

/** ΔE00 (CIEDE2000) and the signed difference of the picked chip from the reference, chip minus reference. */
export function score(r: ResultsInput['responses'][number], specimen: ResultsInput['specimens'][number]): Scored {
  return {
    specimenId: r.specimenId,
    observerId: r.observerId,
    chipCode: r.chipCode,
    fieldCode: r.fieldCode,
    deltaE00: deltaE00(specimen.lab, r.lab),
    delta: [r.lab.l - specimen.lab.l, r.lab.a - specimen.lab.a, r.lab.b - specimen.lab.b],
    fieldHit: r.fieldCode === specimen.referenceFieldCode,
  };
}

function mean(values: readonly number[]): number | null {
  return values.length ? values.reduce((s, v) => s + v, 0) / values.length : null;
}

function observerRow(o: { userId: number; name: string }, scored: readonly Scored[], specimenCount: number, kappa: number | null, input: ResultsInput): ObserverResult {
  const own = scored.filter((x) => x.observerId === o.userId);
  const n = own.length;
  const meanDeltaE00 = mean(own.map((x) => x.deltaE00));
  // Bias is the mean signed difference per axis (ΔL*, Δa*, Δb*), chip minus reference: positive
  // ΔL* reads lighter, positive Δa* redder, negative Δb* bluer than the specimen is.
  const bias: LabTuple | null = n ? [0, 1, 2].map((k) => mean(own.map((x) => x.delta[k]!))!) as LabTuple : null;
  const complete = specimenCount > 0 && n === specimenCount;
  const { kappaThreshold, deltaE00Threshold } = input.session;
  const qualifies = complete && kappa !== null && kappa >= kappaThreshold && meanDeltaE00 !== null && meanDeltaE00 <= deltaE00Threshold;
  const fieldHitRate = n ? own.filter((x) => x.fieldHit).length / n : null;
  const missedLabels = own.filter((x) => !x.fieldHit).map((x) => input.specimens.find((s) => s.id === x.specimenId)?.label ?? '');
  const advice = { n, specimens: specimenCount, meanDeltaE00, fieldHitRate, bias, kappa, thresholds: { kappa: kappaThreshold, deltaE00: deltaE00Threshold }, missedLabels };
  return {
    userId: o.userId,
    name: o.name,
    n,
    complete,
    meanDeltaE00,
    bias,
    fieldHitRate,
    qualifies,
    certified: input.certified.has(o.userId),
    screening: input.screenings.get(o.userId) ?? null,
    failedRules: qualifies ? [] : failedRules(advice),
    advice: observerAdvice(advice),
  };
}

function specimenRow(s: ResultsInput['specimens'][number], answers: readonly Scored[], fieldPicks: readonly string[], observers: ResultsInput['observers'], responses: ResultsInput['responses']): SpecimenAgreement {
  const picks: SpecimenPick[] = observers.flatMap((o) => {
    const a = answers.find((x) => x.observerId === o.userId);
    const r = responses.find((x) => x.observerId === o.userId && x.specimenId === s.id);
    if (!a || !r) return [];
    return [{ userId: o.userId, name: o.name, chipCode: a.chipCode, fieldCode: a.fieldCode, chipHex: displayHex(r.lab).hex, deltaE00: a.deltaE00, fieldHit: a.fieldHit }];
  });
  const counts = new Map<string, number>();
  for (const code of fieldPicks) counts.set(code, (counts.get(code) ?? 0) + 1);
  const countList: ChipCount[] = [...counts].map(([fieldCode, count]) => ({ fieldCode, count })).sort((a, b) => b.count - a.count || a.fieldCode.localeCompare(b.fieldCode));
  return {
    specimenId: s.id,
    label: s.label,
    position: s.position,
    referenceLab: [s.lab.l, s.lab.a, s.lab.b],
    referenceHex: displayHex(s.lab).hex,
    referenceFieldCode: s.referenceFieldCode,
    n: answers.length,
    counts: countList,
    agreement: subjectAgreement(countList.map((c) => c.count)),
    meanDeltaE00: mean(answers.map((x) => x.deltaE00)),
    picks,
  };
}

function pairRows(observers: ResultsInput['observers'], specimens: ResultsInput['specimens'], scored: readonly Scored[]): PairAgreement[] {
  const pickOf = (observerId: number) => specimens.map((s) => scored.find((x) => x.observerId === observerId && x.specimenId === s.id)?.fieldCode ?? null);
  const rows: PairAgreement[] = [];
  for (let i = 0; i < observers.length; i++) {
    for (let j = i + 1; j < observers.length; j++) {
      const a = observers[i]!;
      const b = observers[j]!;
      const t = pairTable(pickOf(a.userId), pickOf(b.userId));
      const kappa = t.n ? cohenKappa(t.table) : null;
      const agreeing = t.table.reduce((s, row, k) => s + row[k]!, 0);
      rows.push({ a: a.userId, b: b.userId, aName: a.name, bName: b.name, n: t.n, kappa, band: kappa === null ? null : landisKochBand(kappa), observedAgreement: t.n ? agreeing / t.n : null });
    }
  }
  return rows;
}
