import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import type { Accession, Character, Site } from '../../../../../shared/api/collection-answers.js';
import { READING_METHODS, READING_STATUSES, type ReadingListQuery } from '../../../../../shared/api/reading-answers.js';
import { FilterChoice } from '../../../shared/readings/filter-choice';
import { FilterPanel } from '../../../shared/readings/filter-panel';
import { METHOD_WORDS, STATUS_WORDS } from '../../../shared/readings/reading-words';

/** The readings table's filters (the shared place filters and its own); each change is sent up and goes into the URL. */
@Component({
  selector: 'hl-reading-filters-panel',
  imports: [FilterChoice, FilterPanel, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let q = query();
    <hl-filter-panel [query]="q" [accessions]="accessions()" [characters]="characters()" [sites]="sites()" (changed)="set($event)" (clear)="clear.emit()">
      <hl-filter-choice label="Season" [value]="q.season" [options]="seasonOptions()" (chosen)="set({ season: $event })" />
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Season year</mat-label>
        <input matInput type="number" inputmode="numeric" min="1900" max="2200" [value]="q.seasonYear ?? ''" (change)="setYear($any($event.target).value)" />
      </mat-form-field>
      <hl-filter-choice label="Method" [value]="q.method" [options]="methodOptions" (chosen)="set({ method: $event })" />
      <hl-filter-choice label="Status" [value]="q.status" [options]="statusOptions" (chosen)="set({ status: $event })" />
      <ng-container ngProjectAs="[actions]">
        <mat-checkbox [checked]="q.observerId !== undefined && q.observerId === myId()" (change)="set({ observerId: $event.checked ? (myId() ?? undefined) : undefined })">Only mine</mat-checkbox>
        @if (q.observerId !== undefined && q.observerId !== myId()) {
          <button mat-stroked-button type="button" (click)="set({ observerId: undefined })"><mat-icon aria-hidden="true">close</mat-icon> Observer {{ observerName() ?? q.observerId }}</button>
        }
        <mat-checkbox [checked]="!!q.includeSuperseded" (change)="set({ includeSuperseded: $event.checked || undefined })">Include superseded</mat-checkbox>
      </ng-container>
    </hl-filter-panel>
  `,
  styles: `
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

  protected readonly methodOptions = READING_METHODS.map((m) => ({ value: m, text: METHOD_WORDS[m].label }));
  protected readonly statusOptions = READING_STATUSES.map((s) => ({ value: s, text: STATUS_WORDS[s].label }));
  /** Season names of every site, once each, in the order the sites list them. */
  protected readonly seasonOptions = computed(() => [...new Set(this.sites().flatMap((s) => s.seasons.map((season) => season.name)))].map((name) => ({ value: name, text: name })));

  protected set(change: Partial<ReadingListQuery>): void {
    this.changed.emit(change);
  }

  protected setYear(text: string): void {
    const year = Number(text);
    this.set({ seasonYear: text && Number.isInteger(year) ? year : undefined });
  }
}
