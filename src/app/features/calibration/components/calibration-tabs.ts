import { ChangeDetectionStrategy, Component } from '@angular/core';

import { SectionTabs, type SectionTab } from '../../../shared/section-tabs';

/** The pages of the Calibration section as tabs. */
@Component({
  selector: 'hl-calibration-tabs',
  imports: [SectionTabs],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<hl-section-tabs label="Calibration" [tabs]="tabs" />`,
})
export class CalibrationTabs {
  protected readonly tabs: readonly SectionTab[] = [
    { path: '/calibration', label: 'Sessions', icon: 'groups', activeWhen: { exact: true } },
    { path: '/calibration/records', label: 'Certificates', icon: 'workspace_premium' },
    { path: '/calibration/practice', label: 'Practice', icon: 'school' },
    { path: '/calibration/vision', label: 'Vision preview', icon: 'visibility' },
  ];
}
