import type { SeasonSpan } from './season-days';
import { REFERENCE_DAYS, monthStarts, spanOf } from './season-days';

/** One season drawn on the year ring. */
export interface RingArc {
  /** Position of the season in the editor's list (0-based), for its number badge and tone. */
  index: number;
  name: string;
  /** SVG path of the arc, stroked on its track. */
  path: string;
  /** 0 is the outer track; a season that overlaps another goes on an inner one. */
  track: number;
  /** Where the number badge sits. */
  badge: { x: number; y: number };
}

/** A run of days no season covers, drawn hatched on the outer track. */
export interface RingGap {
  path: string;
  /** Where the warning mark sits. */
  mark: { x: number; y: number };
}

/** Everything the year ring draws. */
export interface RingDrawing {
  arcs: RingArc[];
  gaps: RingGap[];
  /** Month boundaries and the letter for each month. */
  months: { tick: { x1: number; y1: number; x2: number; y2: number }; label: { x: number; y: number; text: string } }[];
  /** How many tracks are used (1 when nothing overlaps). */
  tracks: number;
}

/** Ring geometry in SVG user units; the viewBox is SIZE × SIZE. */
export const RING = { size: 260, centre: 130, outer: 104, width: 20, gap: 4 } as const;

const MONTH_LETTERS = ['J', 'F', 'M', 'A', 'M', 'J', 'J', 'A', 'S', 'O', 'N', 'D'];

/**
 * Lays seasons out on a ring of the year: 1 January at twelve o'clock, clockwise, one leap year
 * of 366 days so 29 February has its place. A season that wraps the year end (wet 11-01 → 04-30)
 * is one continuous arc across the top. Overlapping seasons are pushed to inner tracks so both
 * stay visible; days no season covers are returned as gaps.
 */
export function drawRing(seasons: readonly { name: string; start: string; end: string }[]): RingDrawing {
  const spans = seasons.map((season, index) => ({ index, name: season.name, span: spanOf(season.start, season.end) }));
  const placed: { span: SeasonSpan; track: number }[] = [];
  const arcs: RingArc[] = [];
  for (const { index, name, span } of spans) {
    if (!span) continue;
    let track = 0;
    while (placed.some((other) => other.track === track && spansOverlap(other.span, span))) track++;
    placed.push({ span, track });
    const radius = trackRadius(track);
    arcs.push({ index, name, track, path: arcPath(span.start, span.days, radius), badge: pointAt(span.start + span.days / 2, radius) });
  }
  const gaps = uncoveredRuns(placed.map((p) => p.span)).map((run) => ({
    path: arcPath(run.start, run.days, trackRadius(0)),
    mark: pointAt(run.start + run.days / 2, trackRadius(0) - RING.width / 2 - 12),
  }));
  return { arcs, gaps, months: monthMarks(), tracks: Math.max(1, ...placed.map((p) => p.track + 1)) };
}

/** Whether two spans share at least one day, either of them possibly wrapping the year end. */
export function spansOverlap(a: SeasonSpan, b: SeasonSpan): boolean {
  const covered = new Set(daysOf(a));
  return daysOf(b).some((day) => covered.has(day));
}

/** Runs of consecutive days (wrapping the year end) that no span covers. */
export function uncoveredRuns(spans: readonly SeasonSpan[]): SeasonSpan[] {
  const covered = new Array<boolean>(REFERENCE_DAYS).fill(false);
  for (const span of spans) for (const day of daysOf(span)) covered[day] = true;
  const firstCovered = covered.indexOf(true);
  if (firstCovered === -1) return [{ start: 0, days: REFERENCE_DAYS }];
  const runs: SeasonSpan[] = [];
  // Walk once round the year starting at a covered day, so a run across the year end stays whole.
  let runStart: number | null = null;
  for (let step = 1; step <= REFERENCE_DAYS; step++) {
    const day = (firstCovered + step) % REFERENCE_DAYS;
    if (!covered[day] && runStart === null) runStart = day;
    if (covered[day] && runStart !== null) {
      runs.push({ start: runStart, days: (day - runStart + REFERENCE_DAYS) % REFERENCE_DAYS });
      runStart = null;
    }
  }
  return runs.sort((x, y) => x.start - y.start);
}

function daysOf(span: SeasonSpan): number[] {
  return Array.from({ length: span.days }, (_, i) => (span.start + i) % REFERENCE_DAYS);
}

/** The middle radius of a track; 0 is the outer one. */
export function trackRadius(track: number): number {
  return RING.outer - RING.width / 2 - track * (RING.width + RING.gap);
}

/** The point at a (fractional) day on a circle of the given radius; day 0 is at the top. */
function pointAt(day: number, radius: number): { x: number; y: number } {
  const angle = (day / REFERENCE_DAYS) * 2 * Math.PI;
  return { x: round(RING.centre + radius * Math.sin(angle)), y: round(RING.centre - radius * Math.cos(angle)) };
}

/** A clockwise circular arc from the start of day `start` over `days` days; a whole year is two half arcs. */
export function arcPath(start: number, days: number, radius: number): string {
  if (days >= REFERENCE_DAYS) {
    const top = pointAt(start, radius);
    const bottom = pointAt(start + REFERENCE_DAYS / 2, radius);
    return `M ${top.x} ${top.y} A ${radius} ${radius} 0 1 1 ${bottom.x} ${bottom.y} A ${radius} ${radius} 0 1 1 ${top.x} ${top.y}`;
  }
  const from = pointAt(start, radius);
  const to = pointAt(start + days, radius);
  const large = days > REFERENCE_DAYS / 2 ? 1 : 0;
  return `M ${from.x} ${from.y} A ${radius} ${radius} 0 ${large} 1 ${to.x} ${to.y}`;
}

function monthMarks(): RingDrawing['months'] {
  const starts = monthStarts();
  return starts.map((start, month) => {
    const end = starts[month + 1] ?? REFERENCE_DAYS;
    const inner = pointAt(start, RING.outer - RING.width - 2);
    const outer = pointAt(start, RING.outer + 4);
    const label = pointAt((start + end) / 2, RING.outer + 14);
    return { tick: { x1: inner.x, y1: inner.y, x2: outer.x, y2: outer.y }, label: { ...label, text: MONTH_LETTERS[month] } };
  });
}

function round(value: number): number {
  return Math.round(value * 100) / 100;
}
