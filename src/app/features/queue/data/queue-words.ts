// Plain words for the queue screen: each state with an icon (never colour alone), and times.
import type { PendingReading, QueueState } from '../../../core/offline/queue-item';
import { formatDateTime } from '../../../core/format/local-date-time';

/** Each state as the card shows it. */
export const STATE_WORDS: Record<QueueState, { label: string; icon: string }> = {
  waiting: { label: 'Waiting to send', icon: 'schedule' },
  sending: { label: 'Sending…', icon: 'sync' },
  'needs-attention': { label: 'Needs your attention', icon: 'error' },
};

/** "3 readings waiting to send"; "1 reading waiting to send". */
export function waitingWords(n: number): string {
  return `${n} ${n === 1 ? 'reading' : 'readings'} waiting to send`;
}

/** When it was saved, in the app's one date and time style for the phone's own language and time zone. */
export function savedAt(iso: string, locale?: string): string {
  return locale === undefined ? formatDateTime(iso) : formatDateTime(iso, 'date-time', locale);
}

/** What the last attempt told, for a reading still waiting; null before any attempt. */
export function lastTryWords(item: Pick<PendingReading, 'attempts' | 'lastError' | 'state'>): string | null {
  if (item.attempts === 0 || !item.lastError || item.state === 'needs-attention') return null;
  const times = item.attempts === 1 ? 'once' : `${item.attempts} times`;
  return `Tried ${times}; last time: ${item.lastError.title}`;
}

/** Server field names in the form's words. */
const FIELD_WORDS: Record<string, string> = {
  accessionId: 'Accession',
  characterId: 'Character',
  siteId: 'Site',
  plantId: 'Plant',
  method: 'Method',
  lab: 'L*a*b*',
  hex: 'Swatch',
  chipCode: 'Chip',
  eyeChipCode: 'Chip by eye',
  photo: 'Photo',
  'photo.region': 'Photo region',
  light: 'Light',
  observedAt: 'Time observed',
  secondsSinceCut: 'Seconds since cut',
};

/** A refused field in words ("Accession"), falling back to the field name itself. */
export function fieldWords(field: string): string {
  return FIELD_WORDS[field] ?? FIELD_WORDS[field.split('.')[0]!] ?? field;
}
