import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import {
  MAT_SNACK_BAR_DATA,
  MatSnackBarAction,
  MatSnackBarActions,
  MatSnackBarLabel,
  MatSnackBarRef,
} from '@angular/material/snack-bar';
import type { FieldError } from '../../../../shared/api/problem.js';

/** What the error snack bar shows: a readable message and any refused fields. */
export interface ErrorSnackData {
  message: string;
  fields: readonly FieldError[];
}

/** Snack bar content for an error: an icon and words, with the refused fields listed. */
@Component({
  selector: 'hl-error-snack',
  imports: [MatButtonModule, MatIconModule, MatSnackBarLabel, MatSnackBarActions, MatSnackBarAction],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div matSnackBarLabel class="label" role="alert">
      <mat-icon aria-hidden="true">error</mat-icon>
      <div>
        <p class="message">{{ data.message }}</p>
        @if (data.fields.length > 0) {
          <ul>
            @for (field of data.fields; track field.field) {
              <li>
                <strong>{{ field.field }}</strong> {{ field.message }}
              </li>
            }
          </ul>
        }
      </div>
    </div>
    <div matSnackBarActions>
      <button mat-button matSnackBarAction (click)="dismiss()">Close</button>
    </div>
  `,
  styles: `
    .label {
      display: flex;
      gap: 8px;
      align-items: flex-start;
    }
    .message {
      margin: 0;
    }
    ul {
      margin: 4px 0 0;
      padding-left: 18px;
    }
  `,
})
export class ErrorSnack {
  private readonly snackBarRef = inject(MatSnackBarRef<ErrorSnack>);
  protected readonly data = inject<ErrorSnackData>(MAT_SNACK_BAR_DATA);

  protected dismiss(): void {
    this.snackBarRef.dismiss();
  }
}
