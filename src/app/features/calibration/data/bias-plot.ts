// Geometry of the bias chart: each observer's mean (Δa*, Δb*) as an arrow from the origin (the
// specimens' reference) on the a*b* plane, in SVG coordinates.
import type { ObserverResult } from '../../../../../shared/api/calibration-answers.js';

/** Side of the square plot in SVG units, and the margin kept for axis words. */
export const PLOT_SIZE = 360;
export const PLOT_MARGIN = 44;

/** One arrow, ready to draw. */
export interface BiasArrow {
  userId: number;
  /** A short mark drawn at the arrow's head (1, 2, 3 …), matching the table and legend. */
  mark: string;
  name: string;
  da: number;
  db: number;
  x2: number;
  y2: number;
}

/** The plot: its half-range in CIELAB units, the tick values, the arrows. */
export interface BiasPlot {
  extent: number;
  ticks: number[];
  arrows: BiasArrow[];
  /** SVG coordinate of a* = 0 (and of b* = 0). */
  centre: number;
}

/** Half-ranges the axes may take (CIELAB units): the smallest that holds every arrow is used. */
const EXTENTS = [2, 4, 6, 10, 15, 20, 30, 50];

/** Lays out the arrows of the observers who answered, on axes wide enough for the longest. */
export function biasPlot(observers: readonly ObserverResult[]): BiasPlot {
  const answered = observers.filter((o) => o.bias !== null);
  const largest = Math.max(0, ...answered.flatMap((o) => [Math.abs(o.bias![1]), Math.abs(o.bias![2])]));
  const extent = EXTENTS.find((e) => e >= largest * 1.1) ?? Math.ceil(largest * 1.1);
  const half = (PLOT_SIZE - 2 * PLOT_MARGIN) / 2;
  const centre = PLOT_SIZE / 2;
  const scale = half / extent;
  const step = extent / 2;
  const ticks = [-extent, -step, step, extent];
  const arrows = answered.map((o) => ({
    userId: o.userId,
    mark: String(observers.indexOf(o) + 1),
    name: o.name,
    da: o.bias![1],
    db: o.bias![2],
    x2: centre + o.bias![1] * scale,
    // b* grows upwards, SVG y downwards.
    y2: centre - o.bias![2] * scale,
  }));
  return { extent, ticks, arrows, centre };
}

/** SVG coordinate of a value on either axis (y flipped by the caller's sign). */
export function plotCoordinate(value: number, extent: number): number {
  return PLOT_SIZE / 2 + (value * (PLOT_SIZE - 2 * PLOT_MARGIN)) / 2 / extent;
}
