import { ChangeDetectionStrategy, Component, DOCUMENT, ErrorHandler, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { Clipboard } from '@angular/cdk/clipboard';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar } from '@angular/material/snack-bar';
import { filter, switchMap } from 'rxjs';

import type { ApiTokenRow, IssuedApiToken } from '../../../../../shared/api/api-token-answers.js';
import { ConfirmDialog, ConfirmDialogData } from '../../../shared/confirm-dialog';
import { IssueTokenDialog } from '../components/issue-token-dialog';
import { ApiTokensApi } from '../data/api-tokens-api';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** BrAPI tokens: where clients connect, the token just issued (shown once), every token with its last use, revoking. */
@Component({
  selector: 'hl-api-tokens-page',
  imports: [LocalDateTimePipe, MatButtonModule, MatIconModule, MatProgressSpinnerModule],
  templateUrl: './api-tokens-page.html',
  styleUrl: './api-tokens-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApiTokensPage {
  private readonly api = inject(ApiTokensApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly clipboard = inject(Clipboard);
  private readonly errorHandler = inject(ErrorHandler);

  /** Where a BrAPI client points: this server's origin and the version path. */
  protected readonly baseUrl = `${inject(DOCUMENT).location.origin}/brapi/v2`;
  protected readonly tokens = rxResource({ stream: () => this.api.list() });
  /** The token issued on this visit; it is in no list and gone when the page is left. */
  protected readonly issued = signal<IssuedApiToken | null>(null);

  protected openIssueDialog(): void {
    this.dialog
      .open<IssueTokenDialog, void, IssuedApiToken>(IssueTokenDialog, { width: '520px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((token): token is IssuedApiToken => token !== undefined))
      .subscribe((token) => {
        this.issued.set(token);
        this.tokens.reload();
      });
  }

  protected copy(text: string, what: string): void {
    const copied = this.clipboard.copy(text);
    this.snackBar.open(copied ? `${what} copied.` : `Copying failed: select the ${what.toLowerCase()} and copy it by hand.`, 'OK', { duration: 4000 });
  }

  protected dismissIssued(): void {
    this.issued.set(null);
  }

  protected revoke(token: ApiTokenRow): void {
    const data: ConfirmDialogData = {
      title: `Revoke "${token.label}"?`,
      message: `Clients using the token ${token.prefix}… of ${token.userName} are refused from now on. This cannot be undone; issue a new token if they need access again.`,
      confirmLabel: 'Revoke',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => this.api.revoke(token.id)),
      )
      .subscribe({
        next: (revoked) => {
          this.tokens.update((rows) => rows?.map((row) => (row.id === revoked.id ? revoked : row)));
          if (this.issued()?.id === revoked.id) this.issued.set(null);
          this.snackBar.open(`"${revoked.label}" is revoked.`, 'OK', { duration: 4000 });
        },
        error: (error: unknown) => this.errorHandler.handleError(error),
      });
  }
}
