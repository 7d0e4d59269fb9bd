import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule, MatAutocompleteSelectedEvent } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import type { Accession, Plant } from '../../../../../shared/api/collection-answers.js';
import { filterAccessions, readLabel } from '../data/label-text';

/** How long after leaving the box the typed text is settled (our own; longer than an option tap). */
const SETTLE_MS = 250;

/** "HL-0001 · Name". */
export function accessionText(accession: Accession | null | undefined): string {
  return accession ? `${accession.accessionNumber} · ${accession.name}` : '';
}

/**
 * Which accession: type-ahead over number and names, or the label's text (typed, or pasted from
 * the phone's text recognition) which picks the accession whose number is in it, and its plant.
 */
@Component({
  selector: 'hl-accession-picker',
  imports: [MatAutocompleteModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-form-field class="wide" [class.hl-invalid]="invalidShown()">
      <mat-label>Accession</mat-label>
      <mat-icon matPrefix aria-hidden="true">potted_plant</mat-icon>
      <input
        matInput
        [value]="text()"
        (input)="typed($any($event.target).value)"
        (blur)="settle()"
        [matAutocomplete]="auto"
        autocomplete="off"
        autocapitalize="characters"
        spellcheck="false"
        placeholder="Number or name"
        required
        [attr.aria-invalid]="invalidShown()"
        aria-describedby="accession-problem"
      />
      <mat-autocomplete #auto="matAutocomplete" (optionSelected)="picked($event)" [hideSingleSelectionIndicator]="true">
        @for (a of options(); track a.id) {
          <mat-option [value]="a.id" class="option">
            <strong>{{ a.accessionNumber }}</strong> {{ a.name }}
            @if (a.otherNames.length) {
              <span class="hl-muted"> · {{ a.otherNames.join(', ') }}</span>
            }
          </mat-option>
        } @empty {
          <mat-option disabled>No accession matches.</mat-option>
        }
      </mat-autocomplete>
    </mat-form-field>
    @if (invalidShown()) {
      <p class="field-error" id="accession-problem" role="alert">{{ control().getError('server') ?? 'Choose the accession (required).' }}</p>
    }

    <details class="label-box" [open]="labelOpen()">
      <summary (click)="$event.preventDefault(); labelOpen.set(!labelOpen())"><mat-icon aria-hidden="true">qr_code_scanner</mat-icon> Read its label text</summary>
      <mat-form-field class="wide" subscriptSizing="dynamic">
        <mat-label>Label text</mat-label>
        <textarea matInput rows="2" #labelText placeholder="Type or paste what the label says" (input)="readLabelText(labelText.value)"></textarea>
        <mat-hint>Paste from the camera's text recognition; the accession whose number is in it is chosen.</mat-hint>
      </mat-form-field>
      @if (labelProblem(); as problem) {
        <p class="problem" role="status">{{ problem }}</p>
      }
    </details>
  `,
  styles: `
    :host {
      display: block;
    }
    .wide {
      width: 100%;
    }
    .field-error {
      margin: -12px 0 12px;
      color: var(--mat-sys-error);
      font: var(--mat-sys-body-small);
    }
    .hl-invalid {
      --mat-form-field-outlined-outline-color: var(--mat-sys-error);
      --mat-form-field-filled-active-indicator-color: var(--mat-sys-error);
      --mat-form-field-filled-label-text-color: var(--mat-sys-error);
    }
    .label-box summary {
      display: flex;
      align-items: center;
      gap: 6px;
      min-height: 48px;
      cursor: pointer;
      font: var(--mat-sys-title-small);
      color: var(--mat-sys-primary);
    }
    .problem {
      margin: 4px 0 0;
      color: var(--mat-sys-error);
    }
  `,
})
export class AccessionPicker {
  readonly accessions = input.required<readonly Accession[]>();
  /** The form's accession id field. */
  readonly control = input.required<FormControl<number | null>>();
  /** The plant a label named along with its accession. */
  readonly plantFromLabel = output<Plant>();

  protected readonly text = signal('');
  protected readonly query = signal('');
  protected readonly labelOpen = signal(false);
  protected readonly labelProblem = signal<string | null>(null);
  protected readonly options = computed(() => filterAccessions(this.query(), this.accessions()));

  /** Whether the missing or refused accession is shown as an error. */
  protected readonly invalidShown = signal(false);
  private readonly chosenId = signal<number | null>(null);
  private readonly chosen = computed(() => this.accessions().find((a) => a.id === this.chosenId()) ?? null);

  constructor() {
    effect((onCleanup) => {
      const control = this.control();
      const follow = (id: number | null) => {
        this.chosenId.set(id);
        this.text.set(accessionText(this.accessions().find((a) => a.id === id)));
      };
      follow(control.value);
      const subscription = control.valueChanges.subscribe(follow);
      // The input is not bound to the control, so its touched/invalid state is followed by hand.
      const status = () => this.invalidShown.set(control.invalid && control.touched);
      status();
      const events = control.events.subscribe(status);
      onCleanup(() => {
        subscription.unsubscribe();
        events.unsubscribe();
      });
    });
    // The list may arrive after the remembered id: show its words once it does.
    effect(() => {
      const chosen = this.chosen();
      if (chosen) this.text.set(accessionText(chosen));
    });
  }

  protected typed(value: string): void {
    this.text.set(value);
    this.query.set(value);
  }

  protected picked(event: MatAutocompleteSelectedEvent): void {
    this.choose(event.option.value as number);
  }

  /** Leaving the box with a typed number that names exactly one accession chooses it; otherwise the choice stays. */
  protected settle(): void {
    // After the autocomplete has had its turn: a tapped option blurs the box before it is selected.
    setTimeout(() => this.settleNow(), SETTLE_MS);
  }

  private settleNow(): void {
    const exact = readLabel(this.text(), this.accessions());
    if (exact && this.text().trim().length > 0 && exact.accession.id !== this.chosenId()) this.choose(exact.accession.id);
    else this.text.set(accessionText(this.chosen()));
    this.query.set('');
  }

  protected readLabelText(value: string): void {
    if (!value.trim()) {
      this.labelProblem.set(null);
      return;
    }
    const match = readLabel(value, this.accessions());
    if (!match) {
      this.labelProblem.set('No accession number found in that text yet.');
      return;
    }
    this.labelProblem.set(null);
    this.choose(match.accession.id);
    if (match.plant) this.plantFromLabel.emit(match.plant);
  }

  private choose(id: number): void {
    const control = this.control();
    control.setValue(id);
    control.markAsDirty();
  }
}
