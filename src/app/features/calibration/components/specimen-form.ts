import { ChangeDetectionStrategy, Component, inject, input, output, signal, viewChild } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import { SPECIMEN_LABEL_MAX, type CreateSpecimenRequest, type SpecimenSource } from '../../../../../shared/api/calibration-answers.js';
import type { PhotoDto } from '../../../../../shared/api/photo-answers.js';
import { LAB_INPUT_LIMITS } from '../../../../../shared/api/reference-set-answers.js';
import type { Region } from '../../../../../shared/photo/region.js';
import { ApiError } from '../../../core/http/api-error';
import { refusalMessage } from '../../../core/http/field-errors';
import { PhotoCanvas } from '../../../shared/photos/photo-canvas';
import { PhotosApi } from '../../../shared/photos/photos-api';
import { normaliseCode } from '../../../shared/chips/chip-words';
import { CalibrationApi } from '../data/calibration-api';
import { ProblemNotice } from '../../../shared/problem-notice';

/** Adds one specimen to a session: a label and its reference colour from an instrument's L*a*b*, a chip code, or a photo region. */
@Component({
  selector: 'hl-specimen-form',
  imports: [ProblemNotice, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, PhotoCanvas, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './specimen-form.html',
  styleUrl: './specimen-form.scss',
})
export class SpecimenForm {
  private readonly api = inject(CalibrationApi);
  private readonly photos = inject(PhotosApi);

  readonly sessionId = input.required<number>();
  /** A specimen was added (its id). */
  readonly added = output<number>();
  /** The form's directive: resetting through it also clears "submitted", so the emptied label shows no error. */
  private readonly formDirective = viewChild.required(FormGroupDirective);

  protected readonly limits = LAB_INPUT_LIMITS;
  protected readonly source = signal<SpecimenSource>('lab');
  protected readonly form = inject(NonNullableFormBuilder).group({
    label: ['', [Validators.required, Validators.maxLength(SPECIMEN_LABEL_MAX)]],
    l: [null as number | null],
    a: [null as number | null],
    b: [null as number | null],
    chipCode: [''],
  });
  protected readonly photo = signal<PhotoDto | null>(null);
  protected readonly uploading = signal<number | null>(null);
  protected readonly region = signal<Region | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected choosePhoto(input: HTMLInputElement): void {
    const file = input.files?.[0];
    if (!file) return;
    this.problem.set(null);
    this.region.set(null);
    this.uploading.set(0);
    this.photos.upload(file, file.name).subscribe({
      next: (progress) => {
        if (progress.kind === 'progress') this.uploading.set(progress.fraction ?? 0);
        else {
          this.uploading.set(null);
          this.photo.set(progress.photo);
        }
      },
      error: (error: unknown) => {
        this.uploading.set(null);
        this.problem.set(error instanceof ApiError ? error.message : 'The photo was not uploaded. Try again.');
      },
    });
  }

  protected addSpecimen(): void {
    const body = this.body();
    if (!body) return;
    this.busy.set(true);
    this.problem.set(null);
    this.api.addSpecimen(this.sessionId(), body).subscribe({
      next: ({ id }) => {
        this.busy.set(false);
        this.formDirective().resetForm();
        this.region.set(null);
        this.photo.set(null);
        this.added.emit(id);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        const message = refusalMessage(this.form, error, 'The specimen was not added. Try again.', { 'lab.0': 'l', 'lab.1': 'a', 'lab.2': 'b' });
        if (message !== null) this.problem.set(message);
      },
    });
  }

  /** The request for the chosen source, or null (with the problem shown) when something is missing. */
  private body(): CreateSpecimenRequest | null {
    const v = this.form.getRawValue();
    const label = v.label.trim();
    if (!label) {
      this.form.controls.label.markAsTouched();
      this.form.controls.label.setErrors({ required: true });
      return null;
    }
    switch (this.source()) {
      case 'lab': {
        const lab = [v.l, v.a, v.b].map((x) => (x === null || String(x) === '' ? NaN : Number(x)));
        if (!lab.every(Number.isFinite)) return this.refuse('Give L*, a* and b* as numbers.');
        return { label, lab: lab as [number, number, number] };
      }
      case 'chip': {
        const code = normaliseCode(v.chipCode);
        if (!code) return this.refuse('Type a chip code such as F-087 or F-087.014.');
        return { label, chipCode: code };
      }
      default: {
        const photo = this.photo();
        const region = this.region();
        if (!photo || !region) return this.refuse('Upload a photo and drag a rectangle over the tissue.');
        return { label, photoId: photo.id, region };
      }
    }
  }

  private refuse(message: string): null {
    this.problem.set(message);
    return null;
  }
}
