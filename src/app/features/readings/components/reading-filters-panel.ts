import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import type { Accession, Character, Site } from '../../../../../shared/api/collection-answers.js';
import { READING_METHODS, READING_STATUSES, type ReadingListQuery } from '../../../../../shared/api/reading-answers.js';
import { METHOD_WORDS, STATUS_WORDS } from '../../../shared/readings/reading-words';
import { dateRangeRefusal } from '../../../core/format/date-range';

/** The readings table's filters; each change is sent up and goes into the URL. */
@Component({
  selector: 'hl-reading-filters-panel',
  imports: [MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let q = query();
    <div class="grid">
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
        <mat-label>Season</mat-label>
        <mat-select [value]="q.season ?? null" (selectionChange)="set({ season: $event.value ?? undefined })">
          <mat-option [value]="null">Any</mat-option>
          @for (name of seasonNames(); track name) {
            <mat-option [value]="name">{{ name }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Season year</mat-label>
        <input matInput type="number" inputmode="numeric" min="1900" max="2200" [value]="q.seasonYear ?? ''" (change)="setYear($any($event.target).value)" />
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Method</mat-label>
        <mat-select [value]="q.method ?? null" (selectionChange)="set({ method: $event.value ?? undefined })">
          <mat-option [value]="null">Any</mat-option>
          @for (m of methods; track m) {
            <mat-option [value]="m">{{ methodWords[m].label }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Status</mat-label>
        <mat-select [value]="q.status ?? null" (selectionChange)="set({ status: $event.value ?? undefined })">
          <mat-option [value]="null">Any</mat-option>
          @for (s of statuses; track s) {
            <mat-option [value]="s">{{ statusWords[s].label }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>From</mat-label>
        <input #fromBox matInput type="date" [value]="q.from ?? ''" (change)="setRange('from', fromBox)" [attr.aria-invalid]="rangeError() ? true : null" aria-describedby="date-range-error" />
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>To</mat-label>
        <input #toBox matInput type="date" [value]="q.to ?? ''" (change)="setRange('to', toBox)" [attr.aria-invalid]="rangeError() ? true : null" aria-describedby="date-range-error" />
      </mat-form-field>
    </div>
    @if (rangeError(); as message) {
      <p class="range-error" id="date-range-error" role="alert"><mat-icon aria-hidden="true">error</mat-icon> {{ message }}</p>
    }
    <div class="row">
      <mat-checkbox [checked]="q.observerId !== undefined && q.observerId === myId()" (change)="set({ observerId: $event.checked ? (myId() ?? undefined) : undefined })">Only mine</mat-checkbox>
      @if (q.observerId !== undefined && q.observerId !== myId()) {
        <button mat-stroked-button type="button" (click)="set({ observerId: undefined })"><mat-icon aria-hidden="true">close</mat-icon> Observer {{ observerName() ?? q.observerId }}</button>
      }
      <mat-checkbox [checked]="!!q.includeSuperseded" (change)="set({ includeSuperseded: $event.checked || undefined })">Include superseded</mat-checkbox>
      <button mat-button type="button" (click)="clear.emit()"><mat-icon aria-hidden="true">filter_alt_off</mat-icon> Clear filters</button>
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
    .range-error {
      display: flex;
      align-items: center;
      gap: 6px;
      margin: 0 0 8px;
      color: var(--mat-sys-error);
    }
    mat-checkbox {
      min-height: 48px;
      display: inline-flex;
      align-items: center;
    }
  `,
})
export class ReadingFiltersPanel {
  readonly query = input.required<ReadingListQuery>();
  readonly accessions = input.required<readonly Accession[]>();
  readonly characters = input.required<readonly Character[]>();
  readonly sites = input.required<readonly Site[]>();
  /** The signed-in person's id, for "Only mine". */
  readonly myId = input<number | null>(null);
  /** The name of the observer filtered by, when it is somebody else (from a row's name). */
  readonly observerName = input<string | null>(null);
  /** Some filters changed. */
  readonly changed = output<Partial<ReadingListQuery>>();
  /** Every filter cleared. */
  readonly clear = output<void>();

  protected readonly methods = READING_METHODS;
  protected readonly statuses = READING_STATUSES;
  protected readonly methodWords = METHOD_WORDS;
  protected readonly statusWords = STATUS_WORDS;
  protected readonly colourCharacters = computed(() => this.characters().filter((c) => c.colour));
  /** Season names of every site, once each, in the order the sites list them. */
  protected readonly seasonNames = computed(() => [...new Set(this.sites().flatMap((s) => s.seasons.map((season) => season.name)))]);

  /** Why the last date typed was not applied: From after To. */
  protected readonly rangeError = signal<string | null>(null);

  protected set(change: Partial<ReadingListQuery>): void {
    this.changed.emit(change);
  }

  /**
   * Applies a From or To date unless it would put From after To; then the date is not applied,
   * the field goes back to the date in force and the message says why.
   */
  protected setRange(end: 'from' | 'to', box: HTMLInputElement): void {
    const value = box.value || undefined;
    const q = this.query();
    const from = end === 'from' ? value : q.from;
    const to = end === 'to' ? value : q.to;
    const refusal = dateRangeRefusal(from, to);
    if (refusal) {
      this.rangeError.set(refusal);
      box.value = q[end] ?? '';
      return;
    }
    this.rangeError.set(null);
    this.set({ [end]: value });
  }

  protected setYear(text: string): void {
    const year = Number(text);
    this.set({ seasonYear: text && Number.isInteger(year) ? year : undefined });
  }
}
