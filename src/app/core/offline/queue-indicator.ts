import { ChangeDetectionStrategy, Component, booleanAttribute, computed, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { OfflineQueue } from './offline-queue';

/**
 * "n readings waiting to send", linking to the queue, shown only while something waits: a pill in
 * the toolbar at a desk, a full-width strip under the toolbar on a phone (whose toolbar is full).
 */
@Component({
  selector: 'hl-queue-indicator',
  imports: [MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '[class.banner]': 'banner()' },
  template: `
    @if (count() > 0) {
      <a class="indicator" routerLink="/queue" [class.attention]="attention() > 0">
        <mat-icon aria-hidden="true">{{ attention() > 0 ? 'error' : queue.sending() ? 'sync' : 'cloud_upload' }}</mat-icon>
        <span class="words">{{ words() }}</span>
        @if (banner()) {
          <mat-icon class="go" aria-hidden="true">chevron_right</mat-icon>
        }
      </a>
    }
  `,
  styles: `
    :host {
      display: contents;
    }
    .indicator {
      display: inline-flex;
      align-items: center;
      gap: 6px;
      min-height: 40px;
      padding: 0 14px 0 10px;
      border-radius: 20px;
      background: #f7edda;
      color: #1d2b1a;
      font: var(--mat-sys-label-large);
      font-weight: 600;
      text-decoration: none;
      white-space: nowrap;
    }
    .indicator.attention {
      outline: 2px solid #ffb4ab;
    }
    :host(.banner) .indicator {
      display: flex;
      min-height: 48px;
      border-radius: 0;
      padding: 0 16px;
      border-bottom: 1px solid #d9ccb3;
      font: var(--mat-sys-title-small);
      font-weight: 600;
      position: relative;
      z-index: 2;
    }
    :host(.banner) .indicator.attention {
      outline: none;
      border-bottom: 3px solid #ba1a1a;
    }
    .go {
      margin-left: auto;
    }
    mat-icon {
      flex: none;
    }
  `,
})
export class QueueIndicator {
  protected readonly queue = inject(OfflineQueue);
  /** Whether to show as a full-width strip (phones). */
  readonly banner = input(false, { transform: booleanAttribute });

  protected readonly count = this.queue.pending;
  protected readonly attention = this.queue.needsAttention;
  protected readonly words = computed(() => {
    const n = this.count();
    const base = `${n} ${n === 1 ? 'reading' : 'readings'} waiting to send`;
    const a = this.attention();
    return a ? `${base}; ${a} ${a === 1 ? 'needs' : 'need'} your attention` : base;
  });
}
