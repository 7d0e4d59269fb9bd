import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';

import { CollectionApi } from '../../../shared/collection/collection-api';
import { AbPlane } from '../components/ab-plane';
import { ComparisonList } from '../components/comparison-list';
import { DriftOverviewList } from '../components/drift-overview-list';
import { DriftPicker } from '../components/drift-picker';
import { DriftTabs } from '../components/drift-tabs';
import { GroupsTable } from '../components/groups-table';
import { MeanSwatches, type MeanSwatch } from '../components/mean-swatches';
import { TimeCharts } from '../components/time-charts';
import { AnalysisApi } from '../data/analysis-api';
import { groupSeries } from '../data/drift-series';
import { choiceFromParams, paramsFromChoice, subjectOf, type DriftChoice } from '../data/drift-subject';
import { emptyReason, groupLabel, summaryWords, tooSmall } from '../data/drift-words';
import { AuthStore } from '../../../core/auth/auth-store';
import { mayOpen } from '../../../core/layout/nav-items';

/**
 * Drift by season: pick an accession and character (and optionally a site), kept in the URL; then
 * the season means as swatches, the groups table, the comparisons with their verdict in words, and
 * the a*b* plane and L*, C*, h° charts, each with a table of the same numbers.
 */
@Component({
  selector: 'hl-drift-page',
  imports: [AbPlane, ComparisonList, DriftOverviewList, DriftPicker, DriftTabs, GroupsTable, MatButtonModule, MatIconModule, MatProgressBarModule, MeanSwatches, RouterLink, TimeCharts],
  templateUrl: './drift-page.html',
  styleUrl: './drift-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DriftPage {
  private readonly api = inject(AnalysisApi);
  private readonly collection = inject(CollectionApi);
  private readonly router = inject(Router);
  private readonly me = inject(AuthStore).currentUser;
  /** Whether the signed-in role may take readings: reviewers are not offered a Record link the guard would refuse. */
  protected readonly mayRecord = computed(() => mayOpen(this.me()?.role, '/record'));

  // The choice lives in the address's query parameters (component input binding).
  readonly accessionId = input<string>();
  readonly characterId = input<string>();
  readonly siteId = input<string>();
  protected readonly choice = computed(() => choiceFromParams({ accessionId: this.accessionId(), characterId: this.characterId(), siteId: this.siteId() }));
  protected readonly carried = computed(() => ({ accessionId: this.choice().accessionId, characterId: this.choice().characterId }));

  protected readonly accessions = rxResource({ stream: () => this.collection.accessions() });
  protected readonly characters = rxResource({ stream: () => this.collection.characters() });
  protected readonly sites = rxResource({ stream: () => this.collection.sites() });
  protected readonly drift = rxResource({ params: () => subjectOf(this.choice()) ?? undefined, stream: ({ params }) => this.api.drift(params) });

  protected readonly answer = computed(() => (this.drift.hasValue() ? this.drift.value() : null));
  protected readonly empty = computed(() => {
    const a = this.answer();
    return a ? emptyReason(a) : null;
  });
  protected readonly summary = computed(() => {
    const a = this.answer();
    return a ? summaryWords(a) : '';
  });
  protected readonly series = computed(() => {
    const a = this.answer();
    return a ? groupSeries(a) : [];
  });
  protected readonly swatches = computed<MeanSwatch[]>(() => {
    const a = this.answer();
    if (!a) return [];
    return a.groups.map((g) => ({ label: groupLabel(g), hex: g.meanHex, lab: g.meanLab, n: g.n, spreadDeltaE00: g.spreadDeltaE00, small: tooSmall(g, a.minGroupSize) }));
  });
  protected readonly subjectWords = computed(() => {
    const c = this.choice();
    const accession = this.accessions.value()?.find((a) => a.id === c.accessionId);
    const character = this.characters.value()?.find((ch) => ch.id === c.characterId);
    const site = this.sites.value()?.find((s) => s.id === c.siteId);
    if (!accession || !character) return null;
    return `${accession.accessionNumber} ${accession.name} · ${character.label} · ${site ? site.code : 'every site'}`;
  });

  protected choose(change: Partial<DriftChoice>): void {
    void this.router.navigate([], { queryParams: paramsFromChoice({ ...this.choice(), ...change }) });
  }
}
