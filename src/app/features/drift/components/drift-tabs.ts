import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { IsActiveMatchOptions, Params } from '@angular/router';

import { SectionTabs, type SectionTab } from '../../../shared/section-tabs';

/** A tab is current on its own path, whatever accession and character the query names. */
const SAME_PATH: IsActiveMatchOptions = { paths: 'exact', queryParams: 'ignored', matrixParams: 'ignored', fragment: 'ignored' };

/** The Drift section's two pages as tabs; the accession and character carry over between them. */
@Component({
  selector: 'hl-drift-tabs',
  imports: [SectionTabs],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<hl-section-tabs label="Drift" [tabs]="tabs" [carried]="carried()" />`,
})
export class DriftTabs {
  /** The query to carry over (accession and character). */
  readonly carried = input<Params>({});

  protected readonly tabs: readonly SectionTab[] = [
    { path: '/drift', label: 'By season', icon: 'event_repeat', activeWhen: SAME_PATH },
    { path: '/drift/sites', label: 'By site', icon: 'location_on', activeWhen: SAME_PATH },
  ];
}
