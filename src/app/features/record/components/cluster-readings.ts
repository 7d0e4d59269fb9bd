import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { rxResource, takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { startWith } from 'rxjs';

import type { PhotoSample } from '../../../../../shared/api/photo-answers.js';
import { LIGHTS, type Light, type ReadingDetail } from '../../../../../shared/api/reading-answers.js';
import type { Region } from '../../../../../shared/photo/region.js';
import { ApiError } from '../../../core/http/api-error';
import { IS_ONLINE } from '../../../core/offline/offline-queue';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { ReadingsApi, newIdempotencyKey } from '../../../shared/readings/readings-api';
import { LIGHT_WORDS } from '../../../shared/readings/reading-words';
import { batchRefusal, clusterBatch, repeatedCharacter, type BatchRefusal } from '../data/cluster-readings';
import { ReadingDraftStore, ReadingMemory } from '../data/reading-memory';
import { AccessionPicker } from './accession-picker';
import { characterGroups } from './character-picker';
import { ProblemNotice } from '../../../shared/problem-notice';

/** What the reading form keeps while the recorder is on the photo page (the fields used here). */
interface DraftFields {
  accessionId: number | null;
  plantId: number | null;
  characterId: number | null;
  light: Light | null;
}

/**
 * On the photo page, under a region that split into colours: give each colour (ground, stripe…)
 * its character and save them as readings of the same plant in one step, all or nothing. The
 * plant, character and light the reading form held are filled in.
 */
@Component({
  selector: 'hl-cluster-readings',
  imports: [ProblemNotice, AccessionPicker, MatButtonModule, MatFormFieldModule, MatIconModule, MatProgressSpinnerModule, MatSelectModule, ReactiveFormsModule, RouterLink],
  templateUrl: './cluster-readings.html',
  styleUrl: './cluster-readings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClusterReadings {
  private readonly collection = inject(CollectionApi);
  private readonly readings = inject(ReadingsApi);
  private readonly drafts = inject(ReadingDraftStore);
  private readonly memory = inject(ReadingMemory);
  private readonly destroyRef = inject(DestroyRef);
  private readonly isOnline = inject(IS_ONLINE);

  readonly sample = input.required<PhotoSample>();
  readonly photoId = input.required<number>();
  readonly region = input.required<Region>();
  readonly card = input<Region | null>(null);

  protected readonly accessions = rxResource({ stream: () => this.collection.accessions() });
  protected readonly characters = rxResource({ stream: () => this.collection.characters() });
  protected readonly groups = computed(() => characterGroups(this.characters.value() ?? []));
  protected readonly lights = LIGHTS;
  protected readonly lightWords = LIGHT_WORDS;

  protected readonly accessionId = new FormControl<number | null>(null);
  protected readonly plantId = new FormControl<number | null>(null);
  protected readonly light = signal<Light | null>(null);
  /** A character per colour, largest share first; null leaves the colour unsaved. */
  protected readonly characterIds = signal<(number | null)[]>([]);

  private readonly accessionValue = toSignal(this.accessionId.valueChanges.pipe(startWith(this.accessionId.value)), { initialValue: null });
  protected readonly plants = computed(() => this.accessions.value()?.find((a) => a.id === this.accessionValue())?.plants ?? []);
  protected readonly chosenCount = computed(() => this.characterIds().filter((id) => id !== null).length);
  protected readonly saving = signal(false);
  protected readonly refusal = signal<BatchRefusal | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly saved = signal<ReadingDetail[] | null>(null);
  private saveKey: string | null = null;

  constructor() {
    const draft = this.drafts.read<DraftFields>();
    const remembered = this.memory.recall();
    this.accessionId.setValue(draft?.accessionId ?? remembered.accessionId ?? null);
    this.plantId.setValue(draft?.plantId ?? null);
    this.light.set((draft?.light ?? (remembered.light as Light | null | undefined)) || null);
    const ground = draft?.characterId ?? remembered.characterId ?? null;
    // A new region (or a new split) starts again: the ground colour takes the form's character.
    effect(() => {
      const n = this.sample().clusters.length;
      untracked(() => {
        this.characterIds.set(Array.from({ length: n }, (_, i) => (i === 0 ? ground : null)));
        this.saved.set(null);
        this.refusal.set(null);
        this.problem.set(null);
        this.saveKey = null;
      });
    });
    this.accessionId.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.plantId.setValue(null));
  }

  protected chooseCharacter(cluster: number, characterId: number | null): void {
    this.characterIds.update((ids) => ids.map((id, i) => (i === cluster ? characterId : id)));
    this.saveKey = null;
  }

  protected chooseLight(light: Light): void {
    this.light.set(light);
    this.saveKey = null;
  }

  protected clusterProblems(cluster: number): string[] {
    const repeated = repeatedCharacter(this.characterIds());
    const local = repeated === cluster ? ['Character: already given to an earlier colour; each colour is a reading of its own character.'] : [];
    return [...local, ...(this.refusal()?.byCluster.get(cluster) ?? [])];
  }

  protected save(): void {
    this.problem.set(null);
    this.refusal.set(null);
    const accessionId = this.accessionId.value;
    const light = this.light();
    const missing = [accessionId === null ? 'the accession' : '', light === null ? 'the light' : '', this.chosenCount() === 0 ? 'a character for at least one colour' : ''].filter(Boolean);
    if (missing.length) return this.problem.set(`Choose ${missing.join(', ')} (required).`);
    if (repeatedCharacter(this.characterIds()) >= 0) return this.problem.set('Two colours have the same character: give each its own, or leave one unsaved.');
    // The colours are split on the server from the stored photo, so they are saved there at once, never queued.
    if (!this.isOnline()) return this.problem.set('No connection: saving the colours separately needs the server. Try again in range, or save the whole region with Save as reading.');
    const { body, clusterOf } = clusterBatch({ accessionId: accessionId!, plantId: this.plantId.value, light: light!, characterIds: this.characterIds() }, { photoId: this.photoId(), region: this.region(), card: this.card() });
    this.saveKey ??= newIdempotencyKey();
    this.saving.set(true);
    this.readings
      .createBatch(body, this.saveKey)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: ({ readings }) => {
          this.saving.set(false);
          this.saveKey = null;
          this.saved.set(readings);
          this.drafts.drop();
          this.memory.remember({ accessionId: accessionId!, characterId: readings[0]!.characterId, light: light! });
        },
        error: (error: unknown) => {
          this.saving.set(false);
          if (error instanceof ApiError) {
            const refusal = batchRefusal(error.fieldErrors, clusterOf);
            this.refusal.set(refusal);
            this.problem.set([error.detail ?? error.title, ...refusal.other].join(' '));
          } else this.problem.set('Something went wrong. Try again.');
        },
      });
  }
}
