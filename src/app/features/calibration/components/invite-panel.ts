import { ChangeDetectionStrategy, Component, OnInit, computed, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { Observable, catchError, forkJoin, map, of } from 'rxjs';

import type { Participant, ParticipantsAnswer } from '../../../../../shared/api/calibration-answers.js';
import type { Role } from '../../../../../shared/api/roles.js';
import { ApiError } from '../../../core/http/api-error';
import { CalibrationApi } from '../data/calibration-api';

/** Someone who may be invited. */
interface Candidate {
  id: number;
  name: string;
  /** E-mail when known (admins see the user list), else where we know them from. */
  note: string;
}

/**
 * Invites observers to a restricted session. Admins choose from every user; trainers (who may not
 * list users) from the people with a screening or certification on record.
 */
@Component({
  selector: 'hl-invite-panel',
  imports: [MatButtonModule, MatCheckboxModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (problem(); as message) {
      <div class="hl-notice hl-notice-error" role="alert"><mat-icon aria-hidden="true">error</mat-icon><p>{{ message }}</p></div>
    }
    @if (candidates() === null) {
      <p class="hl-muted">Loading people…</p>
    } @else if (!open().length) {
      <p class="hl-muted">Everyone we know of is invited already.{{ role() === 'admin' ? '' : ' Trainers see people once they have a screening or a certification on record; an admin can invite anyone.' }}</p>
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
    const known = forkJoin([this.api.screenings().pipe(catchError(() => of([]))), this.api.certifications().pipe(catchError(() => of([])))]).pipe(
      map(([screenings, certs]) => {
        const byId = new Map<number, Candidate>();
        for (const s of screenings) byId.set(s.userId, { id: s.userId, name: s.name, note: 'screened' });
        for (const c of certs) if (!byId.has(c.userId)) byId.set(c.userId, { id: c.userId, name: c.name, note: 'certified before' });
        return [...byId.values()].sort((x, y) => x.name.localeCompare(y.name));
      }),
    );
    forkJoin([users, known]).subscribe(([all, fromRecords]) => this.candidates.set(all ?? fromRecords));
  }
}
