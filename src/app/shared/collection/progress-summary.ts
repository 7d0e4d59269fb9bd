import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { PlantSheetApi } from './plant-sheet-api';

/**
 * This season's count, "N of M plants characterised this season" (fully: every row done or
 * skipped), with how many are partly done and not started, leading to the progress table. Shown
 * on Collection and on Record, the recorder's home.
 */
@Component({
  selector: 'hl-progress-summary',
  imports: [MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (progress.hasValue()) {
      @let p = progress.value();
      <a class="summary" routerLink="/collection/progress">
        <mat-icon aria-hidden="true">checklist</mat-icon>
        <span
          ><strong>{{ p.counts.complete }}</strong> of <strong>{{ total() }}</strong> {{ total() === 1 ? 'plant' : 'plants' }} characterised this season · {{ p.counts.partial }} partly,
          {{ p.counts['not-started'] }} not started</span
        >
        <mat-icon aria-hidden="true">chevron_right</mat-icon>
      </a>
    } @else if (progress.isLoading()) {
      <!-- Holds the summary's place while it loads, so the page below does not jump down under a finger about to tap. -->
      <p class="summary pending" aria-busy="true">Counting this season's plants…</p>
    }
  `,
  styles: `
    .summary {
      display: flex;
      align-items: center;
      gap: 8px;
      min-height: 48px;
      padding: 4px 12px;
      margin: 0 0 12px;
      border-radius: 8px;
      background: var(--mat-sys-surface-container);
      color: inherit;
      text-decoration: none;
      font-variant-numeric: tabular-nums;
    }
    .summary span {
      flex: 1;
    }
    .pending {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class ProgressSummary {
  private readonly api = inject(PlantSheetApi);
  protected readonly progress = rxResource({ stream: () => this.api.progress() });
  protected readonly total = computed(() => {
    // Out of range the count cannot be asked: the summary then stays away rather than failing.
    const counts = this.progress.hasValue() ? this.progress.value().counts : null;
    return counts ? counts.complete + counts.partial + counts['not-started'] : 0;
  });
}
