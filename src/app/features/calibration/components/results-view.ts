import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { SCREENING_METHOD_LABELS, type CalibrationResults, type FailedRule, type PairAgreement } from '../../../../../shared/api/calibration-answers.js';
import { verdictFor } from '../../../../../shared/colour/verdict.js';
import { KAPPA_BAND_LABELS } from '../../../../../shared/stats/landis-koch.js';
import { VerdictMark } from '../../../shared/chips/verdict-mark';
import { deltaEText, formatNumber } from '../../../shared/chips/chip-words';
import { biasNumbers, biasWords } from '../data/bias-words';
import { kappaWords, percentText } from '../data/session-words';
import { BiasChart } from './bias-chart';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** A session's results for the trainer: observers, group κ, Cohen's κ by pair, agreement by specimen, and the bias chart. */
@Component({
  selector: 'hl-results-view',
  imports: [LocalDateTimePipe, MatIconModule, BiasChart, VerdictMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './results-view.html',
  styleUrl: './results-view.scss',
})
export class ResultsView {
  readonly results = input.required<CalibrationResults>();

  protected readonly kappa = computed(() => kappaWords(this.results().fleissKappa, this.results().band));
  /** Whether the group's κ meets the session's threshold. */
  protected readonly kappaMet = computed(() => {
    const r = this.results();
    return r.fleissKappa !== null && r.fleissKappa >= r.thresholds.kappa;
  });
  /** Cohen's κ by pair, looked up by both user ids. */
  protected readonly pairOf = computed(() => {
    const map = new Map<string, PairAgreement>();
    for (const p of this.results().pairs) {
      map.set(`${p.a}:${p.b}`, p);
      map.set(`${p.b}:${p.a}`, p);
    }
    return (a: number, b: number) => map.get(`${a}:${b}`) ?? null;
  });
  protected readonly closed = computed(() => this.results().status === 'closed');
  protected readonly deltaEText = deltaEText;
  protected readonly number = formatNumber;
  protected readonly percent = percentText;
  protected readonly verdictFor = verdictFor;
  protected readonly biasWords = biasWords;
  protected readonly biasNumbers = biasNumbers;
  protected readonly bandLabels = KAPPA_BAND_LABELS;
  protected readonly methodLabels = SCREENING_METHOD_LABELS;

  /** The failed rules joined into one clause: "a; b and c". */
  protected failedText(rules: readonly FailedRule[]): string {
    const texts = rules.map((r) => r.text);
    return texts.length < 2 ? (texts[0] ?? '') : `${texts.slice(0, -1).join('; ')} and ${texts.at(-1)}`;
  }
}
