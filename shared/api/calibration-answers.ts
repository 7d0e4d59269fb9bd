// Answer and request types of the calibration routes (`/api/calibration/…`). No zod here, so the
// client can import them cheaply; the request schemas are in calibration.ts.
import type { z } from 'zod';
import type { CreateResponseBody, CreateScreeningBody, createSessionBody, CreateSpecimenBody, InviteParticipantsBody } from './calibration.js';
import type { LabTuple } from '../colour/lab.js';
import type { Region } from '../photo/region.js';
import type { KappaInterval } from '../stats/kappa-interval.js';
import type { KappaBand } from '../stats/landis-koch.js';
import { ACCEPTABILITY_THRESHOLD_DE00 } from '../colour/constants.js';

export type { KappaInterval } from '../stats/kappa-interval.js';

export { KAPPA_BANDS, KAPPA_BAND_LABELS, type KappaBand } from '../stats/landis-koch.js';

/**
 * Default thresholds for certification: the group's Fleiss κ at least 0.61, the lower edge of
 * Landis & Koch's (1977) "substantial" band, and the observer's mean ΔE00 at most 1.8, the 50:50 %
 * acceptability threshold of Paravina et al. (2015) borrowed from dental colour science.
 */
export const CALIBRATION_DEFAULT_THRESHOLDS = { kappa: 0.61, deltaE00: ACCEPTABILITY_THRESHOLD_DE00 } as const;

/** Longest session title and specimen label (our own). */
export const CALIBRATION_TITLE_MAX = 120;
export const SPECIMEN_LABEL_MAX = 80;
/** Most specimens in one session, and most users invited in one request (our own). */
export const SPECIMENS_MAX = 200;
export const INVITE_MAX = 200;
/** Longest screening note (our own). */
export const SCREENING_NOTES_MAX = 1000;

/** `open`: trainees answer, results are live for trainers. `closed`: frozen, certifications stored. */
export const CALIBRATION_STATUSES = ['open', 'closed'] as const;
export type CalibrationStatus = (typeof CALIBRATION_STATUSES)[number];

/** Where a specimen's reference colour came from. */
export const SPECIMEN_SOURCES = ['lab', 'photo', 'chip'] as const;
export type SpecimenSource = (typeof SPECIMEN_SOURCES)[number];

/** Colour-vision screening methods, self-reported (generic names of the kinds of test). */
export const SCREENING_METHODS = ['pseudoisochromatic-plates', 'anomaloscope', 'arrangement-test', 'other'] as const;
export type ScreeningMethod = (typeof SCREENING_METHODS)[number];
export const SCREENING_METHOD_LABELS: Readonly<Record<ScreeningMethod, string>> = {
  'pseudoisochromatic-plates': 'Dot-pattern plates',
  anomaloscope: 'Anomaloscope',
  'arrangement-test': 'Arrangement (hue-ordering) test',
  other: 'Other',
};
export const SCREENING_RESULTS = ['normal', 'deficient', 'unsure'] as const;
export type ScreeningResult = (typeof SCREENING_RESULTS)[number];

/** Certification thresholds of one session. */
export interface CalibrationThresholds {
  /** The group's Fleiss κ must be at least this. */
  kappa: number;
  /** The observer's mean ΔE00 must be at most this. */
  deltaE00: number;
}

/** `POST /api/calibration/sessions` body (trainer, admin) → `CreatedId`. */
export type CreateCalibrationSessionRequest = z.input<typeof createSessionBody>;

/** `POST /api/calibration/sessions/:id/specimens` body (trainer, admin; 409 when closed) → `CreatedId`. Exactly one colour source. */
export type CreateSpecimenRequest = CreateSpecimenBody;

/** `POST /api/calibration/sessions/:id/responses` body: the signed-in observer's pick for one specimen. */
export type CreateResponseRequest = CreateResponseBody;

/** `POST /api/calibration/sessions/:id/participants` body (trainer, admin; 409 when closed). */
export type InviteParticipantsRequest = InviteParticipantsBody;

