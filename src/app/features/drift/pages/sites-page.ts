import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';

import { CollectionApi } from '../../../shared/collection/collection-api';
import { DriftPicker } from '../components/drift-picker';
import { DriftTabs } from '../components/drift-tabs';
import { MeanSwatches, type MeanSwatch } from '../components/mean-swatches';
import { SiteMatrixTable } from '../components/site-matrix-table';
import { AnalysisApi } from '../data/analysis-api';
import { choiceFromParams, paramsFromChoice, subjectOf, type DriftChoice } from '../data/drift-subject';
import { markedPairs } from '../data/site-matrix';
import { AuthStore } from '../../../core/auth/auth-store';
import { mayOpen } from '../../../core/layout/nav-items';

/** Differences by site: each site's mean of one accession and character as a swatch, and the site-by-site ΔE00 matrix. */
@Component({
  selector: 'hl-sites-page',
  imports: [DriftPicker, DriftTabs, MatButtonModule, MatIconModule, MatProgressBarModule, MeanSwatches, RouterLink, SiteMatrixTable],
  template: `
    @let a = answer();
    <section class="hl-page">
      <h1>Drift</h1>
      <hl-drift-tabs [carried]="carried()" />
      <hl-drift-picker [choice]="choice()" [accessions]="accessions.value() ?? []" [characters]="characters.value() ?? []" [showSite]="false" (changed)="choose($event)" />
      <div class="loading-slot">
        @if (comparison.isLoading()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading the site comparison" />
        }
      </div>
      @if (!choice().accessionId || !choice().characterId) {
        <div class="hl-empty">
          <mat-icon aria-hidden="true">touch_app</mat-icon>
          <p>Pick an accession and a colour character to compare its colour across sites.</p>
        </div>
      } @else if (comparison.error()) {
        <div class="hl-notice hl-notice-error" role="alert">
          <mat-icon aria-hidden="true">cloud_off</mat-icon>
          <p>The site comparison could not be loaded. <button mat-button type="button" (click)="comparison.reload()">Try again</button></p>
        </div>
      } @else if (a) {
        @if (a.sites.length === 0) {
          <div class="hl-empty">
            <mat-icon aria-hidden="true">palette</mat-icon>
            <p>No readings of this accession and character yet.@if (mayRecord()) { <a mat-button routerLink="/record">Record one</a>}</p>
          </div>
        } @else {
          <p class="summary" role="status">
            <mat-icon aria-hidden="true">{{ marked() ? 'warning' : 'insights' }}</mat-icon>
            @if (a.sites.length === 1) {
              <span>Readings from one site only ({{ a.sites[0].siteCode }}): nothing to compare it with.</span>
            } @else {
              <span>{{ marked() }} of {{ pairs() }} site {{ pairs() === 1 ? 'pair differs' : 'pairs differ' }} by ΔE00 {{ a.threshold }} or more.</span>
            }
          </p>
          @if (season(); as s) {
            <p class="hl-muted">Within {{ a.seasonLabel ?? s.season + ' ' + s.seasonYear }} only, so a season change cannot pass for a site difference. <a [routerLink]="[]" [queryParams]="{ season: null, seasonYear: null }" queryParamsHandling="merge">Show every season together</a></p>
          } @else {
            <p class="hl-muted">Every season together: a site read mostly in one season may differ by season rather than by site. The <a routerLink="/drift">Drift overview</a> compares sites within one season.</p>
          }
          <h2>Site means</h2>
          <hl-mean-swatches [swatches]="swatches()" [caption]="season() ? 'Mean colour at each site in ' + (a.seasonLabel ?? season()!.season + ' ' + season()!.seasonYear) : 'Mean colour at each site, all seasons together'" />
          @if (a.sites.length > 1) {
            <h2>Site by site</h2>
            <hl-site-matrix-table [answer]="a" />
          }
        }
      }
    </section>
  `,
  styles: `
    .loading-slot {
      height: 4px;
      margin: 8px 0;
    }
    .summary {
      display: flex;
      align-items: center;
      gap: 8px;
      font: var(--mat-sys-title-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SitesPage {
  private readonly api = inject(AnalysisApi);
  private readonly collection = inject(CollectionApi);
  private readonly router = inject(Router);
  private readonly me = inject(AuthStore).currentUser;
  /** Whether the signed-in role may take readings: reviewers are not offered a Record link the guard would refuse. */
  protected readonly mayRecord = computed(() => mayOpen(this.me()?.role, '/record'));

  // The choice and the season group live in the address's query parameters (component input binding).
  readonly accessionId = input<string>();
  readonly characterId = input<string>();
  readonly seasonParam = input<string>(undefined, { alias: 'season' });
  readonly seasonYear = input<string>();
  protected readonly choice = computed(() => ({ ...choiceFromParams({ accessionId: this.accessionId(), characterId: this.characterId() }), siteId: null }));
  protected readonly carried = computed(() => ({ accessionId: this.choice().accessionId, characterId: this.choice().characterId }));

  protected readonly accessions = rxResource({ stream: () => this.collection.accessions() });
  protected readonly characters = rxResource({ stream: () => this.collection.characters() });
  /** One season group from the URL (the overview's site differences open with it), else every season together. */
  protected readonly season = computed(() => {
    const season = this.seasonParam();
    const year = Number(this.seasonYear());
    return season && Number.isInteger(year) ? { season, seasonYear: year } : null;
  });
  protected readonly comparison = rxResource({
    params: () => {
      const subject = subjectOf(this.choice());
      return subject ? { subject, season: this.season() } : undefined;
    },
    stream: ({ params }) => this.api.sites({ accessionId: params.subject.accessionId, characterId: params.subject.characterId }, params.season),
  });

  protected readonly answer = computed(() => (this.comparison.hasValue() ? this.comparison.value() : null));
  protected readonly swatches = computed<MeanSwatch[]>(() => (this.answer()?.sites ?? []).map((s) => ({ label: s.siteCode, hex: s.meanHex, lab: s.meanLab, n: s.n, spreadDeltaE00: s.spreadDeltaE00 })));
  protected readonly pairs = computed(() => {
    const n = this.answer()?.sites.length ?? 0;
    return (n * (n - 1)) / 2;
  });
  protected readonly marked = computed(() => {
    const a = this.answer();
    return a ? markedPairs(a) : 0;
  });

  protected choose(change: Partial<DriftChoice>): void {
    void this.router.navigate([], { queryParams: { ...paramsFromChoice({ ...this.choice(), ...change, siteId: null }), season: null, seasonYear: null } });
  }
}
