import { ChangeDetectionStrategy, Component, type OnInit, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';

import type { CalibrationSessionDetail, MyCalibrationResult, MyPick } from '../../../../../shared/api/calibration-answers.js';
import { ApiError } from '../../../core/http/api-error';
import { ScreenCaution } from '../../../shared/chips/screen-caution';
import type { ChipSet } from '../../../shared/chips/chip-catalogue';
import { CalibrationTabs } from '../components/calibration-tabs';
import { ChipChooser } from '../components/chip-chooser';
import { MyResultView } from '../components/my-result-view';
import { CalibrationApi } from '../data/calibration-api';
import { SessionChips } from '../data/session-chips';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';
import { ProblemNotice } from '../../../shared/problem-notice';

/**
 * The trainee's screen: the session's specimens one by one, a pick for each from the field chips
 * and then their fine chips, changeable while the session is open; after close, their own result.
 */
@Component({
  selector: 'hl-take-page',
  imports: [ProblemNotice, LocalDateTimePipe, MatButtonModule, MatIconModule, MatProgressSpinnerModule, RouterLink, CalibrationTabs, ChipChooser, MyResultView, ScreenCaution],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './take-page.html',
  styleUrl: './take-page.scss',
})
export class TakePage implements OnInit {
  private readonly api = inject(CalibrationApi);
  private readonly chips = inject(SessionChips);
  private readonly snackBar = inject(MatSnackBar);
  /** The session's id, from the route (component input binding). */
  readonly id = input.required<string>();
  private readonly sessionId = computed(() => Number(this.id()));

  protected readonly session = signal<CalibrationSessionDetail | null>(null);
  protected readonly chipSet = signal<ChipSet | null>(null);
  protected readonly result = signal<MyCalibrationResult | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly saving = signal(false);
  /** Index of the specimen on screen. */
  protected readonly index = signal(0);

  protected readonly specimens = computed(() => this.session()?.specimens ?? []);
  protected readonly current = computed(() => this.specimens()[this.index()] ?? null);
  protected readonly picks = computed(() => new Map((this.session()?.myPicks ?? []).map((p) => [p.specimenId, p])));
  protected readonly currentPick = computed(() => {
    const specimen = this.current();
    return specimen ? (this.picks().get(specimen.id)?.chipCode ?? null) : null;
  });
  protected readonly answered = computed(() => this.specimens().filter((s) => this.picks().has(s.id)).length);

  ngOnInit(): void {
    this.loadSession(true);
  }

  protected loadSession(first = false): void {
    this.problem.set(null);
    this.api.session(this.sessionId()).subscribe({
      next: (session) => {
        this.session.set(session);
        if (first) this.index.set(firstUnanswered(session));
        if (!this.chipSet()) this.loadChips(session.referenceSetId);
        if (session.status === 'closed') this.loadResult();
      },
      error: (error: unknown) => this.problem.set(error instanceof ApiError ? error.message : 'The session could not be loaded.'),
    });
  }

  protected show(index: number): void {
    this.index.set(Math.max(0, Math.min(this.specimens().length - 1, index)));
  }

  /** Sends the confirmed pick for the specimen on screen, then moves on to the next one without a pick. */
  protected savePick(chipCode: string): void {
    const specimen = this.current();
    if (!specimen) return;
    this.saving.set(true);
    this.api.respond(this.sessionId(), { specimenId: specimen.id, chipCode }).subscribe({
      next: (answer) => {
        this.saving.set(false);
        this.rememberPick({ specimenId: specimen.id, chipCode, respondedAt: new Date().toISOString() });
        this.snackBar.open(`${answer.replaced ? 'Changed' : 'Saved'}: ${chipCode} for specimen ${specimen.position}`, undefined, { duration: 2500 });
        this.moveOn();
      },
      error: (error: unknown) => {
        this.saving.set(false);
        if (error instanceof ApiError && error.status === 409) this.loadSession();
        this.problem.set(error instanceof ApiError ? error.message : 'The pick was not saved. Try again.');
      },
    });
  }

  private rememberPick(pick: MyPick): void {
    this.session.update((s) => (s ? { ...s, myPicks: [...s.myPicks.filter((p) => p.specimenId !== pick.specimenId), pick] } : s));
  }

  private moveOn(): void {
    const list = this.specimens();
    const next = list.findIndex((s, i) => i > this.index() && !this.picks().has(s.id));
    const wrap = list.findIndex((s) => !this.picks().has(s.id));
    const target = next >= 0 ? next : wrap;
    if (target >= 0) this.index.set(target);
  }

  private loadChips(setId: string): void {
    this.chips.set(setId).subscribe({
      next: (set) => this.chipSet.set(set),
      error: () => {
        this.chips.forget(setId);
        this.problem.set(`The chips of set ${setId} could not be loaded. Reload the page to try again.`);
      },
    });
  }

  private loadResult(): void {
    this.api.myResult(this.sessionId()).subscribe({
      next: (result) => this.result.set(result),
      error: (error: unknown) => {
        if (!(error instanceof ApiError && error.status === 404)) this.problem.set(error instanceof ApiError ? error.message : 'Your result could not be loaded.');
      },
    });
  }
}

function firstUnanswered(session: CalibrationSessionDetail): number {
  const picked = new Set(session.myPicks.map((p) => p.specimenId));
  const index = session.specimens.findIndex((s) => !picked.has(s.id));
  return index < 0 ? 0 : index;
}
