import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { TextFieldModule } from '@angular/cdk/text-field';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';

import { DESCRIPTOR_CODE, DESCRIPTOR_KINDS, type Descriptor, type DescriptorKind } from '../../../../../shared/api/descriptor-answers.js';
import { refusalMessage } from '../../../core/http/field-errors';
import { type DescriptorChanges, DescriptorsApi, type NewDescriptor } from '../../../shared/descriptors/descriptors-api';
import { KIND_WORDS, categoryIdOf, ratioParts } from '../data/descriptor-words';
import { ProblemNotice } from '../../../shared/problem-notice';

/** What the descriptor dialog needs: the descriptor to edit (null: a new one) and the catalogue, for ratio parts. */
export interface DescriptorDialogData {
  descriptor: Descriptor | null;
  catalogue: readonly Descriptor[];
}

/** Adds a descriptor to the catalogue or edits one; code, kind and ratio parts never change once saved. */
@Component({
  selector: 'hl-descriptor-dialog',
  imports: [ProblemNotice, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, MatSlideToggleModule, ReactiveFormsModule, TextFieldModule],
  templateUrl: './descriptor-dialog.html',
  styles: `
    .pair {
      display: grid;
      grid-template-columns: 1fr 1fr;
      gap: 0 12px;
    }
    .categories {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      padding: 8px 12px 12px;
      margin: 8px 0;
      display: flex;
      flex-direction: column;
      gap: 8px;
    }
    .category {
      display: flex;
      align-items: flex-start;
      gap: 4px;
    }
    .category mat-form-field {
      flex: 1;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DescriptorDialog {
  private readonly api = inject(DescriptorsApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly dialogRef = inject(MatDialogRef<DescriptorDialog, Descriptor>);
  private readonly data = inject<DescriptorDialogData>(MAT_DIALOG_DATA);

  protected readonly descriptor = this.data.descriptor;
  protected readonly kinds = KIND_WORDS;
  protected readonly kindList = DESCRIPTOR_KINDS;
  protected readonly form = this.fb.group({
    code: [this.descriptor?.code ?? '', [Validators.required, Validators.maxLength(60), Validators.pattern(DESCRIPTOR_CODE)]],
    kind: [(this.descriptor?.kind ?? 'length') as DescriptorKind],
    numeratorCode: [this.descriptor?.numeratorCode ?? ''],
    denominatorCode: [this.descriptor?.denominatorCode ?? ''],
    label: [this.descriptor?.label ?? '', [Validators.required, Validators.maxLength(120)]],
    object: [this.descriptor?.object ?? '', [Validators.required, Validators.maxLength(200)]],
    howToMeasure: [this.descriptor?.howToMeasure ?? '', [Validators.required, Validators.maxLength(2000)]],
    caution: [this.descriptor?.caution ?? '', Validators.maxLength(1000)],
    active: [this.descriptor?.active ?? true],
    categories: this.fb.array((this.descriptor?.categories ?? []).map((c) => this.categoryRow(c.id, c.label))),
  });
  protected readonly kind = toSignal(this.form.controls.kind.valueChanges, { initialValue: this.form.controls.kind.value });
  protected readonly measured = computed(() => this.data.catalogue.filter((d) => d.kind === 'length' || d.kind === 'mass' || d.kind === 'count'));
  protected readonly parts = computed(() => (this.descriptor ? ratioParts(this.descriptor, this.data.catalogue) : null));
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected idFor(label: string): string {
    return categoryIdOf(label);
  }

  protected addCategory(): void {
    this.form.controls.categories.push(this.categoryRow('', ''));
  }

  protected removeCategory(index: number): void {
    this.form.controls.categories.removeAt(index);
  }

  protected saveDescriptor(): void {
    if (this.descriptor) this.form.controls.code.disable();
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    const request = this.descriptor ? this.api.updateDescriptor(this.descriptor.id, this.changes()) : this.api.createDescriptor(this.newDescriptor());
    request.subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private categoryRow(id: string, label: string) {
    return this.fb.group({ id: [id], label: [label, [Validators.required, Validators.maxLength(80)]] });
  }

  private categoryList() {
    return this.form.controls.categories.getRawValue().map((c) => ({ id: c.id || categoryIdOf(c.label), label: c.label.trim() }));
  }

  private newDescriptor(): NewDescriptor {
    const v = this.form.getRawValue();
    return {
      code: v.code.trim(),
      kind: v.kind,
      label: v.label.trim(),
      object: v.object.trim(),
      howToMeasure: v.howToMeasure.trim(),
      caution: v.caution.trim() || null,
      ...(v.kind === 'category' ? { categories: this.categoryList() } : {}),
      ...(v.kind === 'ratio' ? { numeratorCode: v.numeratorCode, denominatorCode: v.denominatorCode } : {}),
    };
  }

  private changes(): DescriptorChanges {
    const v = this.form.getRawValue();
    return {
      label: v.label.trim(),
      object: v.object.trim(),
      howToMeasure: v.howToMeasure.trim(),
      caution: v.caution.trim() || null,
      active: v.active,
      ...(this.descriptor?.kind === 'category' ? { categories: this.categoryList() } : {}),
    };
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    const message = refusalMessage(this.form, error, 'Saving the descriptor failed. Try again.');
    if (message !== null) this.problem.set(message);
  }
}
