import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';

import type { Site } from '../../../../../shared/api/collection.js';
import { Viewport } from '../../../core/layout/viewport';
import { seasonLabel } from '../data/collection-format';

/** Sites with their time zone and season scheme: cards on a phone, a table on a desk. */
@Component({
  selector: 'hl-site-list',
  imports: [MatIconModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './site-list.html',
  styleUrl: './collection-lists.scss',
})
export class SiteList {
  /** The sites to show. */
  readonly sites = input.required<readonly Site[]>();

  protected readonly handset = inject(Viewport).handset;
  protected readonly columns = ['code', 'name', 'timezone', 'seasons'];
  protected readonly seasonLabel = seasonLabel;
}
