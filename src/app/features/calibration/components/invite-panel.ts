import { ChangeDetectionStrategy, Component, OnInit, computed, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { Observable, catchError, forkJoin, map, of } from 'rxjs';

import type { Participant, ParticipantsAnswer } from '../../../../../shared/api/calibration-answers.js';
import type { Role } from '../../../../../shared/api/roles.js';
import { ApiError } from '../../../core/http/api-error';
import { CalibrationApi } from '../data/calibration-api';
import { ProblemNotice } from '../../../shared/problem-notice';

/** Someone who may be invited. */
interface Candidate {
  id: number;
  name: string;
  /** E-mail when known (admins see the user list), else where we know them from. */
  note: string;
}

/**
 * Invites observers to a session; each invited person is told in the app and by mail. Admins
 * choose from the user list; trainers (who may not list users) from every active user's
 * certification standing.
 */
@Component({
  selector: 'hl-invite-panel',
  imports: [ProblemNotice, MatButtonModule, MatCheckboxModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <hl-problem-notice [message]="problem()" />
    @if (done(); as message) {
      <p role="status" class="done"><mat-icon aria-hidden="true" class="inline">mark_email_read</mat-icon> {{ message }}</p>
    }
    @if (candidates() === null) {
      <p class="hl-muted">Loading people…</p>
    } @else if (!open().length) {
      <p class="hl-muted">Everyone is invited already.</p>
    } @else {
      <ul class="people">
        @for (c of open(); track c.id) {
          <li><mat-checkbox [checked]="chosen().has(c.id)" (change)="toggle(c.id)">{{ c.name }} <span class="hl-muted">· {{ c.note }}</span></mat-checkbox></li>
        }
      </ul>
      <button mat-flat-button type="button" [disabled]="!chosen().size || busy()" (click)="inviteChosen()">
        <mat-icon aria-hidden="true">person_add</mat-icon> Invite {{ chosen().size || '' }}
      </button>
    }
  `,
  styles: `
    .people {
      margin: 0 0 8px;
      padding: 0;
      list-style: none;
    }
    .people li {
      min-height: 48px;
    }
  `,
})
export class InvitePanel implements OnInit {
  private readonly api = inject(CalibrationApi);

  readonly sessionId = input.required<number>();
  readonly role = input.required<Role | null>();
  /** Who is invited or answering now. */
  readonly participants = input.required<readonly Participant[]>();
  readonly invited = output<ParticipantsAnswer>();

  protected readonly candidates = signal<Candidate[] | null>(null);
  protected readonly chosen = signal(new Set<number>());
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** What the last invitation did, in words. */
  protected readonly done = signal<string | null>(null);
  protected readonly open = computed(() => {
    const taken = new Set(this.participants().filter((p) => p.invited).map((p) => p.userId));
    return (this.candidates() ?? []).filter((c) => !taken.has(c.id));
  });

  ngOnInit(): void {
    this.loadCandidates();
  }

  protected toggle(id: number): void {
    this.chosen.update((set) => {
      const next = new Set(set);
      if (!next.delete(id)) next.add(id);
      return next;
    });
  }

  protected inviteChosen(): void {
    this.busy.set(true);
    this.problem.set(null);
    this.api.invite(this.sessionId(), [...this.chosen()]).subscribe({
      next: (answer) => {
        this.busy.set(false);
        this.chosen.set(new Set());
        this.done.set(`Invited ${answer.added}; each was told in the app and ${answer.mailed === answer.added ? 'by mail' : `by mail (${answer.mailed} of ${answer.added} mails sent)`}.`);
        this.invited.emit(answer);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.problem.set(error instanceof ApiError ? error.message : 'The invitations were not saved. Try again.');
      },
    });
  }

  private loadCandidates(): void {
    // Only admins may list users; a trainer is not sent to a 403.
    const users: Observable<Candidate[] | null> =
      this.role() === 'admin'
        ? this.api.users().pipe(
            map((rows) => rows.filter((u) => u.active).map((u): Candidate => ({ id: u.id, name: u.name, note: `${u.email}, ${u.role}` }))),
            catchError(() => of(null)),
          )
        : of(null);
    // Trainers choose from every active user's certification standing, which they may read.
    const known = this.api.standings().pipe(
      map((rows) => rows.map((r): Candidate => ({ id: r.userId, name: r.name, note: `${r.role}, ${r.standing === 'never' ? 'never certified' : `certificate ${r.standing}`}` }))),
      catchError(() => of([] as Candidate[])),
    );
    forkJoin([users, known]).subscribe(([all, fromRecords]) => this.candidates.set(all ?? fromRecords));
  }
}
