import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { RING, drawRing, trackRadius } from '../data/ring-layout';

let nextRingId = 0;

/** A season as the ring needs it; dates may be half-typed (those seasons are left out until valid). */
export interface RingSeason {
  name: string;
  start: string;
  end: string;
}

/**
 * The year as a ring: 1 January at the top, clockwise. Each season is an arc with its number;
 * a season across the year end is drawn as one continuous arc; overlapping seasons sit on inner
 * tracks and uncovered days are hatched with a warning mark, so problems show by shape and sign,
 * not colour alone. The words for the same facts are in the editor beside it.
 */
@Component({
  selector: 'hl-year-ring',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg [attr.viewBox]="'0 0 ' + ring.size + ' ' + ring.size" role="img" [attr.aria-label]="summary()">
      <defs>
        <pattern [attr.id]="hatchId" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width="6" height="6" class="gap-back" />
          <line x1="0" y1="0" x2="0" y2="6" class="gap-line" />
        </pattern>
      </defs>
      @for (track of trackList(); track track) {
        <circle [attr.cx]="ring.centre" [attr.cy]="ring.centre" [attr.r]="trackRadius(track)" class="track" [attr.stroke-width]="ring.width" />
      }
      @for (month of drawing().months; track $index) {
        <line [attr.x1]="month.tick.x1" [attr.y1]="month.tick.y1" [attr.x2]="month.tick.x2" [attr.y2]="month.tick.y2" class="tick" />
        <text [attr.x]="month.label.x" [attr.y]="month.label.y + 4" text-anchor="middle" class="month">{{ month.label.text }}</text>
      }
      @for (gap of drawing().gaps; track $index) {
        <path [attr.d]="gap.path" class="gap" [attr.stroke]="'url(#' + hatchId + ')'" [attr.stroke-width]="ring.width" />
        <g class="gap-mark" [attr.transform]="'translate(' + gap.mark.x + ' ' + gap.mark.y + ')'">
          <path d="M 0 -8 L 8 6 L -8 6 Z" />
          <text y="4.5" text-anchor="middle">!</text>
        </g>
      }
      @for (arc of drawing().arcs; track arc.index) {
        <path [attr.d]="arc.path" [attr.class]="'arc tone-' + (arc.index % 6)" [attr.stroke-width]="ring.width - 2" />
      }
      @for (arc of drawing().arcs; track arc.index) {
        <g class="badge" [attr.transform]="'translate(' + arc.badge.x + ' ' + arc.badge.y + ')'">
          <circle r="8" />
          <text y="3.5" text-anchor="middle">{{ arc.index + 1 }}</text>
        </g>
      }
      <text [attr.x]="ring.centre" [attr.y]="ring.centre - 4" text-anchor="middle" class="centre">1 Jan at top</text>
      <text [attr.x]="ring.centre" [attr.y]="ring.centre + 12" text-anchor="middle" class="centre small">clockwise</text>
    </svg>
  `,
  styles: `
    :host {
      display: block;
      max-width: 320px;
    }
    svg {
      width: 100%;
      height: auto;
      display: block;
      font-family: inherit;
    }
    .track {
      fill: none;
      stroke: var(--mat-sys-surface-container-high);
    }
    .arc {
      fill: none;
      stroke-linecap: butt;
    }
    .tone-0 { stroke: #3b6934; }
    .tone-1 { stroke: #c9a86a; }
    .tone-2 { stroke: #6e2a6b; }
    .tone-3 { stroke: #86b87a; }
    .tone-4 { stroke: #8a5a3c; }
    .tone-5 { stroke: #5c7fa3; }
    .gap {
      fill: none;
    }
    .gap-back {
      fill: var(--mat-sys-error-container);
    }
    .gap-line {
      stroke: var(--mat-sys-error);
      stroke-width: 2;
    }
    .gap-mark path {
      fill: var(--mat-sys-error);
    }
    .gap-mark text {
      fill: var(--mat-sys-on-error);
      font-size: 11px;
      font-weight: 700;
    }
    .badge circle {
      fill: var(--mat-sys-surface);
      stroke: var(--mat-sys-on-surface);
      stroke-width: 1.5;
    }
    .badge text {
      fill: var(--mat-sys-on-surface);
      font-size: 10px;
      font-weight: 700;
    }
    .tick {
      stroke: var(--mat-sys-outline);
      stroke-width: 1;
    }
    .month {
      fill: var(--mat-sys-on-surface-variant);
      font-size: 11px;
      font-weight: 600;
    }
    .centre {
      fill: var(--mat-sys-on-surface-variant);
      font-size: 11px;
    }
    .small {
      font-size: 10px;
    }
  `,
})
export class YearRing {
  /** The seasons in editor order; their numbers are their positions from 1. */
  readonly seasons = input.required<readonly RingSeason[]>();

  protected readonly ring = RING;
  /** Unique per ring, since several rings may share a page and SVG ids are document-wide. */
  protected readonly hatchId = `hl-ring-hatch-${nextRingId++}`;
  protected readonly trackRadius = trackRadius;
  protected readonly drawing = computed(() => drawRing(this.seasons()));
  protected readonly trackList = computed(() => Array.from({ length: this.drawing().tracks }, (_, i) => i));
  protected readonly summary = computed(() => {
    const { arcs, gaps } = this.drawing();
    const names = arcs.map((arc) => `${arc.index + 1} ${arc.name || 'unnamed'}`).join(', ');
    const gapWords = gaps.length === 0 ? 'every day covered' : `${gaps.length} uncovered ${gaps.length === 1 ? 'stretch' : 'stretches'}`;
    return `Year ring of seasons: ${names || 'none'}; ${gapWords}.`;
  });
}
