// What the drift charts and their tables show, computed from the drift answer once: a colour and
// a marker per season group, each group's points, mean and spread ellipse, and the time series.
import type { DriftAnswer, DriftGroup, DriftPoint } from '../../../../../shared/api/analysis-answers.js';
import { groupLabel, sameGroup } from './drift-words';
import { ellipseOutline, spreadEllipse, type Ellipse } from './spread-ellipse';
import { formatDateTime } from '../../../core/format/local-date-time';

/**
 * Group colours: the eight colours of Okabe & Ito (2008), "Color Universal Design", chosen to stay
 * apart for the common colour-vision deficiencies. Marker shapes tell the groups apart too.
 */
export const GROUP_COLOURS = ['#0072B2', '#E69F00', '#009E73', '#CC79A7', '#D55E00', '#56B4E9', '#000000', '#F0E442'] as const;

/** Chart.js marker shapes, one per group in turn, so groups differ by shape as well as colour. */
export const GROUP_MARKERS = ['circle', 'triangle', 'rect', 'rectRot', 'star', 'crossRot', 'rectRounded', 'cross'] as const;
export type GroupMarker = (typeof GROUP_MARKERS)[number];

/** How one season group is drawn. */
export interface GroupStyle {
  label: string;
  colour: string;
  marker: GroupMarker;
  /** The marker's name in words, for the legend table. */
  markerWords: string;
}

const MARKER_WORDS: Record<GroupMarker, string> = {
  circle: 'circle',
  triangle: 'triangle',
  rect: 'square',
  rectRot: 'diamond',
  star: 'star',
  crossRot: 'cross (×)',
  rectRounded: 'rounded square',
  cross: 'plus (+)',
};

/** One group as the charts draw it. */
export interface GroupSeries {
  group: DriftGroup;
  style: GroupStyle;
  points: DriftPoint[];
  ellipse: Ellipse | null;
  outline: { x: number; y: number }[];
  /** Half-way between the group's first and last reading, ms since 1970: where its mean sits on the time charts. */
  midTime: number;
}

/** The style of the i-th group (groups come oldest first). */
export function groupStyle(group: DriftGroup, i: number): GroupStyle {
  const marker = GROUP_MARKERS[i % GROUP_MARKERS.length];
  return { label: groupLabel(group), colour: GROUP_COLOURS[i % GROUP_COLOURS.length], marker, markerWords: MARKER_WORDS[marker] };
}

/** Every group with its style, its readings, its 2σ ellipse on a*b* and its mid time. */
export function groupSeries(answer: DriftAnswer): GroupSeries[] {
  return answer.groups.map((group, i) => {
    const points = answer.points.filter((p) => p.season !== null && p.seasonYear !== null && sameGroup({ season: p.season, seasonYear: p.seasonYear }, group));
    const ellipse = spreadEllipse(points.map((p) => [p.lab[1], p.lab[2]] as const));
    return {
      group,
      style: groupStyle(group, i),
      points,
      ellipse,
      outline: ellipse ? ellipseOutline(ellipse) : [],
      midTime: (Date.parse(group.firstObservedAt) + Date.parse(group.lastObservedAt)) / 2,
    };
  });
}

/**
 * Equal a* and b* ranges around everything drawn (points, means, ellipses) with a margin, so one
 * ΔE unit is as long across as up and the ellipses keep their true shape on a square chart.
 */
export function squareRange(series: GroupSeries[], margin = 1): { a: [number, number]; b: [number, number] } {
  const as: number[] = [];
  const bs: number[] = [];
  for (const s of series) {
    for (const p of s.points) {
      as.push(p.lab[1]);
      bs.push(p.lab[2]);
    }
    for (const o of s.outline) {
      as.push(o.x);
      bs.push(o.y);
    }
    as.push(s.group.meanLab[1]);
    bs.push(s.group.meanLab[2]);
  }
  if (as.length === 0) return { a: [-10, 10], b: [-10, 10] };
  const [aLo, aHi, bLo, bHi] = [Math.min(...as), Math.max(...as), Math.min(...bs), Math.max(...bs)];
  // Whole-number ends, so the axes' ticks fall on round values.
  const half = Math.ceil(Math.max(aHi - aLo, bHi - bLo, 2) / 2 + margin);
  const ac = Math.round((aLo + aHi) / 2);
  const bc = Math.round((bLo + bHi) / 2);
  return { a: [ac - half, ac + half], b: [bc - half, bc + half] };
}

/** The three quantities drawn against time. */
export const TIME_QUANTITIES = [
  { key: 'L', label: 'L*', index: 0, words: 'lightness' },
  { key: 'C', label: 'C*', index: 1, words: 'chroma' },
  { key: 'h', label: 'h°', index: 2, words: 'hue angle' },
] as const;
export type TimeQuantity = (typeof TIME_QUANTITIES)[number];

/** The time axis's ticks ("Mar 2025" in en-GB), in the app's one date style for the person's locale. */
export function monthText(ms: number): string {
  return formatDateTime(new Date(ms), 'month');
}

/** The tooltips' dates ("12 Mar 2025" in en-GB), in the app's one date style for the person's locale. */
export function dayText(ms: number): string {
  return formatDateTime(new Date(ms), 'date');
}
