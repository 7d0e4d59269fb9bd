import { ChangeDetectionStrategy, Component, inject, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';

import type { ReferenceSetSummary } from '../../../../../shared/api/reference-set-answers.js';
import { ReferenceSetApi } from '../../../shared/chips/reference-set-api';

/**
 * The admin's setting of which reference set new readings are matched against. Switching splits
 * a season's readings across two sets, so it says so before the admin confirms.
 */
@Component({
  selector: 'hl-current-set-chooser',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="chooser" aria-labelledby="current-set-heading">
      <h2 id="current-set-heading">Current reference set</h2>
      <p class="hl-muted">
        New readings are matched against the current set; every reading keeps the set it was matched against, and its detail shows
        its chips in the other sets too.
      </p>
      @if (sets().length) {
        <div class="row">
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>Set for new readings</mat-label>
            <mat-select [ngModel]="chosen()" (ngModelChange)="chosen.set($event)" data-testid="current-set-select">
              @for (s of sets(); track s.id) {
                <mat-option [value]="s.id">{{ s.id }} — {{ s.fieldChips + s.fineChips }} chips{{ s.current ? ' (current)' : '' }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
          <button mat-flat-button type="button" [disabled]="busy() || chosen() === currentId()" (click)="makeCurrent()">Make current</button>
        </div>
      }
      @if (message(); as m) {
        <p role="status">{{ m }}</p>
      }
    </section>
  `,
  styles: `
    .row {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
    }
    button {
      min-height: 48px;
    }
  `,
})
export class CurrentSetChooser {
  private readonly api = inject(ReferenceSetApi);

  /** Emits the new current set's id once the server has taken the choice. */
  readonly changed = output<string>();

  protected readonly sets = signal<ReferenceSetSummary[]>([]);
  protected readonly chosen = signal<string | null>(null);
  protected readonly currentId = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly message = signal<string | null>(null);

  constructor() {
    this.api.sets().subscribe((sets) => this.show(sets));
  }

  /** Sends the choice; the error interceptor reports a refusal. */
  protected makeCurrent(): void {
    const id = this.chosen();
    if (!id) return;
    this.busy.set(true);
    this.api.chooseCurrent(id).subscribe({
      next: (sets) => {
        this.show(sets);
        this.busy.set(false);
        this.message.set(`Set ${id} is now current: new readings are matched against it.`);
        this.changed.emit(id);
      },
      error: () => this.busy.set(false),
    });
  }

  private show(sets: ReferenceSetSummary[]): void {
    this.sets.set(sets);
    const current = sets.find((s) => s.current)?.id ?? null;
    this.currentId.set(current);
    this.chosen.set(current);
  }
}
