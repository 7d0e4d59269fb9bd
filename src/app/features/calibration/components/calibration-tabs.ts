import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive } from '@angular/router';

/** The pages of the Calibration section as tabs. */
@Component({
  selector: 'hl-calibration-tabs',
  imports: [MatIconModule, MatTabsModule, RouterLink, RouterLinkActive],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <nav mat-tab-nav-bar [tabPanel]="panel" mat-stretch-tabs="false" aria-label="Calibration">
      @for (tab of tabs; track tab.path) {
        <a mat-tab-link [routerLink]="tab.path" routerLinkActive #active="routerLinkActive" [routerLinkActiveOptions]="{ exact: tab.exact }" [active]="active.isActive">
          <mat-icon aria-hidden="true">{{ tab.icon }}</mat-icon>
          <span class="label">{{ tab.label }}</span>
        </a>
      }
    </nav>
    <mat-tab-nav-panel #panel />
  `,
  styles: `
    nav {
      margin-bottom: 16px;
    }
    .label {
      margin-left: 8px;
    }
  `,
})
export class CalibrationTabs {
  protected readonly tabs = [
    { path: '/calibration', label: 'Sessions', icon: 'groups', exact: true },
    { path: '/calibration/records', label: 'Certificates', icon: 'workspace_premium', exact: false },
    { path: '/calibration/practice', label: 'Practice', icon: 'school', exact: false },
    { path: '/calibration/vision', label: 'Vision preview', icon: 'visibility', exact: false },
  ];
}
