import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar } from '@angular/material/snack-bar';

import type { WalkEntry } from '../../../../../shared/api/plant-sheet-answers.js';
import { ApiError } from '../../../core/http/api-error';
import { PlantSheetApi } from '../../../shared/collection/plant-sheet-api';

/** A walk entry's key, unique across characters and descriptors. */
export function walkKey(entry: Pick<WalkEntry, 'kind' | 'id'>): string {
  return `${entry.kind}-${entry.id}`;
}

/** The list with the entry at `from` moved one place up (-1) or down (+1); the same list when it cannot move. */
export function moveEntry<T>(list: readonly T[], from: number, step: -1 | 1): T[] {
  const to = from + step;
  if (from < 0 || from >= list.length || to < 0 || to >= list.length) return [...list];
  const next = [...list];
  [next[from], next[to]] = [next[to]!, next[from]!];
  return next;
}

/**
 * Admin → Walk order: the order the plant sheet walks the catalogue (leaf → petiole → basal ring
 * and sheath → corm → roots), changed with a move-up and a move-down button on each row — big
 * targets for a phone, and the keyboard's focus follows the row it moved — then saved at once.
 */
@Component({
  selector: 'hl-walk-order-page',
  imports: [MatButtonModule, MatIconModule, MatProgressSpinnerModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="hl-page">
      <h1>Walk order</h1>
      <p class="hl-muted">The order every plant sheet lists the colour characters and descriptors, as one walks a plant. Move a row with its arrows, then save; recorders see the new order on their next sheet.</p>
      @if (problem(); as p) {
        <p class="hl-notice hl-notice-error" role="alert"><mat-icon aria-hidden="true">error</mat-icon><span>{{ p }}</span></p>
      }
      @if (loading()) {
        <p class="hl-empty" role="status"><mat-spinner diameter="24" /> Loading the walk order…</p>
      } @else {
        <ol class="walk" aria-label="Walk order">
          @for (e of entries(); track key(e); let i = $index, first = $first, last = $last) {
            <li class="entry" [class.inactive]="!e.active">
              <span class="position" aria-hidden="true">{{ i + 1 }}</span>
              <span class="text">
                <span class="label">{{ e.label }}</span>
                <span class="hl-muted meta">{{ e.kind === 'character' ? 'Colour' : 'Descriptor' }} · {{ e.code }}{{ e.active ? '' : ' · retired' }}</span>
              </span>
              <button mat-icon-button type="button" class="move" [id]="'up-' + key(e)" [disabled]="first || saving()" (click)="move(i, -1)" [attr.aria-label]="'Move ' + e.label + ' up'">
                <mat-icon>arrow_upward</mat-icon>
              </button>
              <button mat-icon-button type="button" class="move" [id]="'down-' + key(e)" [disabled]="last || saving()" (click)="move(i, 1)" [attr.aria-label]="'Move ' + e.label + ' down'">
                <mat-icon>arrow_downward</mat-icon>
              </button>
            </li>
          }
        </ol>
        <div class="save-bar">
          <button mat-flat-button type="button" [disabled]="!changed() || saving()" (click)="saveOrder()">
            <mat-icon>save</mat-icon> {{ saving() ? 'Saving…' : changed() ? 'Save walk order' : 'No changes to save' }}
          </button>
          @if (changed()) {
            <button mat-button type="button" [disabled]="saving()" (click)="load()">Undo changes</button>
          }
        </div>
      }
    </section>
  `,
  styles: `
    .walk {
      list-style: none;
      margin: 0 0 80px;
      padding: 0;
    }
    .entry {
      display: flex;
      align-items: center;
      gap: 8px;
      min-height: 56px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .entry.inactive .label {
      color: var(--mat-sys-on-surface-variant);
    }
    .position {
      min-width: 2.5em;
      text-align: right;
      font-variant-numeric: tabular-nums;
      color: var(--mat-sys-on-surface-variant);
    }
    .text {
      flex: 1;
      display: flex;
      flex-direction: column;
      min-width: 0;
    }
    .meta {
      font: var(--mat-sys-body-small);
      overflow-wrap: anywhere;
    }
    // 48 × 48 px targets for a thumb (the icon button's own touch area is smaller on compact density).
    .move {
      width: 48px;
      height: 48px;
      flex: none;
    }
    .save-bar {
      position: sticky;
      bottom: 0;
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      padding: 8px 0;
      background: var(--mat-sys-surface);
    }
    .save-bar button {
      min-height: 48px;
    }
  `,
})
export class WalkOrderPage {
  private readonly api = inject(PlantSheetApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);

  protected readonly entries = signal<WalkEntry[]>([]);
  protected readonly loading = signal(true);
  protected readonly saving = signal(false);
  /** Whether the list differs from what the server holds. */
  protected readonly changed = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly key = walkKey;

  constructor() {
    this.load();
  }

  /** Reads the walk order from the server (again, dropping unsaved moves). */
  protected load(): void {
    this.loading.set(true);
    this.api.walkOrder().subscribe({
      next: (entries) => {
        this.entries.set(entries);
        this.changed.set(false);
        this.problem.set(null);
        this.loading.set(false);
      },
      error: () => {
        this.problem.set('The walk order could not be loaded. Reload the page to try again.');
        this.loading.set(false);
      },
    });
  }

  /** Moves a row one place and keeps the keyboard on it: the same arrow, or the other one at an end. */
  protected move(index: number, step: -1 | 1): void {
    const entry = this.entries()[index];
    if (!entry) return;
    this.entries.set(moveEntry(this.entries(), index, step));
    this.changed.set(true);
    const at = index + step;
    const end = at === 0 || at === this.entries().length - 1;
    const id = `${end ? (step === -1 ? 'down' : 'up') : step === -1 ? 'up' : 'down'}-${walkKey(entry)}`;
    afterNextRender({ write: () => this.host.nativeElement.querySelector<HTMLElement>(`[id="${id}"]`)?.focus() }, { injector: this.injector });
  }

  protected saveOrder(): void {
    this.saving.set(true);
    this.problem.set(null);
    this.api.setWalkOrder(this.entries()).subscribe({
      next: (entries) => {
        this.entries.set(entries);
        this.changed.set(false);
        this.saving.set(false);
        this.snackBar.open('Walk order saved: plant sheets follow it now.', 'OK', { duration: 4000 });
      },
      error: (error: unknown) => {
        this.saving.set(false);
        this.problem.set(`Nothing was saved. ${error instanceof ApiError ? (error.detail ?? error.title) : 'The server could not be reached.'}`);
      },
    });
  }
}
