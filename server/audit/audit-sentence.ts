// An audit event as one plain sentence ("Juno Pellbright corrected the L*a*b* from 32.65, 18.20,
// −7.40 to …, because …"), so the reading history and the Admin audit page read as a record, not
// as stored JSON. Pure: the caller gives the actor's name.

import { dayWords } from '../core/day-words.js';

type Detail = Record<string, unknown> | null;

const num = (v: unknown, digits = 2) => (typeof v === 'number' && Number.isFinite(v) ? v.toFixed(digits).replace('-', '−') : String(v));
const lab = (v: unknown) => (Array.isArray(v) && v.length === 3 ? `L* ${num(v[0])}, a* ${num(v[1])}, b* ${num(v[2])}` : 'an unknown colour');
const str = (v: unknown) => (typeof v === 'string' ? v : v === null || v === undefined ? '' : JSON.stringify(v));
const list = (v: unknown) => (Array.isArray(v) ? v.map(str).join(', ') : str(v));
/** "accession:12" → "accession 12". */
const subjectWords = (s: string | null) => (s ? s.replace(':', ' ') : 'something');
const changedFields = (d: Detail) => (d ? Object.keys(d).join(', ') : 'nothing named');

const DECISION_WORDS: Record<string, string> = { approve: 'approved', flag: 'flagged', reread: 'asked for a re-read of' };

/** Sentence builders by action; each gets the actor's name (or "The system") and the event. */
const SENTENCES: Record<string, (who: string, subject: string | null, d: Detail, day: (v: unknown) => string) => string> = {
  'reading.created': (who, s, d) => `${who} recorded ${subjectWords(s)} by ${str(d?.['method']) || 'some method'}: ${lab(d?.['lab'])}, nearest chip ${str(d?.['bestChip'])} at ΔE00 ${num(d?.['deltaE00'])}.`,
  'reading.superseded': (who, s, d) => {
    const from = d?.['from'] as Detail;
    const to = d?.['to'] as Detail;
    const because = d?.['reason'] ? `, because "${str(d['reason'])}"` : '';
    return `${who} corrected ${subjectWords(s)} from ${lab(from?.['lab'])} (${str(from?.['bestChip'])}) to ${lab(to?.['lab'])} (${str(to?.['bestChip'])}) as reading ${str(d?.['by'])}${because}.`;
  },
  'reading.reviewed': (who, s, d) => {
    const verb = DECISION_WORDS[str(d?.['decision'])] ?? `reviewed (${str(d?.['decision'])})`;
    const comment = d?.['comment'] ? `: "${str(d['comment'])}"` : '';
    return `${who} ${verb} ${subjectWords(s)}${comment}.`;
  },
  'readings.imported': (who, _s, d) => `${who} imported ${str(d?.['count'] ?? 'some')} readings from a file (readings ${str(d?.['first'])} to ${str(d?.['last'])}).`,
  'print-batch.created': (who, s, d, day) => `${who} recorded ${subjectWords(s)}: the ${str(d?.['kind'])} of set ${str(d?.['setId'])} printed on ${day(d?.['printedOn'])}.`,
  'print-batch.measured': (who, s, d) => `${who} entered ${str(d?.['patches'])} measured patches of ${subjectWords(s)}.`,
  'auth.sign-in': (who) => `${who} signed in.`,
  'auth.sign-in-failed': (_who, s, d) => `A sign-in as ${s?.startsWith('email:') ? s.slice(6) : 'someone'} was refused${d?.['reason'] ? ` (${str(d['reason'])})` : ''}.`,
  'auth.sign-out': (who) => `${who} signed out.`,
  'auth.reset-requested': (who) => `${who} asked for a password reset.`,
  'auth.reset-requested-unknown': (_who, _s, d) => `Someone asked for a password reset for an unknown address${d?.['email'] ? ` (${str(d['email'])})` : ''}.`,
  'auth.password-reset': (who) => `${who} set a new password through a reset link.`,
  'user.created': (who, s, d) => `${who} added ${str(d?.['email']) || subjectWords(s)}${d?.['role'] ? ` as ${str(d['role'])}` : ''}.`,
  'user.updated': (who, s, d) => `${who} changed ${changedFields(d)} of ${subjectWords(s)}.`,
  'user.password-changed': (who) => `${who} changed their password.`,
  'invitation.created': (who, _s, d) => `${who} invited ${str(d?.['email']) || 'someone'}${d?.['role'] ? ` as ${str(d['role'])}` : ''}.`,
  'notification.read': (who, s) => `${who} read ${subjectWords(s)}.`,
  'calibration.session.created': (who, s, d, day) => `${who} opened calibration ${subjectWords(s)}, "${str(d?.['title'])}", held on ${day(d?.['heldOn'])}.`,
  'calibration.specimen.added': (who, s, d) => `${who} added specimen "${str(d?.['label'])}" (${lab(d?.['lab'])}) to calibration ${subjectWords(s)}.`,
  'calibration.participants.invited': (who, s, d) => `${who} invited users ${list(d?.['userIds'])} to calibration ${subjectWords(s)}.`,
  'calibration.response.recorded': (who, s, d) => `${who} picked ${str(d?.['chipCode'])} for specimen ${str(d?.['specimenId'])} in calibration ${subjectWords(s)}.`,
  'calibration.response.replaced': (who, s, d) => `${who} changed their pick for specimen ${str(d?.['specimenId'])} from ${str(d?.['from'])} to ${str(d?.['to'])} in calibration ${subjectWords(s)}.`,
  'calibration.session.closed': (who, s, d) => `${who} closed calibration ${subjectWords(s)}: Fleiss' κ ${num(d?.['fleissKappa'])}, ${str(d?.['responses'])} of ${str(d?.['expected'])} answers, ${Array.isArray(d?.['certified']) ? d['certified'].length : 0} certified.`,
  'calibration.certified': (who, s, d) => `${who} certified ${subjectWords(s)} for reference set ${str(d?.['referenceSetId'])} (κ ${num(d?.['kappa'])}, mean ΔE00 ${num(d?.['meanDeltaE00'])}).`,
  'calibration.screening.recorded': (who, s, d, day) => `${who} recorded a colour-vision screening of ${subjectWords(s)} on ${day(d?.['screenedOn'])}: ${str(d?.['result'])}.`,
};

/** What an action is about, for actions without a sentence of their own: "accession.updated" → "updated accession". */
function fallback(who: string, action: string, subject: string | null, d: Detail): string {
  const parts = action.split('.');
  const verb = parts.at(-1)!.replace(/-/g, ' ');
  const what = subject ? subjectWords(subject) : parts.slice(0, -1).join(' ');
  const fields = d && Object.keys(d).length ? ` (${Object.keys(d).slice(0, 6).join(', ')})` : '';
  return `${who} ${verb} ${what}${fields}.`;
}

/**
 * The event as a sentence; `actorName` null means the system or a signed-out caller. `locale` is
 * the reader's language (the request's Accept-Language), for the days a sentence names.
 */
export function auditSentence(actorName: string | null, action: string, subject: string | null, detail: Detail, locale?: string): string {
  const who = actorName ?? 'The system';
  return (SENTENCES[action] ?? ((w, s, d) => fallback(w, action, s, d)))(who, subject, detail, (v) => dayWords(v, locale));
}

/** The first word of each action family, for the audit page's "what" filter. */
export const AUDIT_ACTION_FAMILIES = ['auth', 'user', 'invitation', 'reading', 'readings', 'calibration', 'accession', 'plant', 'site', 'character', 'descriptor', 'observation', 'photo', 'notification', 'api-token', 'reference-set'] as const;
