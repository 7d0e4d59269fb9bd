import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';

/** One value a filter can take, with the words shown for it. */
export interface ChoiceOption<T extends string | number> {
  value: T;
  text: string;
}

/** A list filter chosen from a fixed set, "Any" first; choosing "Any" sends undefined (no filter). */
@Component({
  selector: 'hl-filter-choice',
  imports: [MatFormFieldModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-form-field subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <mat-select [value]="value() ?? null" (selectionChange)="chosen.emit($event.value ?? undefined)">
        <mat-option [value]="null">Any</mat-option>
        @for (o of options(); track o.value) {
          <mat-option [value]="o.value">{{ o.text }}</mat-option>
        }
      </mat-select>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: block;
    }
    mat-form-field {
      width: 100%;
    }
  `,
})
export class FilterChoice<T extends string | number> {
  readonly label = input.required<string>();
  /** The value in force; undefined when the filter is off. */
  readonly value = input<T | undefined>(undefined);
  readonly options = input.required<readonly ChoiceOption<T>[]>();
  /** Another value was chosen (undefined for "Any"). */
  readonly chosen = output<T | undefined>();
}
