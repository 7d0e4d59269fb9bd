import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive } from '@angular/router';

/** The two pages of the reference-set section as tabs. */
@Component({
  selector: 'hl-section-tabs',
  imports: [MatIconModule, MatTabsModule, RouterLink, RouterLinkActive],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <nav mat-tab-nav-bar [tabPanel]="panel" mat-stretch-tabs="false" aria-label="Reference set">
      @for (tab of tabs; track tab.path) {
        <a mat-tab-link [routerLink]="tab.path" routerLinkActive #active="routerLinkActive" [active]="active.isActive">
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
export class SectionTabs {
  protected readonly tabs = [
    { path: '/reference-set/match', label: 'Match a colour', icon: 'colorize' },
    { path: '/reference-set/browse', label: 'Browse chips', icon: 'grid_view' },
  ];
}
