import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';

import type { AuditEventRow } from '../../../../../shared/api/auth.js';
import { AdminApi } from '../data/admin-api';

/** The audit trail, newest first, one server page at a time. */
@Component({
  selector: 'hl-audit-page',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, MatTableModule],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPage {
  private readonly api = inject(AdminApi);

  protected readonly columns = ['at', 'actor', 'action', 'subject', 'detail', 'ip'];
  /** The paginator's page, counted from 0 as MatPaginator does. */
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly events = rxResource({
    params: () => ({ page: this.pageIndex() + 1, pageSize: this.pageSize() }),
    stream: ({ params }) => this.api.audit(params.page, params.pageSize),
  });
  protected readonly rows = computed(() => (this.events.hasValue() ? this.events.value().items : []));
  protected readonly total = computed(() => (this.events.hasValue() ? this.events.value().total : 0));

  protected turnPage(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
    this.pageSize.set(event.pageSize);
  }

  protected describeDetail(event: AuditEventRow): string {
    return describeAuditDetail(event.detail);
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
