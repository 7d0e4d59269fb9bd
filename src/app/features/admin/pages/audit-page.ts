import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';

import { LocalDateTimePipe } from '../../../core/format/local-date-time';
import { AdminApi, type AuditFilters } from '../data/admin-api';
import { dateRangeRefusal } from '../../../core/format/date-range';

/** The kinds of event the "What" filter offers: an action family and its plain name. */
export const AUDIT_KINDS: readonly { value: string; label: string }[] = [
  { value: 'auth', label: 'Sign-ins and passwords' },
  { value: 'user', label: 'People' },
  { value: 'invitation', label: 'Invitations' },
  { value: 'reading', label: 'Readings and reviews' },
  { value: 'readings', label: 'Reading imports' },
  { value: 'calibration', label: 'Calibration' },
  { value: 'accession', label: 'Accessions' },
  { value: 'plant', label: 'Plants' },
  { value: 'site', label: 'Sites and seasons' },
  { value: 'character', label: 'Characters' },
  { value: 'descriptor', label: 'Descriptors' },
  { value: 'observation', label: 'Observations' },
  { value: 'photo', label: 'Photos' },
  { value: 'notification', label: 'Notices read' },
  { value: 'api-token', label: 'API tokens' },
];

/** The audit trail, newest first, one server page at a time, each event as a sentence; filtered by who, what and when. */
@Component({
  selector: 'hl-audit-page',
  imports: [LocalDateTimePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatPaginatorModule, MatProgressBarModule, MatSelectModule],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPage {
  private readonly api = inject(AdminApi);

  protected readonly kinds = AUDIT_KINDS;
  /** The paginator's page, counted from 0 as MatPaginator does. */
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly filters = signal<AuditFilters>({});
  /** Why the last From/To was not applied. */
  protected readonly rangeError = signal<string | null>(null);
  protected readonly events = rxResource({
    params: () => ({ page: this.pageIndex() + 1, pageSize: this.pageSize(), filters: this.filters() }),
    stream: ({ params }) => this.api.audit(params.page, params.pageSize, params.filters),
  });
  protected readonly rows = computed(() => (this.events.hasValue() ? this.events.value().items : []));
  protected readonly total = computed(() => (this.events.hasValue() ? this.events.value().total : 0));
  protected readonly filtered = computed(() => Object.values(this.filters()).some(Boolean));

  protected turnPage(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
    this.pageSize.set(event.pageSize);
  }

  /** Applies one filter and goes back to the first page; From after To is refused with a message. */
  protected filter(change: AuditFilters, box?: HTMLInputElement): void {
    const next = { ...this.filters(), ...change };
    const refusal = dateRangeRefusal(next.from, next.to);
    if (refusal) {
      this.rangeError.set(refusal);
      if (box) box.value = (change.from !== undefined ? this.filters().from : this.filters().to) ?? '';
      return;
    }
    this.rangeError.set(null);
    this.filters.set(next);
    this.pageIndex.set(0);
  }

  protected clearFilters(): void {
    this.rangeError.set(null);
    this.filters.set({});
    this.pageIndex.set(0);
  }
}

/** How many items of a list in an event's detail are named before the rest are counted. */
const LISTED_ITEMS = 4;

/** An event's detail as "key: value" pairs in one line, long lists shortened; a dash when there is none. */
export function describeAuditDetail(detail: Record<string, unknown> | null): string {
  if (!detail || Object.keys(detail).length === 0) return '—';
  return Object.entries(detail)
    .map(([key, value]) => `${key}: ${describeValue(value)}`)
    .join('; ');
}

function describeValue(value: unknown): string {
  if (typeof value === 'string') return value;
  if (!Array.isArray(value)) return JSON.stringify(value);
  const named = value.slice(0, LISTED_ITEMS).map(describeValue).join(', ');
  return value.length > LISTED_ITEMS ? `${named} and ${value.length - LISTED_ITEMS} more` : named;
}
