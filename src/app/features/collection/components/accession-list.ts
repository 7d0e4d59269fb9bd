import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';

import type { Accession, Site } from '../../../../../shared/api/collection-answers.js';
import { Viewport } from '../../../core/layout/viewport';
import { AccessionRow, accessionRows, matchAccessions, sortAccessions } from '../data/collection-format';

/** Accessions with their site, other names and plant count; searchable, sortable on a desk. */
@Component({
  selector: 'hl-accession-list',
  imports: [MatFormFieldModule, MatIconModule, MatInputModule, MatSortModule, MatTableModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './accession-list.html',
  styleUrl: './collection-lists.scss',
})
export class AccessionList {
  /** The accessions to show. */
  readonly accessions = input.required<readonly Accession[]>();
  /** The sites, to name each accession's site. */
  readonly sites = input.required<readonly Site[]>();

  protected readonly handset = inject(Viewport).handset;
  protected readonly columns = ['accessionNumber', 'name', 'site', 'otherNames', 'plantCount'];
  protected readonly search = signal('');
  protected readonly sort = signal<Sort>({ active: 'accessionNumber', direction: 'asc' });
  protected readonly rows = computed(() => {
    const matching = matchAccessions(accessionRows(this.accessions(), this.sites()), this.search());
    const { active, direction } = this.sort();
    return sortAccessions(matching, active as keyof AccessionRow, direction);
  });

  protected searchFor(text: string): void {
    this.search.set(text);
  }

  protected sortBy(sort: Sort): void {
    this.sort.set(sort);
  }
}
