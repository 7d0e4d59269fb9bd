import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { TextFieldModule } from '@angular/cdk/text-field';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { MCPD_DATE, type Accession, type Site } from '../../../../../shared/api/collection-answers.js';
import { refusalMessage } from '../../../core/http/field-errors';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { PASSPORT_LABELS, SAMPLE_STATUSES } from '../../../shared/collection/passport-fields';
import { passportBody } from '../data/passport-body';
import { ProblemNotice } from '../../../shared/problem-notice';

/** What the accession dialog needs: the accession to edit (null: a new one) and the sites to choose from. */
export interface AccessionDialogData {
  accession: Accession | null;
  sites: readonly Site[];
}

/** Creates an accession or edits its passport, with the MCPD field names shown small beside our labels. */
@Component({
  selector: 'hl-accession-dialog',
  imports: [ProblemNotice, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule, TextFieldModule],
  templateUrl: './accession-dialog.html',
  styles: `
    .pair {
      display: grid;
      grid-template-columns: 1fr;
      gap: 0 12px;
    }
    @media (min-width: 600px) {
      .pair {
        grid-template-columns: 1fr 1fr;
      }
    }
    .mcpd {
      font-size: 0.75em;
      letter-spacing: 0.04em;
      opacity: 0.75;
      margin-left: 4px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccessionDialog {
  private readonly api = inject(CollectionApi);
  private readonly dialogRef = inject(MatDialogRef<AccessionDialog, Accession>);

  protected readonly data = inject<AccessionDialogData>(MAT_DIALOG_DATA);
  protected readonly labels = PASSPORT_LABELS;
  protected readonly statuses = SAMPLE_STATUSES;
  protected readonly coordinateFields = ['collectingLatitude', 'collectingLongitude', 'collectingElevationM'] as const;
  protected readonly form = this.buildForm(this.data.accession);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected upperCaseCountry(): void {
    const control = this.form.controls.originCountry;
    control.setValue(control.value.trim().toUpperCase());
  }

  protected saveAccession(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    const body = passportBody(this.form.getRawValue());
    const existing = this.data.accession;
    const request = existing ? this.api.updateAccession(existing.id, body) : this.api.createAccession(body);
    request.subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private buildForm(accession: Accession | null) {
    const fb = inject(NonNullableFormBuilder);
    return fb.group({
      accessionNumber: [accession?.accessionNumber ?? '', [Validators.required, Validators.maxLength(40)]],
      name: [accession?.name ?? '', [Validators.required, Validators.maxLength(120)]],
      otherNames: [accession?.otherNames.join('; ') ?? ''],
      siteId: [accession?.siteId ?? this.data.sites[0]?.id ?? (null as unknown as number), Validators.required],
      originCountry: [accession?.originCountry ?? '', Validators.pattern(/^[A-Z]{3}$/)],
      acquisitionDate: [accession?.acquisitionDate ?? '', Validators.pattern(MCPD_DATE)],
      collectingSite: [accession?.collectingSite ?? '', Validators.maxLength(200)],
      collectingLatitude: [accession?.collectingLatitude?.toString() ?? ''],
      collectingLongitude: [accession?.collectingLongitude?.toString() ?? ''],
      collectingElevationM: [accession?.collectingElevationM?.toString() ?? ''],
      sampleStatus: [accession?.sampleStatus ?? (null as number | null)],
      instituteCode: [accession?.instituteCode ?? '', Validators.maxLength(20)],
      donorName: [accession?.donorName ?? '', Validators.maxLength(200)],
      remarks: [accession?.remarks ?? '', Validators.maxLength(2000)],
    });
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    const message = refusalMessage(this.form, error, 'Saving the accession failed. Try again.');
    if (message !== null) this.problem.set(message);
  }
}
