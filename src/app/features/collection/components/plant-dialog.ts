import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import type { Accession, Plant, Site } from '../../../../../shared/api/collection-answers.js';
import { refusalMessage } from '../../../core/http/field-errors';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { plantAgeWords } from '../../../shared/collection/passport-fields';
import { ProblemNotice } from '../../../shared/problem-notice';
import { localToday } from '../../../core/format/local-date-time';

/** What the plant dialog needs: the accession, the plant to edit (null: a new one) and the sites. */
export interface PlantDialogData {
  accession: Accession;
  plant: Plant | null;
  sites: readonly Site[];
}

/** Adds a plant to an accession or edits its label, planting date and site; closes with the saved plant. */
@Component({
  selector: 'hl-plant-dialog',
  imports: [ProblemNotice, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>{{ data.plant ? 'Edit plant ' + data.plant.label : 'Add a plant to ' + data.accession.accessionNumber }}</h2>
    <form [formGroup]="form" (ngSubmit)="savePlant()" novalidate>
      <mat-dialog-content class="hl-form">
        <hl-problem-notice [message]="problem()" />
        <mat-form-field>
          <mat-label>Plant label</mat-label>
          <input matInput formControlName="label" autocomplete="off" cdkFocusInitial />
          <mat-hint>As written on its tag, e.g. R3-07</mat-hint>
          @if (form.controls.label.hasError('required')) {
            <mat-error>Give the label on the plant's tag.</mat-error>
          } @else if (form.controls.label.getError('server'); as message) {
            <mat-error>The label {{ message }}.</mat-error>
          }
        </mat-form-field>
        <mat-form-field>
          <mat-label>Planted on</mat-label>
          <input matInput type="date" formControlName="plantedOn" />
          <mat-hint>{{ age() }}</mat-hint>
          @if (form.controls.plantedOn.hasError('required')) {
            <mat-error>Give the planting date.</mat-error>
          } @else if (form.controls.plantedOn.getError('server'); as message) {
            <mat-error>The date {{ message }}.</mat-error>
          }
        </mat-form-field>
        <mat-form-field>
          <mat-label>Site</mat-label>
          <mat-select formControlName="siteId">
            @for (site of data.sites; track site.id) {
              <mat-option [value]="site.id">{{ site.code }} · {{ site.name }}</mat-option>
            }
          </mat-select>
          @if (form.controls.siteId.getError('server'); as message) {
            <mat-error>The site {{ message }}.</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()">{{ data.plant ? 'Save plant' : 'Add plant' }}</button>
      </mat-dialog-actions>
    </form>
  `,
})
export class PlantDialog {
  private readonly api = inject(CollectionApi);
  private readonly dialogRef = inject(MatDialogRef<PlantDialog, Plant>);

  protected readonly data = inject<PlantDialogData>(MAT_DIALOG_DATA);
  protected readonly form = inject(NonNullableFormBuilder).group({
    label: [this.data.plant?.label ?? '', [Validators.required, Validators.maxLength(40)]],
    plantedOn: [this.data.plant?.plantedOn ?? localToday(), Validators.required],
    siteId: [this.data.plant?.siteId ?? this.data.accession.siteId],
  });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly age = signal('');

  constructor() {
    this.form.controls.plantedOn.valueChanges.subscribe((date) => this.age.set(date ? `Age today: ${plantAgeWords(date)}` : ''));
    this.age.set(`Age today: ${plantAgeWords(this.form.controls.plantedOn.value)}`);
  }

  protected savePlant(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    const { label, plantedOn, siteId } = this.form.getRawValue();
    const body = { label: label.trim(), plantedOn, siteId };
    const request = this.data.plant ? this.api.updatePlant(this.data.plant.id, body) : this.api.addPlant(this.data.accession.id, body);
    request.subscribe({
      next: (plant) => this.dialogRef.close(plant),
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    const message = refusalMessage(this.form, error, 'Saving the plant failed. Try again.');
    if (message !== null) this.problem.set(message);
  }
}
