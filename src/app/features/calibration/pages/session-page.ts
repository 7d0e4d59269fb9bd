import { ChangeDetectionStrategy, Component, DestroyRef, type OnInit, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';

import type { CalibrationResults, CalibrationSessionDetail, SpecimenView } from '../../../../../shared/api/calibration-answers.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { ApiError } from '../../../core/http/api-error';
import { ConfirmDialog, type ConfirmDialogData } from '../../../shared/confirm-dialog';
import { labText } from '../../../shared/chips/chip-words';
import { CalibrationTabs } from '../components/calibration-tabs';
import { InvitePanel } from '../components/invite-panel';
import { ResultsView } from '../components/results-view';
import { SpecimenForm } from '../components/specimen-form';
import { CalibrationApi } from '../data/calibration-api';
import { Poller, RESULTS_POLL_MS } from '../data/poller';
import { runsSessions } from '../data/session-words';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';
import { ProblemNotice } from '../../../shared/problem-notice';

/** Words for where a specimen's reference came from. */
const SOURCE_WORDS: Record<SpecimenView['source'], string> = { lab: 'instrument L*a*b*', chip: 'chip', photo: 'photo region' };

/**
 * The trainer's page of one session: specimens, invitations, live results that refresh every few
 * seconds while the session is open, and closing it. Others are sent to the trainee screen.
 */
@Component({
  selector: 'hl-session-page',
  imports: [ProblemNotice, LocalDateTimePipe, MatButtonModule, MatExpansionModule, MatIconModule, MatProgressSpinnerModule, RouterLink, CalibrationTabs, InvitePanel, ResultsView, SpecimenForm],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './session-page.html',
  styleUrl: './session-page.scss',
})
export class SessionPage implements OnInit {
  private readonly api = inject(CalibrationApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);
  protected readonly role = inject(AuthStore).role;
  /** The session's id, from the route (component input binding). */
  readonly id = input.required<string>();
  protected readonly sessionId = computed(() => Number(this.id()));

  protected readonly session = signal<CalibrationSessionDetail | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly closing = signal(false);
  /** Whether the add-specimen panel is open: at first only when there is no specimen, then as the trainer leaves it. */
  protected readonly addOpen = signal<boolean | null>(null);
  /** Live results; the poller stops once they say closed, and when the page is left. */
  protected readonly poller = new Poller<CalibrationResults>(() => this.api.results(this.sessionId()), (r) => r.status === 'open', RESULTS_POLL_MS, inject(DestroyRef));
  protected readonly results = computed(() => this.poller.value());
  protected readonly open = computed(() => this.session()?.status === 'open' && this.results()?.status !== 'closed');
  protected readonly pollSeconds = RESULTS_POLL_MS / 1000;
  protected readonly sourceWords = SOURCE_WORDS;
  protected readonly labText = labText;

  ngOnInit(): void {
    if (!runsSessions(this.role())) {
      void this.router.navigate(['/calibration/sessions', this.id(), 'take'], { replaceUrl: true });
      return;
    }
    this.loadSession();
    this.poller.start();
  }

  protected loadSession(): void {
    this.api.session(this.sessionId()).subscribe({
      next: (s) => {
        this.session.set(s);
        if (this.addOpen() === null) this.addOpen.set(!s.specimens.length);
      },
      error: (error: unknown) => this.problem.set(error instanceof ApiError ? error.message : 'The session could not be loaded.'),
    });
  }

  /** Where the colour-vision preview shows a specimen's reference and its neighbouring chips. */
  protected previewParams(s: SpecimenView): Record<string, string> {
    return s.referenceLab ? { lab: s.referenceLab.map((v) => v.toFixed(2)).join(','), label: s.label } : {};
  }

  protected specimenAdded(): void {
    this.loadSession();
    this.poller.start();
  }

  protected confirmClose(): void {
    const data: ConfirmDialogData = {
      title: 'Close this session?',
      message: 'Observers can no longer change their picks. Results are frozen, certifications are stored, and everyone who took part is told by e-mail.',
      confirmLabel: 'Close session',
    };
    this.dialog
      .open(ConfirmDialog, { data })
      .afterClosed()
      .subscribe((yes) => yes && this.closeSession());
  }

  private closeSession(): void {
    this.closing.set(true);
    this.api.close(this.sessionId()).subscribe({
      next: (answer) => {
        this.closing.set(false);
        this.poller.stop();
        // Show the frozen results at once; the poller's one-shot read confirms them.
        this.poller.start();
        this.loadSession();
        const n = answer.certifiedUserIds.length;
        this.snackBar.open(`Session closed: ${n} ${n === 1 ? 'observer' : 'observers'} certified, ${answer.mailed} told by e-mail.`, undefined, { duration: 5000 });
      },
      error: (error: unknown) => {
        this.closing.set(false);
        this.problem.set(error instanceof ApiError ? error.message : 'The session was not closed. Try again.');
        this.loadSession();
      },
    });
  }
}
