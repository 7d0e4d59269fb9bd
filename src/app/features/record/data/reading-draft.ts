// The reading form's model: its controls, which parts each method needs, and the request body
// built from it. Kept apart from the page so the rules can be tested without a browser.
import { FormControl, FormGroup, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';

import type { Character, Organ } from '../../../../../shared/api/collection-answers.js';
import type { Region } from '../../../../../shared/photo/region.js';
import { LAB_INPUT_LIMITS } from '../../../../../shared/api/reference-set-answers.js';
import {
  CUT_SECONDS_MAX,
  LEAF_POSITION_MAX,
  READING_NOTES_MAX,
  SUPERSEDE_REASON_MAX,
  type CreateReadingRequest,
  type InstrumentIlluminant,
  type Light,
  type ReadingMethod,
} from '../../../../../shared/api/reading-answers.js';
import { isHex } from '../../../../../shared/colour/parse.js';

/** Organs whose reading is of freshly cut tissue or sap, so seconds since the cut are asked for. */
export const CUT_ORGANS: readonly Organ[] = ['corm', 'cormel', 'sap'];

/** Whether the character is read on a cut surface (corm, cormel and sap: the flesh browns, the sap changes). */
export function isCutCharacter(character: Character | null | undefined): boolean {
  return !!character && CUT_ORGANS.includes(character.organ);
}

/** The photo a photo reading samples: the stored photo, the region on the tissue, the grey card if one was marked. */
export interface PhotoSource {
  photoId: number;
  region: Region;
  neutral: Region | null;
  /** A photo taken out of range and kept on the phone (photoId is then 0): the offline queue uploads it first. */
  localPhotoId?: string;
}

const { lMin, lMax, abMax } = LAB_INPUT_LIMITS;
/** The server's limit on the instrument's name (shared/api/readings.ts has it inline, not as a constant). */
const INSTRUMENT_MAX = 80;

/** Refuses what a text field could not read as a number (NaN from `parseSignedNumber`). */
function finiteNumber(control: AbstractControl<number | null>): ValidationErrors | null {
  return control.value === null || Number.isFinite(control.value) ? null : { number: true };
}

function hexValidator(control: AbstractControl<string | null>): ValidationErrors | null {
  return !control.value || isHex(control.value) ? null : { hex: true };
}

/** Builds the form's controls (all nullable: a fresh form is empty, and "Next plant" resets parts of it). */
export function buildReadingForm() {
  return new FormGroup({
    accessionId: new FormControl<number | null>(null, Validators.required),
    plantId: new FormControl<number | null>(null),
    characterId: new FormControl<number | null>(null, Validators.required),
    siteId: new FormControl<number | null>(null, Validators.required),
    method: new FormControl<ReadingMethod | null>(null, Validators.required),
    lab: new FormGroup({
      l: new FormControl<number | null>(null, [finiteNumber, Validators.min(lMin), Validators.max(lMax)]),
      a: new FormControl<number | null>(null, [finiteNumber, Validators.min(-abMax), Validators.max(abMax)]),
      b: new FormControl<number | null>(null, [finiteNumber, Validators.min(-abMax), Validators.max(abMax)]),
    }),
    chipCode: new FormControl<string | null>(null),
    hex: new FormControl<string | null>(null, hexValidator),
    eyeChipCode: new FormControl<string | null>(null),
    /** The instrument's make or name (instrument readings), kept from plant to plant. */
    instrument: new FormControl<string | null>(null, Validators.maxLength(INSTRUMENT_MAX)),
    /** The ambient light: asked of every method but the instrument, which lights the sample itself. */
    light: new FormControl<Light | null>(null, Validators.required),
    /** The illuminant/observer an instrument reports (instrument readings only). */
    illuminant: new FormControl<InstrumentIlluminant | null>(null),
    secondsSinceCut: new FormControl<number | null>(null, [Validators.min(0), Validators.max(CUT_SECONDS_MAX), Validators.pattern(/^\d+$/)]),
    leafPosition: new FormControl<string | null>(null, Validators.maxLength(LEAF_POSITION_MAX)),
    notes: new FormControl<string | null>(null, Validators.maxLength(READING_NOTES_MAX)),
    reason: new FormControl<string | null>(null, Validators.maxLength(SUPERSEDE_REASON_MAX)),
  });
}

/** The reading form's group. */
export type ReadingFormGroup = ReturnType<typeof buildReadingForm>;
/** Its value, as `getRawValue()` gives it. */
export type ReadingFormValue = ReturnType<ReadingFormGroup['getRawValue']>;

/**
 * Turns each method's own parts on and the others off, so validity and the body follow the method
 * chosen: instrument needs L*a*b*, chip needs a chip, swatch a hex; a correction needs its reason.
 */
export function applyMethodRules(form: ReadingFormGroup, method: ReadingMethod | null, correcting: boolean): void {
  const lab = form.controls.lab.controls;
  for (const control of [lab.l, lab.a, lab.b]) setRequired(control, method === 'instrument');
  setRequired(form.controls.chipCode, method === 'chip');
  setRequired(form.controls.hex, method === 'swatch');
  setRequired(form.controls.light, method !== 'instrument');
  setRequired(form.controls.illuminant, method === 'instrument');
  setRequired(form.controls.reason, correcting);
}

function setRequired(control: AbstractControl, required: boolean): void {
  if (required) control.addValidators(Validators.required);
  else control.removeValidators(Validators.required);
  control.updateValueAndValidity({ emitEvent: false });
}

/** What is missing before a photo reading can be saved, in words; null when nothing is. */
export function photoProblem(method: ReadingMethod | null, photo: PhotoSource | null): string | null {
  return method === 'photo' && !photo ? 'Take or choose a photo and draw the region on the tissue first.' : null;
}

/** The request body for the form's value (only the chosen method's parts; empty optional fields left out). */
export function readingRequest(value: ReadingFormValue, photo: PhotoSource | null, cut: boolean, observedAt = new Date()): CreateReadingRequest {
  const method = value.method!;
  const body: CreateReadingRequest = {
    accessionId: value.accessionId!,
    characterId: value.characterId!,
    siteId: value.siteId!,
    method,
    observedAt: observedAt.toISOString(),
  };
  if (value.plantId !== null) body.plantId = value.plantId;
  if (method !== 'instrument') body.light = value.light!;
  if (method === 'instrument') {
    if (value.illuminant) body.illuminant = value.illuminant;
    body.lab = [value.lab.l!, value.lab.a!, value.lab.b!];
    const instrument = value.instrument?.trim();
    if (instrument) body.instrument = instrument;
  }
  if (method === 'chip') body.chipCode = value.chipCode!;
  if (method === 'swatch') body.hex = value.hex!.toLowerCase();
  if (method === 'photo' && photo) body.photo = { photoId: photo.photoId, region: photo.region, ...(photo.neutral ? { neutral: { region: photo.neutral } } : {}) };
  if ((method === 'photo' || method === 'instrument') && value.eyeChipCode) body.eyeChipCode = value.eyeChipCode;
  if (cut && value.secondsSinceCut !== null) body.secondsSinceCut = value.secondsSinceCut;
  const leaf = value.leafPosition?.trim();
  if (leaf) body.leafPosition = leaf;
  const notes = value.notes?.trim();
  if (notes) body.notes = notes;
  return body;
}

/**
 * Where a server field name lands on the form: `lab.0` on L*, `photo.region` on the photo, and so on.
 * Names that match a control directly need no entry.
 */
export const SERVER_FIELD_ALIASES: Record<string, string> = {
  'lab.0': 'lab.l',
  'lab.1': 'lab.a',
  'lab.2': 'lab.b',
  lab: 'lab.l',
  plant: 'plantId',
  accession: 'accessionId',
  character: 'characterId',
  site: 'siteId',
};

/** What "Next plant" keeps: the accession, character, light, site and method; the rest starts empty. */
export function nextPlantValue(value: ReadingFormValue): Partial<ReadingFormValue> {
  return {
    accessionId: value.accessionId,
    characterId: value.characterId,
    light: value.light,
    siteId: value.siteId,
    method: value.method,
    plantId: null,
    lab: { l: null, a: null, b: null },
    chipCode: null,
    hex: value.method === 'swatch' ? value.hex : null,
    eyeChipCode: null,
    instrument: value.instrument,
    illuminant: value.illuminant,
    secondsSinceCut: null,
    leafPosition: value.leafPosition,
    notes: null,
    reason: null,
  };
}

/** What "Next character on this plant" keeps: everything about the plant and how it is read; the colour starts empty. */
export function nextCharacterValue(value: ReadingFormValue, characterId: number): Partial<ReadingFormValue> {
  return {
    ...nextPlantValue(value),
    plantId: value.plantId,
    characterId,
    method: value.method === 'photo' ? null : value.method,
    hex: null,
    leafPosition: value.leafPosition,
  };
}
