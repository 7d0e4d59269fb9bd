// Plain words and icons for the readings' coded values, shared by the form, the table and the detail.
import type { Light, ReadingMethod, ReadingStatus } from '../../../../shared/api/reading-answers.js';

/** Each method as the form's big toggles and the table show it. */
export const METHOD_WORDS: Record<ReadingMethod, { label: string; icon: string; hint: string }> = {
  photo: { label: 'Photo region', icon: 'photo_camera', hint: 'Draw on a photo' },
  instrument: { label: 'Instrument L*a*b*', icon: 'straighten', hint: 'Type the numbers' },
  chip: { label: 'Chip by eye', icon: 'style', hint: 'On the printed card' },
  swatch: { label: 'On-screen swatch', icon: 'colorize', hint: 'Match on screen' },
};

/** Each light, for the five big choices and the table. */
export const LIGHT_WORDS: Record<Light, { label: string; icon: string }> = {
  'direct-sun': { label: 'Direct sun', icon: 'wb_sunny' },
  'open-shade': { label: 'Open shade', icon: 'park' },
  overcast: { label: 'Overcast', icon: 'cloud' },
  'indoor-lamp': { label: 'Indoor lamp', icon: 'lightbulb' },
  'viewing-booth': { label: 'Viewing booth', icon: 'inventory_2' },
};

/** Each status in words with an icon, never colour alone. */
export const STATUS_WORDS: Record<ReadingStatus, { label: string; icon: string }> = {
  submitted: { label: 'Submitted', icon: 'upload' },
  approved: { label: 'Approved', icon: 'verified' },
  flagged: { label: 'Flagged', icon: 'flag' },
  'reread-requested': { label: 'Re-read asked', icon: 'replay' },
};

/** Words for a coded value not in a table (a newer server than this client): the code itself. */
export function wordsFor<K extends string>(table: Record<K, { label: string; icon: string }>, code: string): { label: string; icon: string } {
  return (table as Record<string, { label: string; icon: string }>)[code] ?? { label: code, icon: 'help' };
}
