import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { RouterLink } from '@angular/router';
import { catchError, forkJoin, of } from 'rxjs';

import { SCREENING_METHOD_LABELS, type Certification, type ObserverStandingRow, type Screening } from '../../../../../shared/api/calibration-answers.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { deltaEText, formatNumber } from '../../../shared/chips/chip-words';
import { CalibrationTabs } from '../components/calibration-tabs';
import { ScreeningForm } from '../components/screening-form';
import { CalibrationApi, certificatePdfUrl } from '../data/calibration-api';
import { observerRecords } from '../data/observer-records';
import { runsSessions } from '../data/session-words';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** Certifications and colour-vision screenings: my own, and (trainers, admins) everyone's, unscreened people shown as such. */
@Component({
  selector: 'hl-records-page',
  imports: [LocalDateTimePipe, MatIconModule, MatProgressSpinnerModule, RouterLink, CalibrationTabs, ScreeningForm],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './records-page.html',
  styleUrl: './records-page.scss',
})
export class RecordsPage {
  private readonly api = inject(CalibrationApi);
  protected readonly auth = inject(AuthStore);

  protected readonly me = this.auth.currentUser;
  protected readonly runs = computed(() => runsSessions(this.auth.role()));
  protected readonly certifications = signal<Certification[] | null>(null);
  protected readonly screenings = signal<Screening[]>([]);
  private readonly people = signal<{ id: number; name: string }[]>([]);
  protected readonly failed = signal(false);
  /** Every active user's standing (trainers, admins); empty for others. */
  protected readonly standings = signal<ObserverStandingRow[]>([]);
  protected readonly standingCounts = computed(() => {
    const rows = this.standings();
    return { current: rows.filter((r) => r.standing === 'current').length, lapsed: rows.filter((r) => r.standing === 'lapsed').length, never: rows.filter((r) => r.standing === 'never').length };
  });
  protected readonly pdfUrl = certificatePdfUrl;

  protected readonly myCertifications = computed(() => (this.certifications() ?? []).filter((c) => c.userId === this.me()?.id));
  protected readonly myScreenings = computed(() => this.screenings().filter((s) => s.userId === this.me()?.id));
  protected readonly everyone = computed(() => observerRecords(this.people(), this.screenings(), this.certifications() ?? []));
  protected readonly subjects = computed(() => (this.runs() ? this.everyone().filter((r) => r.userId !== this.me()?.id).map((r) => ({ id: r.userId, name: r.name })) : []));
  protected readonly methodLabels = SCREENING_METHOD_LABELS;
  protected readonly deltaEText = deltaEText;
  protected readonly number = formatNumber;

  constructor() {
    this.loadRecords();
  }

  protected loadRecords(): void {
    this.failed.set(false);
    const users = this.auth.role() === 'admin' ? this.api.users().pipe(catchError(() => of([]))) : of([]);
    const standings = this.runs() ? this.api.standings() : of([]);
    forkJoin([this.api.certifications(), this.api.screenings(), users, standings]).subscribe({
      next: ([certs, screenings, all, rows]) => {
        this.standings.set(rows);
        this.certifications.set(certs);
        this.screenings.set(screenings);
        this.people.set(all.map((u) => ({ id: u.id, name: u.name })));
      },
      error: () => this.failed.set(true),
    });
  }
}