/** `POST /api/calibration/screenings` body: an observer records their own; trainers and admins anyone's. */
export type CreateScreeningRequest = CreateScreeningBody;

/** Answer of the create routes. */
export interface CreatedId {
  id: number;
}

/** `POST …/responses` answer. */
export interface ResponseCreated {
  id: number;
  /** Whether this pick replaced the observer's earlier pick for the specimen. */
  replaced: boolean;
}

/** `POST …/participants` answer: the whole invited list after the change. */
export interface ParticipantsAnswer {
  /** How many of the users given were not yet invited. */
  added: number;
  /** How many of those were told by mail (each also gets an in-app notice). */
  mailed: number;
  participants: Participant[];
}

/** Someone invited to a session or who answered in it. */
export interface Participant {
  userId: number;
  name: string;
  /** Whether a trainer invited them (as against joining an unrestricted session by answering). */
  invited: boolean;
  /** How many specimens they have answered. */
  responses: number;
}

/** A session as listed (`GET /api/calibration/sessions`). */
export interface CalibrationSessionSummary {
  id: number;
  title: string;
  /** "YYYY-MM-DD". */
  heldOn: string;
  referenceSetId: string;
  restricted: boolean;
  status: CalibrationStatus;
  thresholds: CalibrationThresholds;
  createdById: number;
  createdByName: string;
  /** ISO 8601. */
  createdAt: string;
  closedAt: string | null;
  specimenCount: number;
  /** Invited or answered. */
  participantCount: number;
  responseCount: number;
  /** Whether the caller may answer now (open, and unrestricted or invited). */
  canRespond: boolean;
  /** How many specimens the caller has answered. */
  myResponseCount: number;
}

/**
 * A specimen as `GET /api/calibration/sessions/:id` shows it. For a caller who is not a trainer
 * or admin, while the session is open, the reference colour and its source (`referenceLab`,
 * `referenceHex`, `chipCode`, `photoId`, `region`) are null: trainees must not see the answer.
 */
export interface SpecimenView {
  id: number;
  label: string;
  /** 1-based order in the session. */
  position: number;
  source: SpecimenSource;
  referenceLab: LabTuple | null;
  referenceHex: string | null;
  /** The chip the reference came from (`source` chip). */
  chipCode: string | null;
  /** The photo and region it was sampled from (`source` photo). */
  photoId: number | null;
  region: Region | null;
}

/** One pick of the caller. */
export interface MyPick {
  specimenId: number;
  chipCode: string;
  /** ISO 8601 of the latest pick. */
  respondedAt: string;
}

/** `GET /api/calibration/sessions/:id`: the session with its specimens and the caller's own picks. */
export interface CalibrationSessionDetail extends CalibrationSessionSummary {
  specimens: SpecimenView[];
  /** The caller's current picks; never anybody else's. */
  myPicks: MyPick[];
  /** Everybody invited or answering; only for trainers and admins (empty for others). */
  participants: Participant[];
}

/** A colour-vision screening as results and certifications show it; `null` there means "not screened". */
export interface ScreeningSummary {
  /** "YYYY-MM-DD". */
  screenedOn: string;
  method: ScreeningMethod;
  result: ScreeningResult;
}

/** One observer's row of the results. */
export interface ObserverResult {
  userId: number;
  name: string;
  /** Specimens answered. */
  n: number;
  /** Whether they answered every specimen (needed for certification). */
  complete: boolean;
  /** Mean ΔE00 (CIEDE2000) of their picked chips from the specimens' reference colours; null when n = 0. */
  meanDeltaE00: number | null;
  /** Mean [ΔL*, Δa*, Δb*], picked chip minus reference; null when n = 0. */
  bias: LabTuple | null;
  /** Share of their answers whose field chip is the reference's field chip; null when n = 0. */
  fieldHitRate: number | null;
  /** Whether they meet every rule now: complete, group κ ≥ threshold, own mean ΔE00 ≤ threshold. */
  qualifies: boolean;
  /** Whether a certification was stored for them at close (always false while open). */
  certified: boolean;
  /** Their latest colour-vision screening; null: not screened. */
  screening: ScreeningSummary | null;
  /** Each certification rule they do not meet now, in plain words; empty when they qualify. */
  failedRules: FailedRule[];
  /** What to tell them: one or two sentences on what their figures mean and what to practise. */
  advice: string;
}

