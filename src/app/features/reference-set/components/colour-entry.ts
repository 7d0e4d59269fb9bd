import { ChangeDetectionStrategy, Component, DestroyRef, inject, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { merge } from 'rxjs';

import { LAB_INPUT_LIMITS } from '../../../../../shared/api/reference-set-answers.js';
import { isHex } from '../../../../../shared/colour/parse.js';
import { hexQuery, labQuery, type ColourQuery, type EntryMode } from '../../../shared/chips/colour-query';

function hexValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value.trim() === '' || isHex(control.value) ? null : { hex: true };
}

const { lMin, lMax, abMax } = LAB_INPUT_LIMITS;

/** Three ways to give a colour: typed hex, an instrument's L*a*b*, or the screen's colour picker. */
@Component({
  selector: 'hl-colour-entry',
  imports: [MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './colour-entry.html',
  styleUrl: './colour-entry.scss',
})
export class ColourEntry {
  private readonly destroyRef = inject(DestroyRef);
  private readonly fb = inject(NonNullableFormBuilder);

  /** The colour as entered, or null while the entry is incomplete or invalid. */
  readonly colour = output<ColourQuery | null>();

  protected readonly limits = { lMin, lMax, abMax };
  protected readonly mode = signal<EntryMode>('hex');
  protected readonly form = this.fb.group({
    hex: ['', [Validators.required, hexValidator]],
    l: this.fb.control<number | null>(null, [Validators.required, Validators.min(lMin), Validators.max(lMax)]),
    a: this.fb.control<number | null>(null, [Validators.required, Validators.min(-abMax), Validators.max(abMax)]),
    b: this.fb.control<number | null>(null, [Validators.required, Validators.min(-abMax), Validators.max(abMax)]),
    /** Starts at a mid purple, a typical petiole colour, rather than black. */
    picked: ['#7b3f6e'],
  });

  constructor() {
    merge(this.form.controls.hex.valueChanges, this.form.controls.l.valueChanges, this.form.controls.a.valueChanges, this.form.controls.b.valueChanges, this.form.controls.picked.valueChanges)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe(() => this.colour.emit(this.query(false)));
  }

  protected chooseMode(mode: EntryMode): void {
    this.mode.set(mode);
    this.colour.emit(this.query(false));
  }

  /** The Match button: shows what is wrong, or asks the server at once. */
  protected matchNow(): void {
    this.form.markAllAsTouched();
    const query = this.query(true);
    if (query) this.colour.emit(query);
  }

  private query(now: boolean): ColourQuery | null {
    const v = this.form.getRawValue();
    switch (this.mode()) {
      case 'hex':
        return hexQuery(v.hex, now);
      case 'lab':
        return labQuery([v.l, v.a, v.b], now);
      case 'screen':
        return hexQuery(v.picked, now);
    }
  }
}
