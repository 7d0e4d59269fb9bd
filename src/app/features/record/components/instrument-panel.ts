import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import { ILLUMINANT_LABELS, INSTRUMENT_ILLUMINANTS, type InstrumentIlluminant } from '../../../../../shared/api/reading-answers.js';
import type { ReadingFormGroup } from '../data/reading-draft';
import { LabFields } from './lab-fields';

/**
 * The reading form's instrument method: the illuminant/observer the instrument reports, why no
 * light is asked, the L*a*b* it shows and its name. Its fields are the form's own controls.
 */
@Component({
  selector: 'hl-instrument-panel',
  imports: [LabFields, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  // The panel shows the form's control states (touched, invalid, server errors), which are not
  // signals: it is checked with its parent like any part of the form.
  changeDetection: ChangeDetectionStrategy.Default,
  templateUrl: './instrument-panel.html',
  styleUrl: './instrument-panel.scss',
})
export class InstrumentPanel {
  /** The reading form the panel's fields belong to. */
  readonly form = input.required<ReadingFormGroup>();

  protected readonly illuminants = INSTRUMENT_ILLUMINANTS;
  protected readonly illuminantLabels = ILLUMINANT_LABELS;

  /** The illuminant/observer chosen so far. */
  protected chosen(): InstrumentIlluminant | null {
    return this.form().controls.illuminant.value;
  }

  protected choose(illuminant: InstrumentIlluminant): void {
    this.form().controls.illuminant.setValue(illuminant);
  }
}
