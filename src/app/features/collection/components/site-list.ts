import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';

import type { Site } from '../../../../../shared/api/collection-answers.js';
import { Viewport } from '../../../core/layout/viewport';
import { seasonLabel } from '../data/collection-format';

/** Sites with their time zone and season scheme, each linking to its page: cards on a phone, a table on a desk. */
@Component({
  selector: 'hl-site-list',
  imports: [MatButtonModule, MatIconModule, MatTableModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './site-list.html',
  styleUrl: './collection-lists.scss',
})
export class SiteList {
  /** The sites to show. */
  readonly sites = input.required<readonly Site[]>();
  /** Whether the person may edit sites (the link then says so). */
  readonly canEdit = input(false);

  protected readonly handset = inject(Viewport).handset;
  protected readonly columns = ['code', 'name', 'timezone', 'seasons'];
  protected readonly seasonLabel = seasonLabel;
}
