import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import { photoImageUrl } from '../../../../shared/api/photo-answers.js';
import type { Region } from '../../../../shared/photo/region.js';
import { describeRegion, regionPath } from './region-drawing';
import { cropAround } from './crop-box';

/** The photo around a reading's region with the region outlined (and the grey card, when one balanced it); or the whole photo. */
@Component({
  selector: 'hl-photo-crop',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <figure>
      <svg class="crop" [attr.viewBox]="viewBox()" preserveAspectRatio="xMidYMid meet" role="img" [attr.aria-label]="'Photo with the region outlined: ' + words()">
        <image [attr.href]="url()" x="0" y="0" [attr.width]="size().width" [attr.height]="size().height" preserveAspectRatio="none" />
        @if (card(); as c) {
          <path class="under" [attr.d]="pathOf(c)" vector-effect="non-scaling-stroke" />
          <path class="mark card" [attr.d]="pathOf(c)" vector-effect="non-scaling-stroke" />
        }
        <path class="under" [attr.d]="pathOf(region())" vector-effect="non-scaling-stroke" />
        <path class="mark" [attr.d]="pathOf(region())" vector-effect="non-scaling-stroke" />
      </svg>
      <figcaption>
        <span class="hl-muted">Region: {{ words() }}{{ card() ? ' · dashed: the grey card' : '' }}</span>
        <button mat-button type="button" (click)="whole.set(!whole())">
          <mat-icon aria-hidden="true">{{ whole() ? 'zoom_in' : 'zoom_out_map' }}</mat-icon> {{ whole() ? 'Close up' : 'Whole photo' }}
        </button>
      </figcaption>
    </figure>
  `,
  styles: `
    figure {
      margin: 0;
    }
    .crop {
      display: block;
      width: 100%;
      max-height: 60vh;
      background: #777777;
      border-radius: 4px;
    }
    figcaption {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px;
    }
    .under {
      fill: none;
      stroke: rgba(0, 0, 0, 0.75);
      stroke-width: 6px;
    }
    .mark {
      fill: none;
      stroke: #ffffff;
      stroke-width: 3px;
    }
    .mark.card {
      stroke: #ffe066;
      stroke-dasharray: 10 6;
    }
  `,
})
export class PhotoCrop {
  readonly photoId = input.required<number>();
  /** The upright photo's size; the region is in its pixels. */
  readonly size = input.required<{ width: number; height: number }>();
  readonly region = input.required<Region>();
  /** The grey-card region, if the reading was balanced on one. */
  readonly card = input<Region | null>(null);

  protected readonly whole = signal(false);
  protected readonly url = computed(() => photoImageUrl(this.photoId()));
  protected readonly viewBox = computed(() => {
    const size = this.size();
    const box = this.whole() ? { x: 0, y: 0, ...size } : cropAround(this.region(), size);
    return `${box.x} ${box.y} ${box.width} ${box.height}`;
  });
  protected readonly words = computed(() => describeRegion(this.region()));
  protected readonly pathOf = regionPath;
}
