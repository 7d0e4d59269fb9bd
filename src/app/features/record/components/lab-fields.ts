import { ChangeDetectionStrategy, Component, computed, effect, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatButtonModule } from '@angular/material/button';
import { MatInputModule } from '@angular/material/input';

import { LAB_INPUT_LIMITS } from '../../../../../shared/api/reference-set-answers.js';
import { displayHex } from '../../../../../shared/colour/display-hex.js';
import { labQuery } from '../../../shared/chips/colour-query';
import { SignedNumberInput } from './signed-number-input';

/** The three CIELAB fields of an instrument reading. */
export type LabGroup = FormGroup<{ l: FormControl<number | null>; a: FormControl<number | null>; b: FormControl<number | null> }>;

/** An instrument's L*, a*, b* typed in, with range hints and the colour previewed on the grey surround as it is typed. */
@Component({
  selector: 'hl-lab-fields',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule, SignedNumberInput],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="hl-muted hint">From an instrument set to D65 and the 2° observer (specular component as your protocol says).</p>
    <div class="row" [formGroup]="group()">
      <div class="fields">
        @for (f of fields; track f.name) {
          <mat-form-field>
            <mat-label>{{ f.label }}</mat-label>
            <input matInput hlSignedNumber inputmode="decimal" [formControlName]="f.name" />
            @if (f.name !== 'l') {
              <button matSuffix mat-icon-button type="button" class="sign" (click)="flipSign(f.name)" [attr.aria-label]="'Change the sign of ' + f.label">±</button>
            }
            <mat-hint>{{ f.hint }}</mat-hint>
            @if (group().controls[f.name].hasError('server')) {
              <mat-error>{{ group().controls[f.name].getError('server') }}</mat-error>
            } @else if (group().controls[f.name].hasError('required')) {
              <mat-error>Enter {{ f.label }}.</mat-error>
            } @else if (group().controls[f.name].hasError('number')) {
              <mat-error>{{ f.label }} must be a number, like -12.5.</mat-error>
            } @else if (group().controls[f.name].invalid) {
              <mat-error>{{ f.label }} from {{ f.hint }}.</mat-error>
            }
          </mat-form-field>
        }
      </div>
      <div class="preview hl-swatch-surround" aria-live="polite">
        @if (shown(); as s) {
          <span class="swatch" [style.background-color]="s.hex" role="img" [attr.aria-label]="'Preview ' + s.hex"></span>
          <span class="hl-number code">{{ s.hex }}</span>
          @if (!s.inGamut) {
            <span class="note">beyond screen</span>
          }
        } @else {
          <span class="swatch empty" aria-hidden="true"></span>
          <span class="code">preview</span>
        }
      </div>
    </div>
  `,
  styles: `
    .hint {
      margin: 0 0 8px;
    }
    .row {
      display: flex;
      gap: 12px;
      align-items: flex-start;
    }
    .fields {
      display: flex;
      flex-direction: column;
      flex: 1;
      min-width: 0;
    }
    mat-form-field {
      width: 100%;
    }
    .preview {
      display: flex;
      flex-direction: column;
      align-items: center;
      gap: 4px;
      flex: none;
      width: 96px;
      box-sizing: border-box;
    }
    .swatch {
      width: 72px;
      height: 72px;
      border: 1px solid #5e5e5e;
      border-radius: 3px;
    }
    .swatch.empty {
      background: repeating-linear-gradient(45deg, #777777, #777777 6px, #6b6b6b 6px, #6b6b6b 12px);
    }
    .sign {
      font-size: 22px;
    }
    .code,
    .note {
      font-size: 12px;
      text-align: center;
    }
  `,
})
export class LabFields {
  readonly group = input.required<LabGroup>();

  protected readonly fields = [
    { name: 'l', label: 'L*', min: LAB_INPUT_LIMITS.lMin, max: LAB_INPUT_LIMITS.lMax, hint: `${LAB_INPUT_LIMITS.lMin} to ${LAB_INPUT_LIMITS.lMax}` },
    { name: 'a', label: 'a*', min: -LAB_INPUT_LIMITS.abMax, max: LAB_INPUT_LIMITS.abMax, hint: `−${LAB_INPUT_LIMITS.abMax} to ${LAB_INPUT_LIMITS.abMax}; + red, − green` },
    { name: 'b', label: 'b*', min: -LAB_INPUT_LIMITS.abMax, max: LAB_INPUT_LIMITS.abMax, hint: `−${LAB_INPUT_LIMITS.abMax} to ${LAB_INPUT_LIMITS.abMax}; + yellow, − blue` },
  ] as const;

  private readonly values = signal<[number | null, number | null, number | null]>([null, null, null]);
  protected readonly shown = computed(() => {
    const query = labQuery(this.values());
    return query ? displayHex(query.lab) : null;
  });

  /** The ± key: phones' decimal keypads often lack a minus sign. */
  protected flipSign(name: 'a' | 'b'): void {
    const control = this.group().controls[name];
    const value = control.value;
    if (value !== null && Number.isFinite(value)) control.setValue(value === 0 ? 0 : -value);
    control.markAsTouched();
  }

  constructor() {
    effect((onCleanup) => {
      const group = this.group();
      const read = () => {
        const v = group.getRawValue();
        this.values.set([v.l, v.a, v.b]);
      };
      read();
      const subscription = group.valueChanges.subscribe(read);
      onCleanup(() => subscription.unsubscribe());
    });
  }
}
