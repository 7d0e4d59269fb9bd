import { ChangeDetectionStrategy, Component, computed, inject, input, numberAttribute } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { RouterLink } from '@angular/router';

import { AuthStore } from '../../../core/auth/auth-store';
import { EarlierReadings } from '../../../shared/readings/earlier-readings';
import { cutWarning, limitWords } from '../../../shared/readings/cut-clock';
import { PhotoCrop } from '../../../shared/photos/photo-crop';
import { ReadingMatch } from '../../../shared/readings/reading-match';
import { CUT_SECONDS_WARN, type ReadingDetail } from '../../../../../shared/api/reading-answers.js';
import { METHOD_WORDS, STATUS_WORDS, wordsFor } from '../../../shared/readings/reading-words';
import { ReadingsApi } from '../../../shared/readings/readings-api';
import { ageWords, correctionText } from '../data/provenance-words';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';
import { LightFacts } from '../../../shared/readings/light-facts';

/** Roles that may correct anybody's reading; others only their own (issue 5, item 2). */
const CORRECTS_ANY = 'admin';

/**
 * One reading's provenance: the photo crop with the region, the colour and its nearest chips with
 * the position between the two nearest, correction, pixel statistics, conditions, season and plant
 * age, the supersede chain and the audit history; and "Correct this reading" for its owner or an admin.
 */
@Component({
  selector: 'hl-reading-detail',
  imports: [LightFacts, EarlierReadings, LocalDateTimePipe, MatButtonModule, MatIconModule, MatProgressSpinnerModule, PhotoCrop, ReadingMatch, RouterLink],
  templateUrl: './reading-detail.html',
  styleUrl: './reading-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReadingDetailPage {
  private readonly api = inject(ReadingsApi);
  private readonly auth = inject(AuthStore);

  /** The reading's id (route parameter, bound by the router). */
  readonly id = input.required({ transform: numberAttribute });

  protected readonly reading = rxResource({ params: () => this.id(), stream: ({ params }) => this.api.get(params) });
  protected readonly methodWords = METHOD_WORDS;
  protected readonly statusWords = STATUS_WORDS;
  protected readonly wordsFor = wordsFor;
  protected readonly ageWords = ageWords;

  /** Whether the signed-in person may correct it: its observer or an admin, and only the newest version. */
  protected readonly canCorrect = computed(() => {
    const r = this.reading.value();
    const me = this.auth.currentUser();
    if (!r || !me || r.supersededById !== null) return false;
    return me.role === CORRECTS_ANY || me.id === r.observerId;
  });
  protected readonly correction = computed(() => {
    const r = this.reading.value();
    return r ? correctionText(r.provenance.correction) : null;
  });
  protected readonly cutNote = computed(() => {
    const r = this.reading.value();
    return r ? cutWarning(r.secondsSinceCut, CUT_SECONDS_WARN) && `More than ${limitWords(CUT_SECONDS_WARN)} after the cut: the surface may have browned.` : null;
  });

  protected photoOf(r: ReadingDetail) {
    const p = r.provenance;
    return p.photoId !== null && p.region && p.photoWidth && p.photoHeight ? { id: p.photoId, region: p.region, card: p.neutralRegion, size: { width: p.photoWidth, height: p.photoHeight } } : null;
  }
}
