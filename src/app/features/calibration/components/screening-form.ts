import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { SCREENING_METHOD_LABELS, SCREENING_METHODS, SCREENING_NOTES_MAX, SCREENING_RESULTS, type ScreeningMethod, type ScreeningResult } from '../../../../../shared/api/calibration-answers.js';
import { refusalMessage } from '../../../core/http/field-errors';
import { CalibrationApi } from '../data/calibration-api';
import { localToday } from '../../../core/format/local-date-time';
import { ProblemNotice } from '../../../shared/problem-notice';

/** A person a trainer may record a screening for. */
export interface ScreeningSubject {
  id: number;
  name: string;
}

/** Records a self-reported colour-vision screening: one's own, or (trainers, admins) someone else's. */
@Component({
  selector: 'hl-screening-form',
  imports: [ProblemNotice, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <form class="hl-form screening" [formGroup]="form" (ngSubmit)="recordScreening()" novalidate aria-label="Record a screening">
      <hl-problem-notice [message]="problem()" />
      @if (subjects().length) {
        <mat-form-field>
          <mat-label>Whose screening</mat-label>
          <mat-select formControlName="userId">
            <mat-option [value]="0">Mine</mat-option>
            @for (p of subjects(); track p.id) {
              <mat-option [value]="p.id">{{ p.name }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
      }
      <mat-form-field>
        <mat-label>Date screened</mat-label>
        <input matInput type="date" formControlName="screenedOn" [max]="today" />
        @if (form.controls.screenedOn.getError('server'); as message) {
          <mat-error>The date {{ message }}.</mat-error>
        }
      </mat-form-field>
      <mat-form-field>
        <mat-label>Method</mat-label>
        <mat-select formControlName="method">
          @for (m of methods; track m) {
            <mat-option [value]="m">{{ methodLabels[m] }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Result</mat-label>
        <mat-select formControlName="result">
          @for (r of results; track r) {
            <mat-option [value]="r">{{ r }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Notes (optional)</mat-label>
        <textarea matInput formControlName="notes" rows="2"></textarea>
      </mat-form-field>
      <p class="hl-muted">Self-reported: Hueledger records what the observer or trainer states; it does not test colour vision.</p>
      <div class="hl-actions">
        <button mat-flat-button type="submit" [disabled]="busy()"><mat-icon aria-hidden="true">save</mat-icon> Record screening</button>
      </div>
    </form>
  `,
  styles: `
    .screening {
      max-width: 480px;
    }
  `,
})
export class ScreeningForm {
  private readonly api = inject(CalibrationApi);

  /** People a trainer or admin may record for; empty for an observer (only their own). */
  readonly subjects = input<readonly ScreeningSubject[]>([]);
  readonly recorded = output<number>();

  protected readonly today = localToday();
  protected readonly methods = SCREENING_METHODS;
  protected readonly results = SCREENING_RESULTS;
  protected readonly methodLabels = SCREENING_METHOD_LABELS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    userId: [0],
    screenedOn: [localToday(), Validators.required],
    method: ['pseudoisochromatic-plates' as ScreeningMethod, Validators.required],
    result: ['normal' as ScreeningResult, Validators.required],
    notes: ['', Validators.maxLength(SCREENING_NOTES_MAX)],
  });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected recordScreening(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.busy.set(true);
    this.problem.set(null);
    this.api.recordScreening({ userId: v.userId || undefined, screenedOn: v.screenedOn, method: v.method, result: v.result, notes: v.notes.trim() || undefined }).subscribe({
      next: ({ id }) => {
        this.busy.set(false);
        this.form.controls.notes.reset('');
        this.recorded.emit(id);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        const message = refusalMessage(this.form, error, 'The screening was not recorded. Try again.');
        if (message !== null) this.problem.set(message);
      },
    });
  }
}
