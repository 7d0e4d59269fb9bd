import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { MyCalibrationResult } from '../../../../../shared/api/calibration-answers.js';
import { verdictFor } from '../../../../../shared/colour/verdict.js';
import { VerdictMark } from '../../../shared/chips/verdict-mark';
import { deltaEText } from '../../../shared/chips/chip-words';
import { biasNumbers, biasWords } from '../data/bias-words';
import { certificatePdfUrl } from '../data/calibration-api';
import { kappaWords } from '../data/session-words';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** An observer's own result of a closed session: mean ΔE00, bias in words, and each pick beside its reference. */
@Component({
  selector: 'hl-my-result-view',
  imports: [LocalDateTimePipe, MatIconModule, VerdictMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './my-result-view.html',
  styleUrl: './my-result-view.scss',
})
export class MyResultView {
  readonly result = input.required<MyCalibrationResult>();

  protected readonly observer = computed(() => this.result().observer);
  protected readonly bias = computed(() => biasWords(this.observer().bias));
  protected readonly biasFigures = computed(() => {
    const bias = this.observer().bias;
    return bias ? biasNumbers(bias) : null;
  });
  protected readonly kappa = computed(() => kappaWords(this.result().fleissKappa, this.result().band));
  /** The rules not met, joined into one clause. */
  protected readonly failedText = computed(() => this.observer().failedRules.map((r) => r.text).join('; '));
  protected readonly deltaEText = deltaEText;
  protected readonly verdictFor = verdictFor;
  protected readonly pdfUrl = certificatePdfUrl;
}
