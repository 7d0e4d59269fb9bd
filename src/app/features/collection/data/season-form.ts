import { AbstractControl, FormArray, FormControl, FormGroup, NonNullableFormBuilder, ValidationErrors, Validators } from '@angular/forms';

import { dayOfYear, monthDayWords, normaliseMonthDay, spanOf } from './season-days';

/** One season row of the editor. */
export type SeasonGroup = FormGroup<{ name: FormControl<string>; start: FormControl<string>; end: FormControl<string> }>;

/** A season as typed, before the server has given it an id. */
export interface SeasonDraft {
  name: string;
  start: string;
  end: string;
}

/** Refuses a month-day that is not a real date in a leap year ("02-30", "13-01", "11-0"). */
export function monthDayValidator(control: AbstractControl<string>): ValidationErrors | null {
  if (!control.value) return null;
  return dayOfYear(control.value) === null ? { monthDay: true } : null;
}

/** A season row with name, start and end required; dates must be real "MM-DD". */
export function seasonGroup(fb: NonNullableFormBuilder, season: SeasonDraft = { name: '', start: '', end: '' }): SeasonGroup {
  return fb.group({
    name: [season.name, [Validators.required, Validators.maxLength(40)]],
    start: [season.start, [Validators.required, monthDayValidator]],
    end: [season.end, [Validators.required, monthDayValidator]],
  });
}

/** The editor's rows for a scheme. */
export function seasonArray(fb: NonNullableFormBuilder, seasons: readonly SeasonDraft[]): FormArray<SeasonGroup> {
  return fb.array(seasons.map((season) => seasonGroup(fb, season)));
}

/** Puts a typed month-day into "MM-DD" form when the person leaves the field. */
export function tidyMonthDay(control: FormControl<string>): void {
  const tidy = normaliseMonthDay(control.value);
  if (tidy !== control.value) control.setValue(tidy);
}

/** "1 Nov → 30 Apr · 181 days (182 in leap years), across the year end", or null while the dates are not both valid. */
export function seasonLengthWords(season: SeasonDraft): string | null {
  const span = spanOf(season.start, season.end);
  if (!span) return null;
  const across = dayOfYear(season.end)! < dayOfYear(season.start)! ? ', across the year end' : '';
  // The ring counts 29 February; most years have one day fewer in a season that spans it.
  const leapDay = dayOfYear('02-29')!;
  const spansLeapDay = (leapDay - span.start + 366) % 366 < span.days;
  const days = spansLeapDay ? `${span.days - 1} days (${span.days} in leap years)` : span.days === 1 ? '1 day' : `${span.days} days`;
  return `${monthDayWords(season.start)} → ${monthDayWords(season.end)} · ${days}${across}`;
}
