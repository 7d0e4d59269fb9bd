import { ChangeDetectionStrategy, Component, computed, inject, input, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';

import type { ChipDto } from '../../../../../shared/api/reference-set-answers.js';
import { deltaE00 } from '../../../../../shared/colour/delta-e.js';
import { labFromTuple } from '../../../../../shared/colour/lab.js';
import { verdictFor, type Verdict } from '../../../../../shared/colour/verdict.js';
import { ScreenCaution } from '../../../shared/chips/screen-caution';
import { VerdictMark } from '../../../shared/chips/verdict-mark';
import { ChipCatalogue } from '../../../shared/chips/chip-catalogue';
import { deltaEText } from '../../../shared/chips/chip-words';
import { CalibrationTabs } from '../components/calibration-tabs';
import { ChipChooser } from '../components/chip-chooser';
import { newSeed, practiceTarget, type PracticeTarget } from '../data/practice-round';

/** One finished practice round. */
interface PracticeResult {
  target: PracticeTarget;
  pick: ChipDto;
  deltaE00: number;
  verdict: Verdict;
  /** The chip a perfect eye would have picked, and its ΔE00. */
  best: ChipDto;
  bestDeltaE00: number;
}

/**
 * Practice on screen: a random tissue colour (seeded per round, so a series can be replayed) to
 * match against the field and fine chips; ΔE00 and the verdict in words after each pick.
 */
@Component({
  selector: 'hl-practice-page',
  imports: [MatButtonModule, MatIconModule, MatProgressSpinnerModule, CalibrationTabs, ChipChooser, ScreenCaution, VerdictMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './practice-page.html',
  styleUrl: './practice-page.scss',
})
export class PracticePage {
  private readonly chooser = viewChild(ChipChooser);

  protected readonly catalogue = inject(ChipCatalogue);
  /** `?seed=` from the address (component input binding): replays a series. */
  readonly seed = input<string>();
  protected readonly series = computed(() => seriesFrom(this.seed() ?? null));
  protected readonly round = signal(1);
  protected readonly target = computed(() => practiceTarget(this.series() + this.round() - 1));
  protected readonly result = signal<PracticeResult | null>(null);
  protected readonly history = signal<PracticeResult[]>([]);
  protected readonly meanDeltaE00 = computed(() => {
    const done = this.history();
    return done.length ? done.reduce((sum, r) => sum + r.deltaE00, 0) / done.length : null;
  });
  protected readonly deltaEText = deltaEText;

  constructor() {
    this.catalogue.load();
  }

  /** Scores a confirmed pick against the target. */
  protected score(code: string): void {
    const set = this.catalogue.set();
    const pick = set?.chip(code);
    if (!set || !pick) return;
    const target = this.target();
    const distance = deltaE00(target.lab, labFromTuple(pick.lab));
    const [nearest] = set.matcher.nearest(target.lab, 1);
    const result: PracticeResult = { target, pick, deltaE00: distance, verdict: verdictFor(distance), best: nearest.chip, bestDeltaE00: nearest.deltaE };
    this.result.set(result);
    this.history.update((list) => [...list, result]);
  }

  protected nextRound(): void {
    this.result.set(null);
    this.round.update((r) => r + 1);
    this.chooser()?.reset();
  }
}

function seriesFrom(text: string | null): number {
  const seed = Number(text);
  return text !== null && Number.isSafeInteger(seed) && seed >= 0 ? seed : newSeed();
}
