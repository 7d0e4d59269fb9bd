import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { RouterLink } from '@angular/router';

import type { CharacterProfile, ProfilePhoto } from '../../../../../shared/api/profile-answers.js';
import { UnitPreference } from '../../../core/units/unit-preference';
import { chromaHueText, deltaEText, labText } from '../../../shared/chips/chip-words';
import { CHARACTERISATION_XLSX_URL, ProfileApi, profilePdfUrl } from '../data/profile-api';
import { chipText, countsText, cropStyle, descriptorText, setChipText, stabilityText } from '../data/profile-words';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** How many outliers a character lists before "and n more" (the rest are on the Readings page). */
const OUTLIERS_SHOWN = 5;
/** Side of the photo crop, in CSS pixels. */
const CROP_SIZE = 96;

/**
 * The accession page's characterisation section: for each colour character its accepted colour on
 * the neutral surround with the chip code under it, how firmly it stands, season and site centres,
 * flags that open the Drift detail, outliers to look at, and the descriptor summaries.
 */
@Component({
  selector: 'hl-characterisation',
  imports: [LocalDateTimePipe, MatButtonModule, MatIconModule, MatProgressSpinnerModule, RouterLink],
  templateUrl: './characterisation.html',
  styleUrl: './characterisation.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Characterisation {
  private readonly api = inject(ProfileApi);

  /** The accession whose record is shown. */
  readonly accessionId = input.required<number>();

  protected readonly units = inject(UnitPreference).system;
  protected readonly profile = rxResource({ params: () => this.accessionId(), stream: ({ params }) => this.api.profile(params) });
  protected readonly xlsxUrl = CHARACTERISATION_XLSX_URL;
  protected readonly outliersShown = OUTLIERS_SHOWN;
  protected readonly cropSize = CROP_SIZE;
  protected readonly de = deltaEText;
  protected readonly labText = labText;
  protected readonly chromaHueText = chromaHueText;
  protected readonly chipText = chipText;
  protected readonly setChipText = setChipText;
  protected readonly countsText = countsText;
  protected readonly stabilityText = stabilityText;
  protected readonly descriptorText = descriptorText;

  protected pdfUrl(): string {
    return profilePdfUrl(this.accessionId());
  }

  protected driftLink(c: CharacterProfile): Record<string, number> {
    return { accessionId: this.accessionId(), characterId: c.characterId };
  }

  protected crop(photo: ProfilePhoto): { backgroundSize: string; backgroundPosition: string } {
    return cropStyle(photo, CROP_SIZE);
  }
}
