import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { PlantSheetApi } from '../../../shared/collection/plant-sheet-api';

/** This season's count of plants fully, partly and not yet characterised, leading to the progress table. */
@Component({
  selector: 'hl-progress-summary',
  imports: [MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (progress.value(); as p) {
      <a class="summary" routerLink="/collection/progress">
        <mat-icon aria-hidden="true">checklist</mat-icon>
        <span>This season: <strong>{{ p.counts.complete }}</strong> {{ p.counts.complete === 1 ? 'plant' : 'plants' }} fully characterised, <strong>{{ p.counts.partial }}</strong> partly, <strong>{{ p.counts['not-started'] }}</strong> not started</span>
        <mat-icon aria-hidden="true">chevron_right</mat-icon>
      </a>
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
  `,
})
export class ProgressSummary {
  private readonly api = inject(PlantSheetApi);
  protected readonly progress = rxResource({ stream: () => this.api.progress() });
}
