import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive } from '@angular/router';

import type { Params } from '@angular/router';

/** The Drift section's two pages as tabs; the accession and character carry over between them. */
@Component({
  selector: 'hl-drift-tabs',
  imports: [MatIconModule, MatTabsModule, RouterLink, RouterLinkActive],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <nav mat-tab-nav-bar [tabPanel]="panel" mat-stretch-tabs="false" aria-label="Drift">
      @for (tab of tabs; track tab.path) {
        <a mat-tab-link [routerLink]="tab.path" [queryParams]="carried()" routerLinkActive #active="routerLinkActive" [routerLinkActiveOptions]="{ paths: 'exact', queryParams: 'ignored', matrixParams: 'ignored', fragment: 'ignored' }" [active]="active.isActive">
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
export class DriftTabs {
  /** The query to carry over (accession and character). */
  readonly carried = input<Params>({});

  protected readonly tabs = [
    { path: '/drift', label: 'By season', icon: 'event_repeat' },
    { path: '/drift/sites', label: 'By site', icon: 'location_on' },
  ];
}
