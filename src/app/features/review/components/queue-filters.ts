import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';

import type { Accession, Character, Site } from '../../../../../shared/api/collection-answers.js';
import { READING_STATUSES } from '../../../../../shared/api/reading-answers.js';
import type { ReviewQueueQuery } from '../../../../../shared/api/review-answers.js';
import { FilterPanel } from '../../../shared/readings/filter-panel';
import { STATUS_WORDS } from '../../../shared/readings/reading-words';
import { QUEUE_DEFAULT_STATUS } from '../data/review-filters';

/** The review queue's filters: accession, character, site, status, observed date range, and the observer picked from a row. */
@Component({
  selector: 'hl-queue-filters',
  imports: [FilterPanel, MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let q = query();
    <hl-filter-panel
      [query]="q"
      [accessions]="accessions()"
      [characters]="characters()"
      [sites]="sites()"
      fromLabel="Observed from"
      toLabel="Observed to"
      rangeErrorId="queue-range-error"
      (changed)="set($event)"
      (clear)="clear.emit()"
    >
      <mat-form-field leading subscriptSizing="dynamic">
        <mat-label>Status</mat-label>
        <mat-select [value]="q.status ?? defaultStatus" (selectionChange)="set({ status: $event.value })">
          @for (s of statuses; track s) {
            <mat-option [value]="s">{{ statusWords[s].label }}{{ s === defaultStatus ? ' (to review)' : '' }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      @if (q.observerId) {
        <button actions mat-stroked-button type="button" (click)="set({ observerId: undefined })" [attr.aria-label]="'Stop filtering by observer ' + (observerName() ?? q.observerId)">
          <mat-icon aria-hidden="true">close</mat-icon> Observer: {{ observerName() ?? q.observerId }}
        </button>
      } @else {
        <span actions class="hl-muted hint">Pick an observer's name in the list to see only their readings.</span>
      }
    </hl-filter-panel>
  `,
  styles: `
    .hint {
      font: var(--mat-sys-body-small);
    }
  `,
})
export class QueueFilters {
  readonly query = input.required<ReviewQueueQuery>();
  readonly accessions = input.required<readonly Accession[]>();
  readonly characters = input.required<readonly Character[]>();
  readonly sites = input.required<readonly Site[]>();
  readonly observerName = input<string | null>(null);
  readonly changed = output<Partial<ReviewQueueQuery>>();
  readonly clear = output<void>();

  protected readonly statuses = READING_STATUSES;
  protected readonly statusWords = STATUS_WORDS;
  protected readonly defaultStatus = QUEUE_DEFAULT_STATUS;

  protected set(change: Partial<ReviewQueueQuery>): void {
    this.changed.emit(change);
  }
}
