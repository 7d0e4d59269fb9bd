import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { TextFieldModule } from '@angular/cdk/text-field';

import { CHARACTER_CODE, DEFAULT_DRIFT_THRESHOLD, ORGANS, type Character, type Organ } from '../../../../../shared/api/collection-answers.js';
import { refusalMessage } from '../../../core/http/field-errors';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { ProblemNotice } from '../../../shared/problem-notice';

/** Adds a character to the catalogue, or edits one (code and organ stay: readings refer to them). Closes with the saved character. */
@Component({
  selector: 'hl-character-dialog',
  imports: [
    ProblemNotice,
    MatButtonModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    MatSlideToggleModule,
    ReactiveFormsModule,
    TextFieldModule,
  ],
  templateUrl: './character-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CharacterDialog {
  private readonly api = inject(CollectionApi);
  private readonly dialogRef = inject(MatDialogRef<CharacterDialog, Character>);

  /** The character being edited, or null for a new one. */
  protected readonly character = inject<Character | null>(MAT_DIALOG_DATA);
  protected readonly organs = ORGANS;
  protected readonly defaultThreshold = DEFAULT_DRIFT_THRESHOLD;
  protected readonly form = inject(NonNullableFormBuilder).group({
    code: [this.character?.code ?? '', [Validators.required, Validators.maxLength(60), Validators.pattern(CHARACTER_CODE)]],
    organ: [(this.character?.organ ?? 'leaf') as Organ, Validators.required],
    label: [this.character?.label ?? '', [Validators.required, Validators.maxLength(120)]],
    howToRead: [this.character?.howToRead ?? '', [Validators.required, Validators.maxLength(2000)]],
    caution: [this.character?.caution ?? '', Validators.maxLength(1000)],
    driftThreshold: [this.character?.driftThreshold ?? DEFAULT_DRIFT_THRESHOLD, [Validators.required, Validators.min(0.01), Validators.max(100)]],
    active: [this.character?.active ?? true],
  });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected saveCharacter(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    const { code, organ, label, howToRead, caution, driftThreshold, active } = this.form.getRawValue();
    const shared = { label: label.trim(), howToRead: howToRead.trim(), caution: caution.trim() || null, driftThreshold: Number(driftThreshold) };
    const request = this.character
      ? this.api.updateCharacter(this.character.id, { ...shared, active })
      : this.api.createCharacter({ ...shared, code: code.trim(), organ, colour: true });
    request.subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    const message = refusalMessage(this.form, error, 'Saving the character failed. Try again.');
    if (message !== null) this.problem.set(message);
  }
}