/** The certification rules an observer can fail. */
export const CERTIFICATION_RULES = ['complete', 'kappa', 'deltaE00'] as const;
export type CertificationRule = (typeof CERTIFICATION_RULES)[number];

/** One rule not met, e.g. `{rule: 'deltaE00', text: 'mean ΔE00 3.33 is above the limit 1.8'}`. */
export interface FailedRule {
  rule: CertificationRule;
  text: string;
}

/** One observer's pick for a specimen, beside the reference. */
export interface SpecimenPick {
  userId: number;
  name: string;
  chipCode: string;
  fieldCode: string;
  /** Display hex of the picked chip (approximate on screen). */
  chipHex: string;
  /** ΔE00 (CIEDE2000) of the picked chip from the reference. */
  deltaE00: number;
  /** Whether its field chip is the reference's field chip. */
  fieldHit: boolean;
}

/** How many observers picked one field chip for a specimen. */
export interface ChipCount {
  fieldCode: string;
  count: number;
}

/** Agreement on one specimen. */
export interface SpecimenAgreement {
  specimenId: number;
  label: string;
  position: number;
  referenceLab: LabTuple;
  referenceHex: string;
  /** The field chip of the reference: the source chip's field chip, else the nearest field chip by ΔE00. */
  referenceFieldCode: string;
  /** Answers for this specimen. */
  n: number;
  /** Answers by field chip, most picked first, then by code. */
  counts: ChipCount[];
  /** Fleiss's P_i: the share of agreeing ordered pairs of raters; null when n < 2. */
  agreement: number | null;
  /** Mean ΔE00 of the answers from the reference; null when n = 0. */
  meanDeltaE00: number | null;
  /** Every observer's pick, in the order observers are listed. */
  picks: SpecimenPick[];
}

/** Cohen's κ (unweighted) for two observers over the specimens both answered. */
export interface PairAgreement {
  a: number;
  b: number;
  aName: string;
  bName: string;
  /** Specimens both answered. */
  n: number;
  /** Null when n = 0 or κ is undefined (both always picked one same category: no chance model). */
  kappa: number | null;
  band: KappaBand | null;
  /** Share of those specimens where both picked the same field chip; null when n = 0. */
  observedAgreement: number | null;
}

/** Responses in against responses expected. */
export interface CalibrationProgress {
  specimens: number;
  /** Participants (invited or answering). */
  observers: number;
  responses: number;
  /** specimens × observers. */
  expected: number;
}

/** `GET /api/calibration/sessions/:id/results` (trainer, admin; live while open). */
export interface CalibrationResults {
  sessionId: number;
  title: string;
  status: CalibrationStatus;
  referenceSetId: string;
  thresholds: CalibrationThresholds;
  /**
   * Fleiss' κ over field chips: observed agreement over the specimens with at least two
   * answers, chance shares over every answered specimen (Gwet's generalisation for missing
   * answers, shared/stats/fleiss-kappa.ts); null when no specimen has two answers or κ is
   * undefined (every answer the same field chip, so chance agreement is 1).
   */
  fleissKappa: number | null;
  band: KappaBand | null;
  /** Specimens that entered κ (answered by at least two observers). */
  kappaSpecimens: number;
  /** The 95 % interval of κ (percentile bootstrap over specimens, shared/stats/kappa-interval.ts); null with κ or when too few specimens. */
  kappaInterval: KappaInterval | null;
  /**
   * Why these answers are too few to judge the group by, in plain words (fewer specimens or
   * observers than our rule of thumb, or an interval that spans the threshold); empty when none.
   */
  sampleWarnings: string[];
  /** Mean P_i and P_e behind κ, for the trainer who checks by hand; null with κ. */
  observedAgreement: number | null;
  chanceAgreement: number | null;
  progress: CalibrationProgress;
  observers: ObserverResult[];
  specimens: SpecimenAgreement[];
  pairs: PairAgreement[];
  /** ISO 8601: when these numbers were computed (live) or the session closed. */
  computedAt: string;
}

