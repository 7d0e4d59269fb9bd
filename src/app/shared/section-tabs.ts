import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, type IsActiveMatchOptions, type Params } from '@angular/router';

/** One page of a section, shown as a tab. */
export interface SectionTab {
  path: string;
  label: string;
  /** Material Symbols ligature. */
  icon: string;
  /** When the tab counts as the current page; a prefix of the address by default. */
  activeWhen?: { exact: boolean } | IsActiveMatchOptions;
}

/** A section's pages as a row of tabs that are links, so each page keeps its own address. */
@Component({
  selector: 'hl-section-tabs',
  imports: [MatIconModule, MatTabsModule, RouterLink, RouterLinkActive],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <nav mat-tab-nav-bar [tabPanel]="panel" mat-stretch-tabs="false" [attr.aria-label]="label()">
      @for (tab of tabs(); track tab.path) {
        <a mat-tab-link [routerLink]="tab.path" [queryParams]="carried()" routerLinkActive #active="routerLinkActive" [routerLinkActiveOptions]="tab.activeWhen ?? prefix" [active]="active.isActive">
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
  /** The section's name, for screen readers. */
  readonly label = input.required<string>();
  readonly tabs = input.required<readonly SectionTab[]>();
  /** Query parameters carried from page to page (e.g. the accession and character being looked at). */
  readonly carried = input<Params | null>(null);

  protected readonly prefix = { exact: false };
}
