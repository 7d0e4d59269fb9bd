import { ChangeDetectionStrategy, Component, DestroyRef, ErrorHandler, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import type { Subscription } from 'rxjs';

import { AuthStore } from '../../../core/auth/auth-store';
import { mayOpen } from '../../../core/layout/nav-items';
import { Viewport } from '../../../core/layout/viewport';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { VerdictMark } from '../../../shared/chips/verdict-mark';
import { deltaEText } from '../../../shared/chips/chip-words';
import { ReadingFiltersPanel } from '../components/reading-filters-panel';
import { saveBlob } from '../../../shared/readings/blob-download';
import { ReadingListParams } from '../../../shared/readings/reading-list-params';
import { READING_SORTS, type ReadingListQuery, type ReadingSort } from '../../../../../shared/api/reading-answers.js';
import { DEFAULT_SORT, PAGE_SIZES, activeFilterCount, filtersFromParams, paramsFromFilters } from '../data/reading-filters';
import { LIGHT_WORDS, METHOD_WORDS, STATUS_WORDS, wordsFor } from '../../../shared/readings/reading-words';
import { ReadingsApi, type ExportFormat } from '../../../shared/readings/readings-api';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';
import { ReloadState } from '../../../shared/reload-state';

/** An export under way: which format and how far. */
interface ExportRun {
  format: ExportFormat;
  loaded: number;
  fraction: number | null;
}

/**
 * Readings: the table with server-side filters, sort and pages, all kept in the URL; cards on a
 * phone; CSV and XLSX exports of the current filters with visible progress.
 */
@Component({
  selector: 'hl-readings-page',
  imports: [LocalDateTimePipe, ReloadState, MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, MatSortModule, MatTableModule, ReadingFiltersPanel, RouterLink, VerdictMark],
  templateUrl: './readings-page.html',
  styleUrls: ['../../../shared/readings/reading-table.scss', './readings-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReadingsPage extends ReadingListParams {
  private readonly api = inject(ReadingsApi);
  private readonly collection = inject(CollectionApi);
  private readonly router = inject(Router);
  private readonly errors = inject(ErrorHandler);

  protected readonly handset = inject(Viewport).handset;
  protected readonly me = inject(AuthStore).currentUser;
  /** Whether the signed-in role may take readings (reviewers may not: the Record page would turn them away). */
  protected readonly mayRecord = computed(() => mayOpen(this.me()?.role, '/record'));
  protected readonly columns = ['swatch', 'observedAt', 'accession', 'character', 'site', 'method', 'deltaE00', 'observer', 'status'];
  protected readonly pageSizes = PAGE_SIZES;
  protected readonly methodWords = METHOD_WORDS;
  protected readonly lightWords = LIGHT_WORDS;
  protected readonly statusWords = STATUS_WORDS;
  protected readonly wordsFor = wordsFor;
  protected readonly deltaE = deltaEText;

  // The table's own query parameters; the rest come with ReadingListParams.
  readonly season = input<string>();
  readonly seasonYear = input<string>();
  readonly method = input<string>();
  readonly includeSuperseded = input<string>();
  readonly sort = input<string>();
  readonly dir = input<string>();

  protected readonly query = computed(() =>
    filtersFromParams({ ...this.listParams(), season: this.season(), seasonYear: this.seasonYear(), method: this.method(), includeSuperseded: this.includeSuperseded(), sort: this.sort(), dir: this.dir() }),
  );
  protected readonly filterCount = computed(() => activeFilterCount(this.query()));
  protected readonly filtersOpen = signal(false);

  protected readonly readings = rxResource({ params: () => this.query(), stream: ({ params }) => this.api.list(params) });
  protected readonly rows = computed(() => (this.readings.hasValue() ? this.readings.value().items : []));
  protected readonly total = computed(() => (this.readings.hasValue() ? this.readings.value().total : 0));
  protected readonly accessions = rxResource({ stream: () => this.collection.accessions() });
  protected readonly characters = rxResource({ stream: () => this.collection.characters() });
  protected readonly sites = rxResource({ stream: () => this.collection.sites() });
  protected readonly observerName = computed(() => {
    const id = this.query().observerId;
    return this.rows().find((r) => r.observerId === id)?.observerName ?? null;
  });

  protected readonly exporting = signal<ExportRun | null>(null);
  private exportRun: Subscription | null = null;

  constructor() {
    super();
    inject(DestroyRef).onDestroy(() => this.exportRun?.unsubscribe());
  }

  /** Filters changed: back to the first page. */
  protected filter(change: Partial<ReadingListQuery>): void {
    this.go({ ...this.query(), ...change, page: 1 });
  }

  protected clearFilters(): void {
    const { sort, dir, pageSize } = this.query();
    this.go({ sort, dir, pageSize, page: 1 });
  }

  /** A row's observer name filters by that observer. */
  protected filterByObserver(observerId: number): void {
    this.filter({ observerId });
  }

  protected sortBy(sort: Sort): void {
    const active = (READING_SORTS as readonly string[]).includes(sort.active) ? (sort.active as ReadingSort) : DEFAULT_SORT.sort;
    this.go({ ...this.query(), sort: sort.direction ? active : DEFAULT_SORT.sort, dir: sort.direction || DEFAULT_SORT.dir, page: 1 });
  }

  protected turnPage(event: PageEvent): void {
    this.go({ ...this.query(), page: event.pageIndex + 1, pageSize: event.pageSize });
  }

  /** Downloads the current filters' readings as a file, showing the bytes as they arrive. */
  protected download(format: ExportFormat): void {
    this.exportRun?.unsubscribe();
    this.exporting.set({ format, loaded: 0, fraction: null });
    this.exportRun = this.api.export(format, this.query()).subscribe({
      next: (step) => {
        if (step.kind === 'progress') this.exporting.set({ format, loaded: step.loaded, fraction: step.fraction });
        else {
          saveBlob(step.blob, step.filename);
          this.exporting.set(null);
        }
      },
      error: (error: unknown) => {
        this.exporting.set(null);
        this.errors.handleError(error);
      },
    });
  }

  protected cancelExport(): void {
    this.exportRun?.unsubscribe();
    this.exporting.set(null);
  }

  protected kilobytes(bytes: number): string {
    return (bytes / 1024).toFixed(bytes < 10_240 ? 1 : 0);
  }

  private go(query: ReadingListQuery): void {
    void this.router.navigate([], { queryParams: paramsFromFilters(query) });
  }
}
