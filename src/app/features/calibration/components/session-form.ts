import { ChangeDetectionStrategy, Component, inject, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, of } from 'rxjs';

import { CALIBRATION_DEFAULT_THRESHOLDS, CALIBRATION_TITLE_MAX } from '../../../../../shared/api/calibration-answers.js';
import { refusalMessage } from '../../../core/http/field-errors';
import { ReferenceSetApi } from '../../../shared/chips/reference-set-api';
import { CalibrationApi } from '../data/calibration-api';
import { ProblemNotice } from '../../../shared/problem-notice';
import { localToday } from '../../../core/format/local-date-time';

/** A new calibration session: title, date, reference set, who may answer, and the certification thresholds. */
@Component({
  selector: 'hl-session-form',
  imports: [ProblemNotice, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './session-form.html',
  styles: `
    .session-form {
      max-width: 640px;
    }
    .thresholds {
      display: flex;
      flex-wrap: wrap;
      gap: 0 12px;
    }
    .thresholds mat-form-field {
      flex: 1 1 220px;
    }
  `,
})
export class SessionForm {
  private readonly api = inject(CalibrationApi);

  /** The new session's id, once the server has it. */
  readonly created = output<number>();

  protected readonly sets = toSignal(inject(ReferenceSetApi).sets().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly defaults = CALIBRATION_DEFAULT_THRESHOLDS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    title: ['', [Validators.required, Validators.maxLength(CALIBRATION_TITLE_MAX)]],
    heldOn: [localToday(), Validators.required],
    referenceSetId: [''],
    restricted: [false],
    kappa: [CALIBRATION_DEFAULT_THRESHOLDS.kappa as number, [Validators.required, Validators.min(-1), Validators.max(1)]],
    deltaE00: [CALIBRATION_DEFAULT_THRESHOLDS.deltaE00 as number, [Validators.required, Validators.min(0.01), Validators.max(100)]],
  });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected createSession(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.busy.set(true);
    this.problem.set(null);
    this.api
      .createSession({
        title: v.title.trim(),
        heldOn: v.heldOn,
        referenceSetId: v.referenceSetId || undefined,
        restricted: v.restricted,
        thresholds: { kappa: Number(v.kappa), deltaE00: Number(v.deltaE00) },
      })
      .subscribe({
        next: ({ id }) => {
          this.busy.set(false);
          this.created.emit(id);
        },
        error: (error: unknown) => {
          this.busy.set(false);
          const message = refusalMessage(this.form, error, 'Creating the session failed. Try again.', { 'thresholds.kappa': 'kappa', 'thresholds.deltaE00': 'deltaE00' });
          if (message !== null) this.problem.set(message);
        },
      });
  }
}
