import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormControl, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { map, startWith, switchMap } from 'rxjs';

import { monthDayWords } from '../data/season-days';
import { type SeasonDraft, type SeasonGroup, seasonGroup, seasonLengthWords, tidyMonthDay } from '../data/season-form';
import { schemeProblems } from '../data/season-problems';
import { YearRing } from './year-ring';

/**
 * Edits a site's season scheme: one row per season (name, first and last day as MM-DD) beside a
 * ring of the year. Overlaps and uncovered days are listed in words with an icon as they are typed;
 * the server checks the same rules again on save.
 */
@Component({
  selector: 'hl-season-editor',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule, YearRing],
  templateUrl: './season-editor.html',
  styleUrl: './season-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeasonEditor {
  private readonly fb = inject(NonNullableFormBuilder);

  /** The rows being edited; owned by the page's form so one save sends everything. */
  readonly seasons = input.required<FormArray<SeasonGroup>>();

  /** The rows' current values, as they are typed. */
  protected readonly drafts = toSignal(
    toObservable(this.seasons).pipe(
      switchMap((array) => array.valueChanges.pipe(startWith(null), map(() => array.getRawValue() as SeasonDraft[]))),
    ),
    { initialValue: [] as SeasonDraft[] },
  );
  protected readonly problemIcons = { overlap: 'layers', gap: 'event_busy', name: 'content_copy' } as const;
  protected readonly problemTitles = { overlap: 'Overlap:', gap: 'Gap:', name: 'Same name:' } as const;
  protected readonly problems = computed(() => schemeProblems(this.drafts()));
  /** Whether every row has a name and two real dates (only then is "all covered" worth saying). */
  protected readonly complete = computed(() => this.drafts().every((draft) => draft.name.trim() && seasonLengthWords(draft) !== null));

  protected addSeason(): void {
    this.seasons().push(seasonGroup(this.fb));
  }

  protected removeSeason(index: number): void {
    this.seasons().removeAt(index);
    this.seasons().markAsDirty();
  }

  protected tidy(control: FormControl<string>): void {
    tidyMonthDay(control);
  }

  protected words(monthDay: string): string {
    return monthDayWords(monthDay) ?? '';
  }

  protected lengthWords(draft: SeasonDraft): string | null {
    return seasonLengthWords(draft);
  }
}
