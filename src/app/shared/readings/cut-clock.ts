// Seconds since the cut, counted by the form: cut flesh and sap brown within minutes, so the
// reading records how long after the cut it was taken, and warns past a limit.

/** How often the counter moves on screen. */
export const CUT_TICK_MS = 1000;

/** Whole seconds from a start time to now, never negative. */
export function elapsedSeconds(startedAt: number, now: number): number {
  return Math.max(0, Math.floor((now - startedAt) / 1000));
}

/** The warning for a count of seconds past the limit, or null while it is within it (or nothing is entered). */
export function cutWarning(seconds: number | null, limit: number): string | null {
  if (seconds === null || !Number.isFinite(seconds) || seconds <= limit) return null;
  return `More than ${limitWords(limit)} since the cut: the surface may have browned. Cut a fresh face and read again, or save and say so in the notes.`;
}

/** "a minute", "90 seconds", "2 minutes". */
export function limitWords(seconds: number): string {
  if (seconds === 60) return 'a minute';
  if (seconds % 60 === 0) return `${seconds / 60} minutes`;
  return `${seconds} seconds`;
}

/** "0:07", "1:32": minutes and seconds as a stopwatch shows them. */
export function stopwatchText(seconds: number): string {
  const s = Math.max(0, Math.floor(seconds));
  return `${Math.floor(s / 60)}:${String(s % 60).padStart(2, '0')}`;
}
