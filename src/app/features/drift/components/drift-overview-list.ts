import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { RouterLink } from '@angular/router';

import type { DriftOverviewFlag, DriftOverviewItem } from '../../../../../shared/api/analysis-answers.js';
import { deltaEText } from '../../../shared/chips/chip-words';
import { AnalysisApi } from '../data/analysis-api';
import { pValueText } from '../data/drift-words';

/**
 * The Drift landing page's list: every accession × character of the collection the drift rules
 * flag, between seasons or between sites within one season, largest ΔE00 first; each flag opens
 * the season detail or the site comparison of that season.
 */
@Component({
  selector: 'hl-drift-overview-list',
  imports: [MatButtonModule, MatIconModule, MatProgressSpinnerModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="hl-muted pick">Pick an accession and a colour character above to see how its colour moves from season to season, or open one flagged below.</p>
    <h2>Where colour moves</h2>
    @if (overview.error()) {
      <div class="hl-notice hl-notice-error" role="alert">
        <mat-icon aria-hidden="true">cloud_off</mat-icon>
        <p>The overview could not be loaded. <button mat-button type="button" (click)="overview.reload()">Try again</button></p>
      </div>
    } @else if (overview.value(); as o) {
      <p class="hl-muted">
        {{ o.items.length }} of {{ o.pairs }} accession × character {{ o.pairs === 1 ? 'pair' : 'pairs' }} ({{ o.readings }} readings in force) flagged: a season change, or two sites apart within the same season,
        each by the character's threshold and a permutation test.
      </p>
      @if (o.items.length === 0) {
        <p class="hl-empty"><mat-icon aria-hidden="true">check_circle</mat-icon> Nothing flagged: every character holds its colour across seasons and sites.</p>
      } @else {
        <ol class="items">
          @for (item of o.items; track item.accessionId + ':' + item.characterId) {
            <li>
              <p class="title">
                <strong>{{ item.accessionNumber }}</strong> {{ item.accessionName }} · {{ item.characterLabel }}
                <span class="hl-number de">ΔE00 {{ de(item.deltaE00) }}</span>
              </p>
              <ul class="flags">
                @for (f of item.flags; track f.label) {
                  <li>
                    <a [routerLink]="f.kind === 'season-drift' ? '/drift' : '/drift/sites'" [queryParams]="linkOf(item, f)">
                      <mat-icon aria-hidden="true">{{ f.kind === 'season-drift' ? 'calendar_month' : 'place' }}</mat-icon>
                      {{ f.kind === 'season-drift' ? 'Season change' : 'Sites differ' }}: {{ f.label }}
                    </a>
                    <span class="hl-number hl-muted"> · ΔE00 {{ de(f.deltaE00) }}, {{ p(f.pValue) }}</span>
                  </li>
                }
              </ul>
            </li>
          }
        </ol>
      }
    } @else {
      <div class="hl-empty" role="status"><mat-spinner diameter="24" /> Analysing the collection…</div>
    }
  `,
  styles: `
    .items {
      padding-left: 24px;
      display: flex;
      flex-direction: column;
      gap: 12px;
    }
    .title {
      margin: 0;
    }
    .de {
      margin-left: 8px;
    }
    .flags {
      list-style: none;
      padding: 0;
      margin: 4px 0 0;
    }
    .flags a {
      display: inline-flex;
      align-items: center;
      gap: 6px;
      min-height: 48px;
    }
    .flags mat-icon {
      margin-top: 0;
    }
  `,
})
export class DriftOverviewList {
  private readonly api = inject(AnalysisApi);

  protected readonly overview = rxResource({ stream: () => this.api.overview() });
  protected readonly de = deltaEText;
  protected readonly p = pValueText;

  protected linkOf(item: DriftOverviewItem, flag: DriftOverviewFlag): Record<string, string | number> {
    const base = { accessionId: item.accessionId, characterId: item.characterId };
    return flag.kind === 'site-difference' && flag.season !== null && flag.seasonYear !== null ? { ...base, season: flag.season, seasonYear: flag.seasonYear } : base;
  }
}
