import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';

import { PhotoCrop } from '../../../shared/photos/photo-crop';
import { VerdictMark } from '../../../shared/chips/verdict-mark';
import { deltaEText } from '../../../shared/chips/chip-words';
import { PhotosApi } from '../../../shared/photos/photos-api';
import type { PhotoSource } from '../data/reading-draft';

/** The photo region a photo reading will save: the crop with the region drawn, and the server's sample of it. */
@Component({
  selector: 'hl-photo-summary',
  imports: [MatButtonModule, MatIconModule, MatProgressSpinnerModule, PhotoCrop, VerdictMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (source().localPhotoId) {
      <p class="hl-notice"><span aria-hidden="true" class="material-symbols-outlined">cloud_off</span><span><strong>Provisional colour.</strong> This photo is kept on the phone until it is back in range; its colour was measured here. The server measures the region again when it is sent, and its reading replaces this one.</span></p>
    }
    @if (facts.value(); as p) {
      <hl-photo-crop [photoId]="source().photoId" [size]="{ width: p.width, height: p.height }" [region]="source().region" [card]="source().neutral" />
    }
    @if (sample.value(); as s) {
      <div class="sample hl-swatch-surround">
        <span class="pair">
          <span class="swatch" [style.background-color]="s.hex"></span>
          <span class="code">{{ s.hex }}</span>
        </span>
        @if (s.matches[0]; as best) {
          <span class="words">
            <strong>{{ best.code }}</strong>
            <span>ΔE00 {{ deltaE(best.deltaE00) }}</span>
            <hl-verdict-mark [verdict]="best.verdict" />
          </span>
        }
        <span class="even"><span aria-hidden="true" class="material-symbols-outlined">{{ s.uniform ? 'check_circle' : 'warning' }}</span>{{ s.uniform ? 'even colour' : 'not even' }}</span>
      </div>
      <p class="hl-muted">{{ s.pixelCount.toLocaleString('en') }} pixels{{ s.correction.kind === 'neutral' ? ', balanced on the grey card' : '' }}. The server samples the region again when the reading is saved.</p>
    } @else if (sample.isLoading()) {
      <p class="hl-empty" role="status"><mat-spinner diameter="20" /> Measuring the region…</p>
    } @else if (sample.error()) {
      <p class="hl-notice hl-notice-error" role="alert"><mat-icon aria-hidden="true">error</mat-icon> The region could not be measured; draw it again.</p>
    }
    <button mat-stroked-button type="button" class="redo" (click)="redo.emit()"><mat-icon aria-hidden="true">edit</mat-icon> Change photo or region</button>
  `,
  styles: `
    :host {
      display: block;
    }
    .sample {
      display: flex;
      align-items: center;
      gap: 12px;
      margin-top: 8px;
    }
    .pair {
      display: flex;
      flex-direction: column;
      align-items: center;
      gap: 4px;
    }
    .swatch {
      width: 56px;
      height: 56px;
      border: 1px solid #5e5e5e;
      border-radius: 3px;
    }
    .code {
      font-size: 12px;
    }
    .words {
      display: flex;
      flex-direction: column;
      gap: 2px;
      font-variant-numeric: tabular-nums;
    }
    .even {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      margin-left: auto;
    }
    .redo {
      width: 100%;
    }
  `,
})
export class PhotoSummary {
  private readonly api = inject(PhotosApi);

  readonly source = input.required<PhotoSource>();
  /** The recorder wants to go back to the photo page. */
  readonly redo = output<void>();

  protected readonly deltaE = deltaEText;
  // A photo still on the phone has no server facts or sample yet.
  protected readonly facts = rxResource({ params: () => (this.source().localPhotoId ? undefined : this.source().photoId), stream: ({ params }) => this.api.get(params) });
  protected readonly sample = rxResource({
    params: () => (this.source().localPhotoId ? undefined : this.source()),
    stream: ({ params }) => this.api.sample(params.photoId, params.neutral ? { region: params.region, neutral: { region: params.neutral } } : { region: params.region }),
  });
  protected readonly ready = computed(() => this.facts.hasValue() && this.sample.hasValue());
}
