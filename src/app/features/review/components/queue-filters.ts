import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import type { Accession, Character, Site } from '../../../../../shared/api/collection-answers.js';
import { READING_STATUSES } from '../../../../../shared/api/reading-answers.js';
import type { ReviewQueueQuery } from '../../../../../shared/api/review-answers.js';
import { STATUS_WORDS } from '../../../shared/readings/reading-words';
import { QUEUE_DEFAULT_STATUS } from '../data/review-filters';
import { dateRangeRefusal } from '../../../core/format/date-range';

/** The review queue's filters: accession, character, site, status, observed date range, and the observer picked from a row. */
@Component({
  selector: 'hl-queue-filters',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let q = query();
    <div class="grid">
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Status</mat-label>
        <mat-select [value]="q.status ?? defaultStatus" (selectionChange)="set({ status: $event.value })">
          @for (s of statuses; track s) {
            <mat-option [value]="s">{{ statusWords[s].label }}{{ s === defaultStatus ? ' (to review)' : '' }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Accession</mat-label>
        <mat-select [value]="q.accessionId ?? null" (selectionChange)="set({ accessionId: $event.value ?? undefined })">
          <mat-option [value]="null">Any</mat-option>
          @for (a of accessions(); track a.id) {
            <mat-option [value]="a.id">{{ a.accessionNumber }} · {{ a.name }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Character</mat-label>
        <mat-select [value]="q.characterId ?? null" (selectionChange)="set({ characterId: $event.value ?? undefined })">
          <mat-option [value]="null">Any</mat-option>
          @for (c of colourCharacters(); track c.id) {
            <mat-option [value]="c.id">{{ c.label }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Site</mat-label>
        <mat-select [value]="q.siteId ?? null" (selectionChange)="set({ siteId: $event.value ?? undefined })">
          <mat-option [value]="null">Any</mat-option>
          @for (s of sites(); track s.id) {
            <mat-option [value]="s.id">{{ s.code }} · {{ s.name }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Observed from</mat-label>
        <input #fromBox matInput type="date" [value]="q.from ?? ''" (change)="setRange('from', fromBox)" [attr.aria-invalid]="rangeError() ? true : null" aria-describedby="queue-range-error" />
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Observed to</mat-label>
        <input #toBox matInput type="date" [value]="q.to ?? ''" (change)="setRange('to', toBox)" [attr.aria-invalid]="rangeError() ? true : null" aria-describedby="queue-range-error" />
      </mat-form-field>
    </div>
    @if (rangeError(); as message) {
      <p class="range-error" id="queue-range-error" role="alert"><mat-icon aria-hidden="true">error</mat-icon> {{ message }}</p>
    }
    <div class="row">
      @if (q.observerId) {
        <button mat-stroked-button type="button" (click)="set({ observerId: undefined })" [attr.aria-label]="'Stop filtering by observer ' + (observerName() ?? q.observerId)">
          <mat-icon aria-hidden="true">close</mat-icon> Observer: {{ observerName() ?? q.observerId }}
        </button>
      } @else {
        <span class="hl-muted hint">Pick an observer's name in the list to see only their readings.</span>
      }
      <button mat-button type="button" (click)="clearAll()"><mat-icon aria-hidden="true">filter_alt_off</mat-icon> Clear filters</button>
    </div>
  `,
  styles: `
    .grid {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(180px, 1fr));
      gap: 8px 12px;
    }
    .row {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
      margin-top: 8px;
    }
    .hint {
      font: var(--mat-sys-body-small);
    }
    .range-error {
      display: flex;
      align-items: center;
      gap: 6px;
      margin: 8px 0 0;
      color: var(--mat-sys-error);
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
  protected readonly colourCharacters = computed(() => this.characters().filter((c) => c.colour));
  protected readonly rangeError = signal<string | null>(null);

  protected set(change: Partial<ReviewQueueQuery>): void {
    this.changed.emit(change);
  }

  /**
   * Applies an observed-from or observed-to day unless it would put From after To; then the day
   * is not applied, the field goes back to the day in force and the message says why.
   */
  protected setRange(end: 'from' | 'to', box: HTMLInputElement): void {
    const value = box.value || undefined;
    const q = this.query();
    const refusal = dateRangeRefusal(end === 'from' ? value : q.from, end === 'to' ? value : q.to);
    this.rangeError.set(refusal);
    if (refusal) {
      box.value = q[end] ?? '';
      return;
    }
    this.set({ [end]: value });
  }

  protected clearAll(): void {
    this.rangeError.set(null);
    this.clear.emit();
  }
}
