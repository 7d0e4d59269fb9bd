import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';

import type { Accession, Character } from '../../../../../shared/api/collection-answers.js';
import type { PendingReading, QueuedReadingBody, ReadingSummary } from '../../../core/offline/queue-item';
import { STATE_WORDS, fieldWords, lastTryWords, savedAt } from '../data/queue-words';

/** A change the recorder made to a refused reading, to send again. */
export interface ReadingChange {
  changes: Partial<QueuedReadingBody>;
  summary: Partial<ReadingSummary>;
}

/**
 * One reading in the queue as a card: what it is (accession, character, method), its colour on
 * the grey surround (marked provisional when it came from the phone's preview of a photo), when it
 * was saved, and where it stands; a refused one shows the server's words and can be changed.
 */
@Component({
  selector: 'hl-queued-reading',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule],
  templateUrl: './queued-reading.html',
  styleUrl: './queued-reading.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QueuedReading {
  readonly item = input.required<PendingReading>();
  /** The signed-in person's id: another person's readings wait for them. */
  readonly userId = input<number | null>(null);
  readonly accessions = input<readonly Accession[]>([]);
  readonly characters = input<readonly Character[]>([]);
  readonly discard = output<void>();
  readonly resend = output<ReadingChange>();

  protected readonly fieldName = fieldWords;
  protected readonly editing = signal(false);
  protected readonly accessionId = signal<number | null>(null);
  protected readonly characterId = signal<number | null>(null);

  protected readonly state = computed(() => STATE_WORDS[this.item().state]);
  protected readonly saved = computed(() => savedAt(this.item().createdAt));
  protected readonly lastTry = computed(() => lastTryWords(this.item()));
  protected readonly someoneElse = computed(() => this.userId() !== null && this.item().ownerId !== this.userId());
  protected readonly activeCharacters = computed(() => this.characters().filter((c) => c.active && c.colour));
  /** The code under the swatch; "nearest" (matched on the phone) on a line of its own. */
  protected readonly code = computed(() => {
    const code = this.item().summary.code;
    const m = code ? /^(nearest) (.+)$/.exec(code) : null;
    return m ? { note: m[1]!, code: m[2]! } : { note: null, code };
  });
  protected readonly labText = computed(() => {
    const lab = this.item().summary.lab;
    return lab ? `L* ${lab[0].toFixed(1)}  a* ${lab[1].toFixed(1)}  b* ${lab[2].toFixed(1)}` : null;
  });

  protected startEditing(): void {
    this.accessionId.set(this.item().body.accessionId);
    this.characterId.set(this.item().body.characterId);
    this.editing.set(true);
  }

  /** Sends again with the accession and character chosen (the usual reasons for a refusal). */
  protected sendChanged(): void {
    const accession = this.accessions().find((a) => a.id === this.accessionId());
    const character = this.characters().find((c) => c.id === this.characterId());
    const changes: Partial<QueuedReadingBody> = {};
    const summary: Partial<ReadingSummary> = {};
    if (accession) {
      changes.accessionId = accession.id;
      // The site follows the accession, as on the form; a plant of the old accession no longer fits.
      changes.siteId = accession.siteId;
      if (accession.id !== this.item().body.accessionId) changes.plantId = null;
      summary.accession = `${accession.accessionNumber} ${accession.name}`;
    }
    if (character) {
      changes.characterId = character.id;
      summary.character = character.label;
    }
    this.editing.set(false);
    this.resend.emit({ changes, summary });
  }
}
