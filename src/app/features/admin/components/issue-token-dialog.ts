import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import type { IssuedApiToken } from '../../../../../shared/api/api-token-answers.js';
import { refusalMessage } from '../../../core/http/field-errors';
import { AdminApi } from '../data/admin-api';
import { ApiTokensApi } from '../data/api-tokens-api';
import { ProblemNotice } from '../../../shared/problem-notice';

/** Issue a BrAPI token to an active person; closes with the issued token (shown once by the page). */
@Component({
  selector: 'hl-issue-token-dialog',
  imports: [ProblemNotice, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './issue-token-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IssueTokenDialog {
  private readonly api = inject(ApiTokensApi);
  private readonly adminApi = inject(AdminApi);
  private readonly dialogRef = inject(MatDialogRef<IssueTokenDialog, IssuedApiToken>);
  private readonly users = rxResource({ stream: () => this.adminApi.users() });

  protected readonly activeUsers = computed(() => (this.users.value() ?? []).filter((u) => u.active));
  protected readonly form = inject(NonNullableFormBuilder).group({
    userId: [0, [Validators.required, Validators.min(1)]],
    label: ['', [Validators.required, Validators.maxLength(80)]],
  });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected issueToken(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    const { userId, label } = this.form.getRawValue();
    this.api.issue(userId, label.trim()).subscribe({
      next: (issued) => this.dialogRef.close(issued),
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    const message = refusalMessage(this.form, error, 'Issuing the token failed. Try again.');
    if (message !== null) this.problem.set(message);
  }
}
