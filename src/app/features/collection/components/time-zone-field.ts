import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, FormControl, ReactiveFormsModule, ValidationErrors, ValidatorFn } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { of, startWith, switchMap } from 'rxjs';

import { matchTimeZones, timeZones, zoneOffset } from '../data/time-zones';

const ZONES = timeZones();
const KNOWN = new Set(ZONES);

/** Refuses a zone the browser does not know (the server checks again with its own list). */
export const knownTimeZone: ValidatorFn = (control: AbstractControl<string>): ValidationErrors | null =>
  control.value && !KNOWN.has(control.value) ? { timeZone: true } : null;

/** A time zone typed with suggestions from every IANA zone the browser knows, and its UTC offset shown under it. */
@Component({
  selector: 'hl-time-zone-field',
  imports: [MatAutocompleteModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-form-field subscriptSizing="dynamic">
      <mat-label>Time zone</mat-label>
      <mat-icon matPrefix aria-hidden="true">schedule</mat-icon>
      <input matInput [formControl]="control()" [matAutocomplete]="zones" autocomplete="off" spellcheck="false" />
      <mat-autocomplete #zones="matAutocomplete">
        @for (zone of suggestions(); track zone) {
          <mat-option [value]="zone">{{ zone }}</mat-option>
        }
      </mat-autocomplete>
      @if (offset(); as now) {
        <mat-hint>Now {{ now }}. Seasons and reading dates follow this zone.</mat-hint>
      } @else {
        <mat-hint>Type a city or region, e.g. Fiji or Port Moresby.</mat-hint>
      }
      @if (control().hasError('required')) {
        <mat-error>Choose the site's time zone.</mat-error>
      } @else if (control().hasError('timeZone')) {
        <mat-error>Choose a zone from the list, e.g. Pacific/Fiji.</mat-error>
      } @else if (control().getError('server'); as message) {
        <mat-error>The time zone {{ message }}.</mat-error>
      }
    </mat-form-field>
  `,
  styles: `
    mat-form-field {
      width: 100%;
    }
  `,
})
export class TimeZoneField {
  /** The control holding the IANA zone name. */
  readonly control = input.required<FormControl<string>>();

  private readonly typed = toSignal(
    toObservable(this.control).pipe(switchMap((control) => control?.valueChanges.pipe(startWith(control.value)) ?? of(''))),
    { initialValue: '' },
  );
  protected readonly suggestions = computed(() => {
    const typed = this.typed();
    return KNOWN.has(typed) ? matchTimeZones(ZONES, '') : matchTimeZones(ZONES, typed);
  });
  protected readonly offset = computed(() => (KNOWN.has(this.typed()) ? zoneOffset(this.typed()) : null));
}
