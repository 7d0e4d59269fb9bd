import { ChangeDetectionStrategy, Component } from '@angular/core';

import { SectionTabs, type SectionTab } from '../../../shared/section-tabs';

/** The pages of the reference-set section as tabs. */
@Component({
  selector: 'hl-reference-set-tabs',
  imports: [SectionTabs],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<hl-section-tabs label="Reference set" [tabs]="tabs" />`,
})
export class ReferenceSetTabs {
  protected readonly tabs: readonly SectionTab[] = [
    { path: '/reference-set/match', label: 'Match a colour', icon: 'colorize' },
    { path: '/reference-set/browse', label: 'Browse chips', icon: 'grid_view' },
    { path: '/reference-set/prints', label: 'Printed cards', icon: 'print' },
  ];
}
