import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router, RouterLink } from '@angular/router';

import type { CalibrationSessionSummary } from '../../../../../shared/api/calibration-answers.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { CalibrationTabs } from '../components/calibration-tabs';
import { SessionForm } from '../components/session-form';
import { CalibrationApi } from '../data/calibration-api';
import { expectedResponses, runsSessions } from '../data/session-words';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** Sessions: those I can join, my past ones, and (trainers, admins) every session with its progress and a form for a new one. */
@Component({
  selector: 'hl-sessions-page',
  imports: [LocalDateTimePipe, MatButtonModule, MatExpansionModule, MatIconModule, MatProgressSpinnerModule, RouterLink, CalibrationTabs, SessionForm],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sessions-page.html',
  styleUrl: './sessions-page.scss',
})
export class SessionsPage {
  private readonly api = inject(CalibrationApi);
  private readonly router = inject(Router);

  private readonly auth = inject(AuthStore);

  protected readonly runs = computed(() => runsSessions(this.auth.role()));
  protected readonly sessions = signal<CalibrationSessionSummary[] | null>(null);
  protected readonly failed = signal(false);
  protected readonly joinable = computed(() => (this.sessions() ?? []).filter((s) => s.canRespond));
  protected readonly past = computed(() => (this.sessions() ?? []).filter((s) => s.status === 'closed' && s.myResponseCount > 0));
  protected readonly expected = expectedResponses;

  constructor() {
    this.loadSessions();
  }

  protected loadSessions(): void {
    this.failed.set(false);
    this.api.sessions().subscribe({ next: (list) => this.sessions.set(list), error: () => this.failed.set(true) });
  }

  protected openCreated(id: number): void {
    void this.router.navigate(['/calibration/sessions', id]);
  }
}
