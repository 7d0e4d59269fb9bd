import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { RouterLink } from '@angular/router';

import { LocalDateTimePipe } from '../../core/format/local-date-time';
import type { ReadingDetail } from '../../../../shared/api/reading-answers.js';

/**
 * The plant's (else the accession's at that site) earlier readings of the reading's character:
 * swatches on the grey surround with the nearest chip's code, the day and the observer, so a
 * reading is judged beside what came before it. Used by the review dialog and the reading page.
 */
@Component({
  selector: 'hl-earlier-readings',
  imports: [LocalDateTimePipe, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let r = reading();
    <section class="earlier" aria-label="Earlier readings of this plant and character" data-testid="earlier-readings">
      <h3>{{ heading() }}</h3>
      @if (r.earlier?.length) {
        <ol class="earlier-list hl-swatch-surround">
          @for (e of r.earlier; track e.id) {
            <li>
              @if (linked()) {
                <a class="earlier-link" [routerLink]="['/readings', e.id]" [attr.aria-label]="'Reading ' + e.id + ', nearest chip ' + e.bestChip">
                  <span class="earlier-swatch" [style.background-color]="e.hex" aria-hidden="true"></span>
                </a>
              } @else {
                <span class="earlier-swatch" [style.background-color]="e.hex" role="img" [attr.aria-label]="'Reading ' + e.id + ', nearest chip ' + e.bestChip"></span>
              }
              <span class="earlier-code">{{ e.bestChip }}</span>
              <span class="earlier-when"><time [attr.datetime]="e.observedAt">{{ e.observedAt | localDateTime: 'date' }}</time></span>
              <span class="earlier-who">{{ e.observerName }}</span>
            </li>
          }
        </ol>
        <p class="hl-muted small">Newest first, on a neutral grey; on-screen colours are approximate.</p>
      } @else {
        <p class="hl-muted">No earlier reading of this character.</p>
      }
    </section>
  `,
  styles: `
    .earlier h3 {
      font: var(--mat-sys-title-small);
      margin: 12px 0 6px;
    }
    .earlier-list {
      display: flex;
      flex-wrap: wrap;
      gap: 10px;
      list-style: none;
      margin: 0;
      padding: 8px;
      li {
        display: flex;
        flex-direction: column;
        align-items: center;
        width: 72px;
        text-align: center;
        font-size: 11px;
      }
    }
    .earlier-link {
      display: inline-flex;
      align-items: center;
      justify-content: center;
      min-width: 48px;
      min-height: 48px;
    }
    .earlier-swatch {
      width: 40px;
      height: 40px;
      border: 1px solid #5e5e5e;
      border-radius: 3px;
    }
    .earlier-code {
      font-weight: 600;
    }
  `,
})
export class EarlierReadings {
  /** The reading whose earlier readings are listed (its detail carries them). */
  readonly reading = input.required<Pick<ReadingDetail, 'earlier' | 'plantLabel' | 'siteCode' | 'characterLabel'>>();
  /** Whether each swatch links to its reading; off in the review dialog, which would close on navigation. */
  readonly linked = input(false);

  protected readonly heading = computed(() => {
    const r = this.reading();
    return `${r.plantLabel ? 'Plant ' + r.plantLabel : 'This accession at ' + r.siteCode}: earlier readings of ${r.characterLabel}`;
  });
}
