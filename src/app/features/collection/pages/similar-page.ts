import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { RouterLink } from '@angular/router';

import type { SharedCharacterDistance } from '../../../../../shared/api/profile-answers.js';
import { deltaEText, formatNumber } from '../../../shared/chips/chip-words';
import { ProfileApi } from '../data/profile-api';

/** How many look-alikes the page lists (our own). */
const SHOWN = 10;

/**
 * Look-alike accessions: the others ranked by how far their characterisation lies from this one,
 * each with the characters that tell them apart; and the collection's possible duplicates.
 */
@Component({
  selector: 'hl-similar-page',
  imports: [MatButtonModule, MatIconModule, MatProgressSpinnerModule, RouterLink],
  templateUrl: './similar-page.html',
  styleUrl: './similar-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SimilarPage {
  private readonly api = inject(ProfileApi);

  /** The accession's id from the route. */
  readonly id = input.required<string>();

  protected readonly similar = rxResource({ params: () => Number(this.id()), stream: ({ params }) => this.api.similar(params, SHOWN) });
  protected readonly duplicates = rxResource({ stream: () => this.api.duplicates() });

  protected distanceText(c: SharedCharacterDistance): string {
    return c.kind === 'colour' ? `ΔE00 ${deltaEText(c.distance)} (threshold ${formatNumber(c.threshold, 1)})` : `Gower ${formatNumber(c.distance, 2)} (same at ≤ ${formatNumber(c.threshold, 1)})`;
  }

  protected score(x: number): string {
    return formatNumber(x, 2);
  }
}
