import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, ErrorHandler, type OnInit, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { rxResource, takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { startWith } from 'rxjs';

import type { Accession, Plant } from '../../../../../shared/api/collection-answers.js';
import { ApiError } from '../../../core/http/api-error';
import { IS_ONLINE } from '../../../core/offline/offline-queue';
import type { QueuedReadingBody } from '../../../core/offline/queue-item';
import { ChipCatalogue } from '../../../shared/chips/chip-catalogue';
import { applyFieldErrors } from '../../../core/http/field-errors';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { ProgressSummary } from '../../../shared/collection/progress-summary';
import { CUT_SECONDS_WARN, INSTRUMENT_ILLUMINANTS, LIGHTS, READING_METHODS, type InstrumentIlluminant, type ReadingDetail, type ReadingMethod } from '../../../../../shared/api/reading-answers.js';
import { labD50ToD65 } from '../../../../../shared/colour/chromatic-adaptation.js';
import { ReadingMatch } from '../../../shared/readings/reading-match';
import { ReadingsApi } from '../../../shared/readings/readings-api';
import { ReadingSaveFlow } from '../data/reading-save-flow';
import { LIGHT_WORDS, METHOD_WORDS } from '../../../shared/readings/reading-words';
import { AccessionPicker } from '../components/accession-picker';
import { CharacterPicker } from '../components/character-picker';
import { ChipPicker } from '../components/chip-picker';
import { CutTimer } from '../components/cut-timer';
import { InstrumentPanel } from '../components/instrument-panel';
import { LabelScanner } from '../components/label-scanner';
import { MatchPreview } from '../components/match-preview';
import { parseHex } from '../../../../../shared/colour/parse.js';
import type { Lab, LabTuple } from '../../../../../shared/colour/lab.js';
import { provisionalChip } from '../data/provisional-chip';
import { PhotoSummary } from '../components/photo-summary';
import { SwatchPicker } from '../components/swatch-picker';
import { photoSourceFromParams, photoSourceParams } from '../data/photo-source';
import { ReadingDraftStore, ReadingMemory } from '../data/reading-memory';
import {
  SERVER_FIELD_ALIASES,
  applyMethodRules,
  buildReadingForm,
  isCutCharacter,
  nextCharacterValue,
  nextPlantValue,
  photoProblem,
  readingRequest,
  type PhotoSource,
  type ReadingFormValue,
} from '../data/reading-draft';
import { prefillFrom } from '../data/reading-prefill';
import { PlantSheetApi } from '../../../shared/collection/plant-sheet-api';
import { nextColourTodo } from '../../../shared/collection/sheet-progress';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** What the draft store keeps: the form's value and the reading it corrects, if any. */
type KeptDraft = ReadingFormValue & { correcting: number | null };

/** Where a problem shows, in page order: a marked field, a choice group left empty, the missing photo, the refusal. */
const FIRST_PROBLEM = '.hl-invalid, input.ng-invalid.ng-touched, mat-select.ng-invalid.ng-touched, textarea.ng-invalid.ng-touched, .methods.invalid, .illuminants.invalid, .lights.invalid, .photo-missing, .problems';
/** What can take the cursor inside a problem. */
const FOCUSABLE = 'input, textarea, mat-select, button, [tabindex]';

/** Quick choices for which leaf (our own words; the character's "how to read it" names the usual one). */
const LEAF_CHOICES = ['2nd open leaf', '3rd open leaf', '4th open leaf'] as const;

/**
 * Record → a reading: which accession, plant, character and site; one of four methods; the light,
 * seconds since cut and notes. Remembers the last accession, character and light; after saving it
 * shows the match and offers the next plant. With `?correct=ID` it posts a correction instead.
 */
@Component({
  selector: 'hl-reading-form',
  imports: [
    AccessionPicker,
    CharacterPicker,
    ChipPicker,
    CutTimer,
    InstrumentPanel,
    LabelScanner,
    LocalDateTimePipe,
    MatchPreview,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressSpinnerModule,
    MatSelectModule,
    PhotoSummary,
    ProgressSummary,
    ReactiveFormsModule,
    ReadingMatch,
    RouterLink,
    SwatchPicker,
  ],
  providers: [ReadingSaveFlow],
  templateUrl: './reading-form.html',
  styleUrl: './reading-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReadingForm implements OnInit {
  private readonly collection = inject(CollectionApi);
  private readonly readings = inject(ReadingsApi);
  private readonly saveFlow = inject(ReadingSaveFlow);
  private readonly memory = inject(ReadingMemory);
  private readonly drafts = inject(ReadingDraftStore);
  private readonly router = inject(Router);
  private readonly errors = inject(ErrorHandler);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly destroyRef = inject(DestroyRef);
  private readonly chips = inject(ChipCatalogue);
  private readonly sheets = inject(PlantSheetApi);
  private readonly isOnline = inject(IS_ONLINE);

  // The address's query parameters (component input binding): a reading to correct, a plant sheet
  // and character it was opened from, a photo region sent back from the photo page.
  readonly correct = input<string>();
  readonly sheet = input<string>();
  readonly characterParam = input<string>(undefined, { alias: 'character' });
  readonly photoParam = input<string>(undefined, { alias: 'photo' });
  readonly localPhoto = input<string>();
  readonly region = input<string>();
  readonly cardParam = input<string>(undefined, { alias: 'card' });

  protected readonly form = buildReadingForm();
  protected readonly methods = READING_METHODS;
  protected readonly lights = LIGHTS;
  protected readonly methodWords = METHOD_WORDS;
  protected readonly lightWords = LIGHT_WORDS;
  protected readonly leafChoices = LEAF_CHOICES;
  protected readonly cutWarnAfter = CUT_SECONDS_WARN;

  protected readonly accessions = rxResource({ stream: () => this.collection.accessions() });
  protected readonly sites = rxResource({ stream: () => this.collection.sites() });
  protected readonly characters = rxResource({ stream: () => this.collection.characters() });
  /** The plant whose sheet opened the form (`?sheet=PLANT&character=ID`): saving offers its next character. */
  protected readonly sheetPlantId = signal<number | null>(null);
  /** Whether the next character is being looked up. */
  protected readonly finding = signal(false);
  /** The reading being corrected (`?correct=ID`), if any. */
  protected readonly correctingId = signal<number | null>(null);

  protected readonly photo = signal<PhotoSource | null>(null);
  /** Whether the optional eye-picked chip is open (its chips load only then). */
  protected readonly eyeChipOpen = signal(false);
  protected readonly saving = signal(false);
  protected readonly saved = signal<ReadingDetail | null>(null);
  /** Whether the last save is waiting on this phone to be sent (no connection). */
  protected readonly queued = signal(false);
  /** Whether the phone has no connection now, so the recorder knows before saving that it will wait on the phone. */
  protected readonly offline = signal(!this.isOnline());
  /** The reading last kept on the phone, and its photo's preview colour: what the provisional chip is worked out from. */
  private readonly queuedBody = signal<QueuedReadingBody | null>(null);
  private readonly queuedPreview = signal<LabTuple | null>(null);
  /** The nearest chip of the reading kept on the phone, from the chips the phone holds; null without them. */
  protected readonly provisional = computed(() => {
    const body = this.queuedBody();
    return body ? provisionalChip(body, this.chips.set(), this.queuedPreview()) : null;
  });
  /** Refusals that name no field on the form, shown above the save button. */
  protected readonly problems = signal<string[]>([]);

  private readonly value = toSignal(this.form.valueChanges.pipe(startWith(null)), { initialValue: null });
  private readonly formValue = computed(() => (this.value(), this.form.getRawValue()));
  protected readonly method = computed(() => this.formValue().method);
  protected readonly formValueLight = computed(() => this.formValue().light);
  protected readonly accession = computed<Accession | null>(() => this.accessionById(this.formValue().accessionId));
  protected readonly plants = computed<Plant[]>(() => this.accession()?.plants ?? []);
  protected readonly character = computed(() => (this.characters.hasValue() ? (this.characters.value().find((c) => c.id === this.formValue().characterId) ?? null) : null));
  protected readonly cut = computed(() => isCutCharacter(this.character()));
  /** The colour typed or set so far (instrument, swatch), matched before saving; null while incomplete. */
  protected readonly previewLab = computed<Lab | null>(() => {
    const v = this.formValue();
    if (v.method === 'instrument') {
      const { l, a, b } = v.lab;
      if (![l, a, b].every((n) => n !== null && Number.isFinite(n))) return null;
      // Matched as the server will store it: D50/2° numbers adapted to D65/2° first.
      return v.illuminant === 'D50/2' ? labD50ToD65({ l: l!, a: a!, b: b! }) : { l: l!, a: a!, b: b! };
    }
    if (v.method === 'swatch' && v.hex) return parseHex(v.hex) ?? null;
    return null;
  });
  protected readonly eyeChip = computed(() => this.formValue().eyeChipCode);
  protected readonly photoMissing = computed(() => photoProblem(this.method(), this.photo()));

  constructor() {
    // A remembered or drafted accession is known before the list arrives: its site follows once it does.
    effect(() => {
      const accession = this.accession();
      untracked(() => {
        const c = this.form.controls;
        if (accession && c.siteId.value === null) c.siteId.setValue(this.plants().find((p) => p.id === c.plantId.value)?.siteId ?? accession.siteId);
        if (!accession && this.accessions.hasValue() && c.accessionId.value !== null) c.accessionId.setValue(null);
      });
    });
    // A plant from the sheet names no accession: it is found among the accessions once they arrive.
    effect(() => {
      const plantId = this.sheetPlantId();
      if (plantId === null || !this.accessions.hasValue()) return;
      untracked(() => this.placeSheetPlant(plantId));
    });
  }

  ngOnInit(): void {
    this.startFromAddress();
    this.followChanges();
    this.followConnection();
  }

  protected chooseMethod(method: ReadingMethod): void {
    this.form.controls.method.setValue(method);
    if (method === 'photo' && !this.photo()) this.goToPhoto();
  }

  /** Off to the photo page; the half-filled form waits in this tab's storage. */
  protected goToPhoto(): void {
    this.keepDraft();
    const photo = this.photo();
    const correct = this.correctingId();
    void this.router.navigate(['/record/photo'], { queryParams: { ...(photo ? { ...photoSourceParams(photo), method: null } : {}), correct } });
  }

  protected chooseLight(light: (typeof LIGHTS)[number]): void {
    this.form.controls.light.setValue(light);
  }

  protected chooseLeaf(leaf: string): void {
    this.form.controls.leafPosition.setValue(leaf);
  }

  protected plantFromLabel(plant: Plant): void {
    this.form.controls.plantId.setValue(plant.id);
  }

  protected save(): void {
    this.problems.set([]);
    this.form.markAllAsTouched();
    const missing = this.photoMissing();
    if (this.form.invalid || missing) {
      this.problems.set([missing ?? 'Some answers are missing or out of range: see the marked fields.']);
      queueMicrotask(() => this.scrollToFirstProblem());
      return;
    }
    const body = readingRequest(this.form.getRawValue(), this.photo(), this.cut());
    const correcting = this.correctingId();
    this.saving.set(true);
    if (correcting) {
      this.saveFlow
        .saveCorrection(correcting, body, this.form.controls.reason.value!.trim())
        .pipe(takeUntilDestroyed(this.destroyRef))
        .subscribe({ next: (reading) => this.savedAs(reading), error: (error: unknown) => this.refused(error) });
      return;
    }
    const names = { accession: this.accession(), character: this.character(), method: METHOD_WORDS[body.method].label, plant: this.plants().find((p) => p.id === body.plantId) ?? null };
    this.saveFlow.saveNew(body, this.photo(), names).then(
      (outcome) => (outcome.queued ? this.savedOnPhone(outcome.body, outcome.preview) : this.savedAs(outcome.reading)),
      (error: unknown) => this.refused(error),
    );
  }

  /** Keeps accession, character, light and site for the next plant of the row; the rest starts empty. */
  protected nextPlant(): void {
    const keep = nextPlantValue(this.form.getRawValue());
    this.form.reset();
    this.form.patchValue(keep);
    this.saved.set(null);
    this.queued.set(false);
    this.queuedBody.set(null);
    this.queuedPreview.set(null);
    this.photo.set(null);
    this.eyeChipOpen.set(false);
    this.correctingId.set(null);
    applyMethodRules(this.form, keep.method ?? null, false);
    if (keep.method === 'photo') this.form.controls.method.setValue(null);
    void this.router.navigate([], { queryParams: {}, replaceUrl: true });
    this.host.nativeElement.scrollIntoView?.({ block: 'start' });
  }

  private savedAs(reading: ReadingDetail): void {
    this.saveFlow.done();
    this.rememberChoices();
    this.drafts.drop();
    this.saving.set(false);
    this.saved.set(reading);
    this.host.nativeElement.scrollIntoView?.({ block: 'start' });
  }

  /** Kept in the queue: the form is done with it, as after a save, and says where it waits and its provisional chip. */
  private savedOnPhone(body: QueuedReadingBody, preview: LabTuple | null): void {
    this.queuedBody.set(body);
    this.queuedPreview.set(preview);
    // The chips come from this phone's cache when it has them; without them the screen says the server will match.
    this.chips.load();
    this.rememberChoices();
    this.drafts.drop();
    this.saving.set(false);
    this.queued.set(true);
    this.host.nativeElement.scrollIntoView?.({ block: 'start' });
  }

  private followConnection(): void {
    if (typeof window === 'undefined') return;
    const update = () => this.offline.set(!this.isOnline());
    window.addEventListener('online', update);
    window.addEventListener('offline', update);
    this.destroyRef.onDestroy(() => {
      window.removeEventListener('online', update);
      window.removeEventListener('offline', update);
    });
  }

  private rememberChoices(): void {
    const v = this.form.getRawValue();
    this.memory.remember({ accessionId: v.accessionId, characterId: v.characterId, light: v.light, method: v.method, instrument: v.instrument, illuminant: v.illuminant });
  }

  /** A correction, a plant sheet's next character, or a new reading (the draft or the last choices); a photo region on top. */
  private startFromAddress(): void {
    const correct = positiveId(this.correct());
    const sheetPlant = positiveId(this.sheet());
    const draft = this.drafts.read<KeptDraft>();
    if (correct) this.startCorrection(correct, draft?.correcting === correct ? draft : null);
    else if (sheetPlant) this.startFromSheet(sheetPlant, positiveId(this.characterParam()), draft);
    else this.restore(draft && !draft.correcting ? draft : null);
    const source = photoSourceFromParams({ photo: this.photoParam(), localPhoto: this.localPhoto(), region: this.region(), card: this.cardParam() });
    if (source) {
      this.photo.set(source);
      this.form.controls.method.setValue('photo');
    }
  }

  /** Opened from a plant sheet: the plant and character from the link, method, light and instrument from the last reading. */
  private startFromSheet(plantId: number, characterId: number | null, draft: Partial<KeptDraft> | null): void {
    const remembered = this.memory.recall();
    const sameRow = draft && !draft.correcting && draft.plantId === plantId && draft.characterId === characterId;
    if (sameRow) this.form.patchValue(draft);
    else {
      const method = READING_METHODS.find((m) => m === remembered.method && m !== 'photo') ?? null;
      this.form.patchValue({ characterId, light: remembered.light as ReadingFormValue['light'], method, instrument: remembered.instrument ?? null, illuminant: illuminantOf(remembered.illuminant) });
    }
    this.sheetPlantId.set(plantId);
  }

  private placeSheetPlant(plantId: number): void {
    const c = this.form.controls;
    if (c.plantId.value === plantId) return;
    const accession = this.accessions.value()!.find((a) => a.plants.some((p) => p.id === plantId));
    if (!accession) return;
    c.accessionId.setValue(accession.id);
    c.plantId.setValue(plantId);
  }

  /**
   * After a save from the sheet: the same plant, the next colour character still to do in walk
   * order, method, light and instrument kept. Out of range the sheet cannot be asked, so the next
   * character of the catalogue is taken instead.
   */
  protected nextCharacter(): void {
    const plantId = this.sheetPlantId();
    const current = this.form.controls.characterId.value;
    if (plantId === null) return;
    this.finding.set(true);
    this.sheets.sheet(plantId).subscribe({
      next: (sheet) => {
        const row = nextColourTodo(sheet, current);
        if (row) this.moveToCharacter(row.colour!.characterId);
        else void this.router.navigate(['/record/plant', plantId]);
      },
      error: () => {
        const list = this.characters.value()?.filter((c) => c.active && c.colour) ?? [];
        const at = list.findIndex((c) => c.id === current);
        const next = list[at + 1];
        if (next) this.moveToCharacter(next.id);
        else void this.router.navigate(['/record/plant', plantId]);
      },
    });
  }

  private moveToCharacter(characterId: number): void {
    const keep = nextCharacterValue(this.form.getRawValue(), characterId);
    this.finding.set(false);
    this.form.reset();
    this.form.patchValue(keep);
    this.saved.set(null);
    this.queued.set(false);
    this.queuedBody.set(null);
    this.queuedPreview.set(null);
    this.problems.set([]);
    this.eyeChipOpen.set(false);
    this.photo.set(null);
    applyMethodRules(this.form, keep.method ?? null, false);
    void this.router.navigate([], { queryParams: { sheet: this.sheetPlantId(), character: characterId }, replaceUrl: true });
    this.host.nativeElement.scrollIntoView?.({ block: 'start' });
  }

  /** A 4xx refusal is shown beside the fields it names; anything else goes to the app's error handler. */
  private refused(error: unknown): void {
    this.saving.set(false);
    if (error instanceof ApiError && error.status >= 400 && error.status < 500 && error.status !== 401) {
      const unmatched = applyFieldErrors(this.form, error, SERVER_FIELD_ALIASES);
      const summary = error.detail ? `${error.title} ${error.detail}` : error.title;
      this.problems.set(unmatched.length ? unmatched : [summary]);
      queueMicrotask(() => this.scrollToFirstProblem());
      return;
    }
    this.errors.handleError(error);
  }

  /** The half-filled form goes into this tab's storage, marked with the reading it corrects (if any). */
  private keepDraft(): void {
    this.drafts.keep({ ...this.form.getRawValue(), correcting: this.correctingId() });
  }

  private restore(draft: Partial<KeptDraft> | null): void {
    if (draft) {
      this.form.patchValue(draft);
      return;
    }
    const remembered = this.memory.recall();
    this.form.patchValue({ accessionId: remembered.accessionId, characterId: remembered.characterId, light: remembered.light as ReadingFormValue['light'], illuminant: illuminantOf(remembered.illuminant) });
  }

  /** Loads the reading being corrected into the form; edits kept for it in this tab go on top. */
  private startCorrection(id: number, draft: Partial<KeptDraft> | null): void {
    this.correctingId.set(id);
    this.readings
      .get(id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (reading) => {
          const { value, photo } = prefillFrom(reading);
          this.form.patchValue(value);
          if (draft) this.form.patchValue(draft);
          this.eyeChipOpen.set(!!this.form.controls.eyeChipCode.value);
          if (photo && !this.photo()) this.photo.set(photo);
        },
        error: (error: unknown) => this.errors.handleError(error),
      });
  }

  /** The method switches its fields' rules; a plant brings its site; the draft follows every change. */
  private followChanges(): void {
    const c = this.form.controls;
    c.method.valueChanges.pipe(startWith(c.method.value), takeUntilDestroyed(this.destroyRef)).subscribe((method) => applyMethodRules(this.form, method, this.correctingId() !== null));
    c.accessionId.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe((id) => {
      const accession = this.accessionById(id);
      if (!accession?.plants.some((p) => p.id === c.plantId.value)) c.plantId.setValue(null, { emitEvent: false });
      if (accession) c.siteId.setValue(accession.siteId);
    });
    c.plantId.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe((id) => {
      const plant = this.plants().find((p) => p.id === id);
      const accession = this.accession();
      if (plant) c.siteId.setValue(plant.siteId);
      else if (accession) c.siteId.setValue(accession.siteId);
    });
    this.form.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => {
      this.saveFlow.answersChanged();
      if (!this.saved()) this.keepDraft();
    });
  }

  private accessionById(id: number | null): Accession | null {
    if (id === null || !this.accessions.hasValue()) return null;
    return this.accessions.value().find((a) => a.id === id) ?? null;
  }

  /** Brings the first field with a problem into view and puts the cursor (or focus) in it. */
  private scrollToFirstProblem(): void {
    const el = this.host.nativeElement.querySelector<HTMLElement>(FIRST_PROBLEM);
    if (!el) return;
    el.scrollIntoView?.({ block: 'center' });
    const target = el.matches(FOCUSABLE) ? el : el.querySelector<HTMLElement>(FOCUSABLE);
    target?.focus({ preventScroll: true });
  }
}

/** A remembered illuminant/observer, if it is still one of the choices. */
function illuminantOf(value: string | null | undefined): InstrumentIlluminant | null {
  return INSTRUMENT_ILLUMINANTS.find((i) => i === value) ?? null;
}

function positiveId(value: unknown): number | null {
  const id = Number(value);
  return Number.isSafeInteger(id) && id > 0 ? id : null;
}
