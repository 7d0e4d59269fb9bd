import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';

import type { PlantProgress, ProgressState } from '../../../../../shared/api/plant-sheet-answers.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { PlantSheetApi } from '../../../shared/collection/plant-sheet-api';
import { plantSheetPath } from '../../../shared/collection/sheet-link';
import { settledPercent } from '../../../shared/collection/sheet-progress';
import { LoadState } from '../../../shared/load-state';
import { STATE_WORDS } from '../components/plant-progress-list';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { sortProgress, type ProgressColumn } from '../data/progress-sort';

/** Collection → Progress: every plant's characterisation this season, fully, partly or not started, in a table that sorts. */
@Component({
  selector: 'hl-progress-page',
  imports: [LoadState, MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule, MatSortModule, MatTableModule, RouterLink],
  template: `
    <section class="hl-page">
      <a mat-button routerLink="/collection" class="back"><mat-icon>arrow_back</mat-icon> Collection</a>
      <h1>Characterisation progress</h1>
      <p class="hl-muted">Each plant in the season its site is in now: every colour character and descriptor done or skipped is fully characterised.</p>
      <mat-form-field class="site">
        <mat-label>Site</mat-label>
        <mat-select [value]="siteId()" (selectionChange)="siteId.set($event.value)">
          <mat-option [value]="null">Every site</mat-option>
          @for (s of sites.value() ?? []; track s.id) {
            <mat-option [value]="s.id">{{ s.code }} · {{ s.name }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <hl-load-state [resource]="progress" what="progress">
        @if (progress.value(); as p) {
          <p class="counts" role="status">
            <span><mat-icon inline aria-hidden="true">{{ words.complete.icon }}</mat-icon> {{ p.counts.complete }} fully</span>
            <span><mat-icon inline aria-hidden="true">{{ words.partial.icon }}</mat-icon> {{ p.counts.partial }} partly</span>
            <span><mat-icon inline aria-hidden="true">{{ words['not-started'].icon }}</mat-icon> {{ p.counts['not-started'] }} not started</span>
          </p>
          <div class="table-wrap">
            <table mat-table [dataSource]="rows()" matSort [matSortActive]="sort().active" [matSortDirection]="sort().direction" (matSortChange)="sort.set($any($event))">
              <ng-container matColumnDef="accession">
                <th mat-header-cell *matHeaderCellDef mat-sort-header>Accession</th>
                <td mat-cell *matCellDef="let r"><a [routerLink]="['/collection/accessions', r.accessionId]">{{ r.accessionNumber }}</a> {{ r.accessionName }}</td>
              </ng-container>
              <ng-container matColumnDef="plant">
                <th mat-header-cell *matHeaderCellDef mat-sort-header>Plant</th>
                <td mat-cell *matCellDef="let r"><a [routerLink]="sheetPath(r.plantId)">{{ r.plantLabel }}</a></td>
              </ng-container>
              <ng-container matColumnDef="site">
                <th mat-header-cell *matHeaderCellDef mat-sort-header>Site</th>
                <td mat-cell *matCellDef="let r">{{ r.siteCode }} · {{ r.seasonLabel ?? 'no season ' + r.seasonYear }}</td>
              </ng-container>
              <ng-container matColumnDef="state">
                <th mat-header-cell *matHeaderCellDef mat-sort-header>State</th>
                <td mat-cell *matCellDef="let r"><mat-icon inline aria-hidden="true">{{ stateOf(r).icon }}</mat-icon> {{ stateOf(r).label }}</td>
              </ng-container>
              <ng-container matColumnDef="colour">
                <th mat-header-cell *matHeaderCellDef mat-sort-header>Colour characters</th>
                <td mat-cell *matCellDef="let r" class="num">{{ r.colour.done }} of {{ r.colour.total }}{{ r.colour.skipped ? ' (' + r.colour.skipped + ' skipped)' : '' }}</td>
              </ng-container>
              <ng-container matColumnDef="descriptors">
                <th mat-header-cell *matHeaderCellDef mat-sort-header>Descriptors</th>
                <td mat-cell *matCellDef="let r" class="num">{{ r.descriptors.done }} of {{ r.descriptors.total }}{{ r.descriptors.skipped ? ' (' + r.descriptors.skipped + ' skipped)' : '' }}</td>
              </ng-container>
              <ng-container matColumnDef="percent">
                <th mat-header-cell *matHeaderCellDef mat-sort-header>Done or skipped</th>
                <td mat-cell *matCellDef="let r" class="num">{{ percent(r) }} %</td>
              </ng-container>
              <tr mat-header-row *matHeaderRowDef="columns"></tr>
              <tr mat-row *matRowDef="let row; columns: columns"></tr>
            </table>
          </div>
        }
      </hl-load-state>
    </section>
  `,
  styles: `
    .site {
      min-width: 240px;
    }
    .counts {
      display: flex;
      flex-wrap: wrap;
      gap: 16px;
      font: var(--mat-sys-title-medium);
      font-variant-numeric: tabular-nums;
    }
    .table-wrap {
      overflow-x: auto;
    }
    .num {
      font-variant-numeric: tabular-nums;
      white-space: nowrap;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProgressPage {
  private readonly api = inject(PlantSheetApi);
  private readonly collection = inject(CollectionApi);
  private readonly auth = inject(AuthStore);

  protected readonly words = STATE_WORDS;
  protected readonly columns: ProgressColumn[] = ['accession', 'plant', 'site', 'state', 'colour', 'descriptors', 'percent'];
  protected readonly siteId = signal<number | null>(null);
  protected readonly sort = signal<{ active: ProgressColumn; direction: 'asc' | 'desc' | '' }>({ active: 'accession', direction: 'asc' });
  protected readonly sites = rxResource({ stream: () => this.collection.sites() });
  protected readonly progress = rxResource({ params: () => ({ siteId: this.siteId() }), stream: ({ params }) => this.api.progress(params.siteId) });
  protected readonly rows = computed(() => sortProgress(this.progress.value()?.plants ?? [], this.sort().active, this.sort().direction));

  /** Recorders open the sheet to fill in; reviewers the same sheet read-only (the Record section would turn them away). */
  protected sheetPath(plantId: number): (string | number)[] {
    return plantSheetPath(this.auth.role(), plantId);
  }

  protected stateOf(p: PlantProgress): (typeof STATE_WORDS)[ProgressState] {
    return STATE_WORDS[p.state];
  }

  protected percent(p: Parameters<typeof settledPercent>[0]): number {
    return settledPercent(p);
  }
}