/** One specimen of `results/me`: the observer's pick against the reference. */
export interface MySpecimenResult {
  specimenId: number;
  label: string;
  position: number;
  referenceLab: LabTuple;
  referenceHex: string;
  referenceFieldCode: string;
  /** Null when the observer did not answer it. */
  chipCode: string | null;
  chipLab: LabTuple | null;
  chipHex: string | null;
  deltaE00: number | null;
  /** Picked chip minus reference, [ΔL*, Δa*, Δb*]. */
  delta: LabTuple | null;
  /** Whether the pick's field chip is the reference's field chip. */
  fieldHit: boolean | null;
}

/** `GET /api/calibration/sessions/:id/results/me`: only once closed (409 before). */
export interface MyCalibrationResult {
  sessionId: number;
  title: string;
  referenceSetId: string;
  closedAt: string;
  thresholds: CalibrationThresholds;
  fleissKappa: number | null;
  band: KappaBand | null;
  observer: ObserverResult;
  specimens: MySpecimenResult[];
  certification: Certification | null;
}

/** A stored certification (`GET /api/calibration/certifications`). */
export interface Certification {
  id: number;
  userId: number;
  name: string;
  referenceSetId: string;
  sessionId: number;
  sessionTitle: string;
  /** "YYYY-MM-DD": the day the session closed. */
  certifiedOn: string;
  /** The group's Fleiss κ and the observer's mean ΔE00 and answers at close. */
  kappa: number;
  meanDeltaE00: number;
  n: number;
  thresholds: CalibrationThresholds;
  /** Their latest colour-vision screening now; null: not screened. */
  screening: ScreeningSummary | null;
  /** "YYYY-MM-DD": the last day it holds unless it lapses sooner (`certifiedOn` + CERTIFICATION_VALID_MONTHS). */
  validUntil: string;
  /** `current`, or `lapsed` by time or by a failed later session. */
  status: CertificationStatus;
  /** "YYYY-MM-DD" it lapsed; null while current. */
  lapsedOn: string | null;
  /** Why it lapsed, in words; null while current. */
  lapseReason: string | null;
}

/**
 * How long a certification holds: 12 months. Our own choice (common practice for refresher
 * calibration of visual colour assessors, no source): colour judgement drifts and sets change.
 */
export const CERTIFICATION_VALID_MONTHS = 12;

export const CERTIFICATION_STATUSES = ['current', 'lapsed'] as const;
export type CertificationStatus = (typeof CERTIFICATION_STATUSES)[number];

/** An observer's standing on the Certificates tab: current, lapsed, or never certified. */
export type ObserverStanding = 'current' | 'lapsed' | 'never';

/** `GET /api/calibration/standings` (trainer, admin): every active user, by name. */
export interface ObserverStandingRow {
  userId: number;
  name: string;
  role: string;
  standing: ObserverStanding;
  /** Their latest certification, if any. */
  latest: Certification | null;
}

/** A colour-vision screening record (`GET /api/calibration/screenings`, newest first). */
export interface Screening extends ScreeningSummary {
  id: number;
  userId: number;
  name: string;
  notes: string | null;
  recordedById: number;
  recordedByName: string;
  /** ISO 8601. */
  createdAt: string;
}

/** `POST /api/calibration/sessions/:id/close` answer (trainer, admin; 409 when already closed). */
export interface CloseSessionAnswer {
  /** The results as frozen at close. */
  results: CalibrationResults;
  /** Ids of the observers certified by this session. */
  certifiedUserIds: number[];
  /** Participants told by mail that their results are out, and how many mails failed to send. */
  mailed: number;
  mailFailed: number;
}

/** Where the client shows a session (the link in the results mail). */
export function calibrationSessionPath(id: number): string {
  return `/calibration/sessions/${id}`;
}
