import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import type { Accession, Character, Site } from '../../../../shared/api/collection-answers.js';
import { dateRangeRefusal } from '../../core/format/date-range';
import { FilterChoice } from './filter-choice';

/** The filters every list of readings has: which accession, colour character and site, and a range of days. */
export interface PlaceFilters {
  accessionId?: number;
  characterId?: number;
  siteId?: number;
  from?: string;
  to?: string;
}

/**
 * The frame of a list of readings' filters (the Readings table, the review queue): the
 * accession, character and site choices and the From–To days, the list's own fields projected
 * around them (`leading` before, the rest between the choices and the days, `actions` beside
 * "Clear filters").
 */
@Component({
  selector: 'hl-filter-panel',
  imports: [FilterChoice, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="grid">
      <ng-content select="[leading]" />
      <hl-filter-choice label="Accession" [value]="query().accessionId" [options]="accessionOptions()" (chosen)="changed.emit({ accessionId: $event })" />
      <hl-filter-choice label="Character" [value]="query().characterId" [options]="characterOptions()" (chosen)="changed.emit({ characterId: $event })" />
      <hl-filter-choice label="Site" [value]="query().siteId" [options]="siteOptions()" (chosen)="changed.emit({ siteId: $event })" />
      <ng-content />
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>{{ fromLabel() }}</mat-label>
        <input #fromBox matInput type="date" [value]="query().from ?? ''" (change)="setRange('from', fromBox)" [attr.aria-invalid]="rangeError() ? true : null" [attr.aria-describedby]="rangeErrorId()" />
      </mat-form-field>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>{{ toLabel() }}</mat-label>
        <input #toBox matInput type="date" [value]="query().to ?? ''" (change)="setRange('to', toBox)" [attr.aria-invalid]="rangeError() ? true : null" [attr.aria-describedby]="rangeErrorId()" />
      </mat-form-field>
    </div>
    @if (rangeError(); as message) {
      <p class="range-error" [id]="rangeErrorId()" role="alert"><mat-icon aria-hidden="true">error</mat-icon> {{ message }}</p>
    }
    <div class="row">
      <ng-content select="[actions]" />
      <button mat-button type="button" (click)="clearAll()"><mat-icon aria-hidden="true">filter_alt_off</mat-icon> Clear filters</button>
    </div>
  `,
  styles: `
    .grid {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(180px, 1fr));
      gap: 8px 12px;
    }
    .range-error {
      display: flex;
      align-items: center;
      gap: 6px;
      margin: 8px 0 0;
      color: var(--mat-sys-error);
    }
    .row {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
      margin-top: 8px;
    }
  `,
})
export class FilterPanel {
  readonly query = input.required<PlaceFilters>();
  readonly accessions = input.required<readonly Accession[]>();
  readonly characters = input.required<readonly Character[]>();
  readonly sites = input.required<readonly Site[]>();
  readonly fromLabel = input('From');
  readonly toLabel = input('To');
  /** The id of the From–To refusal, which both day fields point to; unique on the page. */
  readonly rangeErrorId = input('date-range-error');
  /** One of the shared filters changed. */
  readonly changed = output<PlaceFilters>();
  /** Every filter cleared. */
  readonly clear = output<void>();

  protected readonly accessionOptions = computed(() => this.accessions().map((a) => ({ value: a.id, text: `${a.accessionNumber} · ${a.name}` })));
  /** Only colour characters have readings. */
  protected readonly characterOptions = computed(() => this.characters().filter((c) => c.colour).map((c) => ({ value: c.id, text: c.label })));
  /** Why the last day typed was not applied: From after To. */
  protected readonly rangeError = signal<string | null>(null);

  protected readonly siteOptions = computed(() => this.sites().map((s) => ({ value: s.id, text: `${s.code} · ${s.name}` })));

  /**
   * Applies a From or To day unless it would put From after To; then the day is not applied, the
   * field goes back to the day in force and the message says why.
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
    this.changed.emit({ [end]: value });
  }

  protected clearAll(): void {
    this.rangeError.set(null);
    this.clear.emit();
  }
}
