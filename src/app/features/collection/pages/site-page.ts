import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { rxResource, takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router, RouterLink } from '@angular/router';
import { of } from 'rxjs';

import type { SavedSite, Season, Site } from '../../../../../shared/api/collection-answers.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { ApiError } from '../../../core/http/api-error';
import { applyFieldErrors } from '../../../core/http/field-errors';
import { SeasonEditor } from '../components/season-editor';
import { TimeZoneField, knownTimeZone } from '../components/time-zone-field';
import { YearRing } from '../components/year-ring';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { type SeasonDraft, seasonGroup, seasonLengthWords } from '../data/season-form';
import { schemeProblems } from '../data/season-problems';
import { siteBody } from '../data/site-body';
import { formatDateTime } from '../../../core/format/local-date-time';
import { ProblemNotice } from '../../../shared/problem-notice';

/** One site: everyone sees its time zone and season ring; an admin edits it, seasons included, and creates new ones. */
@Component({
  selector: 'hl-site-page',
  imports: [
    ProblemNotice,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressSpinnerModule,
    ReactiveFormsModule,
    RouterLink,
    SeasonEditor,
    TimeZoneField,
    YearRing,
  ],
  templateUrl: './site-page.html',
  styleUrl: './site-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SitePage {
  private readonly api = inject(CollectionApi);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly auth = inject(AuthStore);

  /** The site's id from the route, or "new". */
  readonly id = input.required<string>();

  protected readonly isNew = computed(() => this.id() === 'new');
  protected readonly canEdit = computed(() => this.auth.role() === 'admin');
  protected readonly site = rxResource({
    params: () => (this.isNew() ? null : Number(this.id())),
    stream: ({ params }) => (params === null ? of(null) : this.api.site(params)),
  });
  protected readonly loading = computed(() => !this.isNew() && this.site.isLoading() && !this.site.hasValue());
  protected readonly loadFailed = computed(() => !this.isNew() && !!this.site.error());
  protected readonly form = this.fb.group({
    code: ['', [Validators.required, Validators.maxLength(12)]],
    name: ['', [Validators.required, Validators.maxLength(120)]],
    timezone: ['UTC', [Validators.required, knownTimeZone]],
    latitude: [null as number | null, [Validators.min(-90), Validators.max(90)]],
    longitude: [null as number | null, [Validators.min(-180), Validators.max(180)]],
    elevationM: [null as number | null],
    seasons: this.fb.array([seasonGroup(this.fb)]),
  });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly saved = signal<string | null>(null);

  constructor() {
    effect(() => {
      const site = this.site.value();
      if (site) this.fillForm(site);
    });
    // A refusal shown above the form no longer applies once the person changes something.
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.problem.set(null));
  }

  protected lengthWords(season: Season): string {
    return seasonLengthWords(season) ?? `${season.start} → ${season.end}`;
  }

  protected saveSite(): void {
    const blocking = schemeProblems(this.form.controls.seasons.getRawValue()).filter((p) => p.blocking);
    if (this.form.invalid || blocking.length > 0 || this.form.controls.seasons.length === 0) {
      this.form.markAllAsTouched();
      this.problem.set(
        this.form.controls.seasons.length === 0
          ? 'Add at least one season: a site needs a season scheme.'
          : blocking.length > 0
            ? 'Seasons overlap or share a name; fix the seasons marked below before saving.'
            : 'Some fields need attention before the site can be saved.',
      );
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    const body = siteBody(this.form.getRawValue());
    const request = this.isNew() ? this.api.createSite(body) : this.api.updateSite(Number(this.id()), body);
    request.subscribe({
      next: (site) => this.showSaved(site),
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private fillForm(site: Site): void {
    const seasons: SeasonDraft[] = site.seasons.map(({ name, start, end }) => ({ name, start, end }));
    this.form.setControl('seasons', this.fb.array(seasons.map((season) => seasonGroup(this.fb, season))));
    this.form.patchValue({
      code: site.code,
      name: site.name,
      timezone: site.timezone,
      latitude: site.latitude,
      longitude: site.longitude,
      elevationM: site.elevationM,
    });
    this.form.markAsPristine();
  }

  private showSaved(site: SavedSite): void {
    this.busy.set(false);
    const time = formatDateTime(new Date(), 'time');
    const warning = site.warnings.map((w) => w.message).join('; ');
    this.saved.set(warning ? `${time}, with a warning: ${warning}` : time);
    if (this.isNew()) {
      void this.router.navigate(['/collection/sites', site.id], { replaceUrl: true });
    } else {
      this.site.set(site);
    }
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    if (!(error instanceof ApiError)) {
      this.problem.set('Saving the site failed. Try again.');
      return;
    }
    const unmatched = applyFieldErrors(this.form, error);
    this.problem.set([error.message, ...unmatched].join(' '));
  }
}
