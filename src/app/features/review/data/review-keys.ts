// The review dialog's keyboard shortcuts: one key per decision, ignored while typing a comment.
import type { ReviewDecision } from '../../../../../shared/api/review-answers.js';

/** The key for each decision, shown on its button. */
export const DECISION_KEYS: Readonly<Record<ReviewDecision, string>> = { approve: 'A', flag: 'F', reread: 'R' };

/** What a key press needs to be read as a shortcut. */
export interface KeyPress {
  key: string;
  ctrlKey?: boolean;
  metaKey?: boolean;
  altKey?: boolean;
  target?: EventTarget | null;
}

/** Whether the press happened in a field that takes text, where letters are letters. */
function typing(target: EventTarget | null | undefined): boolean {
  if (!target || typeof (target as Element).closest !== 'function') return false;
  const el = target as HTMLElement;
  return el.isContentEditable || el.closest('input, textarea, select, [contenteditable="true"]') !== null;
}

/** The decision a key press asks for, or null (other keys, with a modifier, or while typing). */
export function decisionForKey(press: KeyPress): ReviewDecision | null {
  if (press.ctrlKey || press.metaKey || press.altKey || typing(press.target)) return null;
  const key = press.key.toUpperCase();
  const found = (Object.entries(DECISION_KEYS) as [ReviewDecision, string][]).find(([, k]) => k === key);
  return found ? found[0] : null;
}
