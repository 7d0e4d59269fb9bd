import { ChangeDetectionStrategy, Component, computed, effect, input, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';

import { ORGANS, type Character, type Organ } from '../../../../../shared/api/collection-answers.js';

/** Organ headings as the picker shows them. */
const ORGAN_WORDS: Record<Organ, string> = {
  leaf: 'Leaf',
  petiole: 'Petiole',
  sheath: 'Sheath',
  sap: 'Sap',
  corm: 'Corm',
  cormel: 'Cormel',
  root: 'Root',
  flower: 'Flower',
};

/** The colour characters offered for new readings, grouped by organ in catalogue order. */
export function characterGroups(characters: readonly Character[]): { organ: Organ; label: string; characters: Character[] }[] {
  return ORGANS.map((organ) => ({
    organ,
    label: ORGAN_WORDS[organ],
    characters: characters.filter((c) => c.organ === organ && c.colour && c.active),
  })).filter((group) => group.characters.length > 0);
}

/** What is read: the colour characters grouped by organ, with how to read the chosen one and its caution shown large. */
@Component({
  selector: 'hl-character-picker',
  imports: [MatFormFieldModule, MatIconModule, MatSelectModule, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-form-field class="wide">
      <mat-label>Character</mat-label>
      <mat-select [formControl]="control()" panelClass="hl-character-panel">
        @for (group of groups(); track group.organ) {
          <mat-optgroup [label]="group.label">
            @for (c of group.characters; track c.id) {
              <mat-option [value]="c.id">{{ c.label }}</mat-option>
            }
          </mat-optgroup>
        }
      </mat-select>
      @if (control().hasError('server')) {
        <mat-error>{{ control().getError('server') }}</mat-error>
      } @else if (control().invalid) {
        <mat-error>Choose what you are reading.</mat-error>
      }
    </mat-form-field>
    @if (chosen(); as c) {
      @if (c.caution) {
        <div class="hl-notice caution" role="note">
          <mat-icon aria-hidden="true">back_hand</mat-icon>
          <p><strong>Caution.</strong> {{ c.caution }}</p>
        </div>
      }
      <div class="how" role="note">
        <mat-icon aria-hidden="true">menu_book</mat-icon>
        <p><strong>How to read it.</strong> {{ c.howToRead }}</p>
      </div>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .wide {
      width: 100%;
    }
    .caution {
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
      font: var(--mat-sys-body-large);
      border: 2px solid var(--mat-sys-tertiary);
      margin: 0 0 8px;
    }
    .how {
      display: flex;
      gap: 8px;
      font: var(--mat-sys-body-medium);
      margin: 0 0 8px;
      p {
        margin: 0;
      }
      mat-icon {
        flex: none;
      }
    }
  `,
})
export class CharacterPicker {
  readonly characters = input.required<readonly Character[]>();
  /** The form's character id field. */
  readonly control = input.required<FormControl<number | null>>();

  private readonly chosenId = signal<number | null>(null);
  protected readonly groups = computed(() => characterGroups(this.characters()));
  protected readonly chosen = computed(() => this.characters().find((c) => c.id === this.chosenId()) ?? null);

  constructor() {
    effect((onCleanup) => {
      const control = this.control();
      this.chosenId.set(control.value);
      const subscription = control.valueChanges.subscribe((id) => this.chosenId.set(id));
      onCleanup(() => subscription.unsubscribe());
    });
  }
}
