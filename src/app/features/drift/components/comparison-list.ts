import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { DriftAnswer } from '../../../../../shared/api/analysis-answers.js';
import { deltaEText } from '../../../shared/chips/chip-words';
import { DRIFT_STATE_WORDS, driftState, groupLabel, kindWords, pValueText } from '../data/drift-words';

/** Each comparison between season groups: from → to, kind, ΔE00, p-value, the verdict as an icon and a word, and the server's reason. */
@Component({
  selector: 'hl-comparison-list',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <ul class="list">
      @for (c of rows(); track $index) {
        <li class="item" [class.drift]="c.state === 'drift'" [attr.data-state]="c.state">
          <div class="verdict">
            <mat-icon aria-hidden="true">{{ c.words.icon }}</mat-icon>
            <strong>{{ c.words.word }}</strong>
          </div>
          <div class="body">
            <p class="title"><strong>{{ c.from }}</strong> → <strong>{{ c.to }}</strong><span class="hl-muted">&nbsp;· {{ c.kind }}</span></p>
            <p class="numbers hl-number">ΔE00 <strong>{{ c.deltaE }}</strong> · <span class="nowrap">{{ c.p }}</span><span class="hl-muted">&nbsp;({{ c.test }})</span></p>
            <p class="reason">{{ c.reason }}</p>
          </div>
        </li>
      }
    </ul>
  `,
  styles: `
    .list {
      list-style: none;
      margin: 0;
      padding: 0;
      display: flex;
      flex-direction: column;
      gap: 8px;
    }
    .item {
      display: flex;
      gap: 16px;
      align-items: flex-start;
      padding: 12px 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
      background: var(--mat-sys-surface-container-lowest);
    }
    .item.drift {
      border: 2px solid var(--mat-sys-tertiary);
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .verdict {
      display: flex;
      flex-direction: column;
      align-items: center;
      min-width: 84px;
      text-align: center;
      gap: 2px;
    }
    .body p {
      margin: 0 0 4px;
    }
    .title {
      font: var(--mat-sys-title-medium);
    }
    .reason {
      font: var(--mat-sys-body-medium);
    }
    .nowrap {
      white-space: nowrap;
    }
  `,
})
export class ComparisonList {
  readonly answer = input.required<DriftAnswer>();

  protected readonly rows = computed(() => {
    const a = this.answer();
    return a.comparisons.map((c) => {
      const state = driftState(c, a);
      return {
        state,
        words: DRIFT_STATE_WORDS[state],
        from: groupLabel(c.from),
        to: groupLabel(c.to),
        kind: kindWords(c.kind),
        deltaE: deltaEText(c.deltaE00),
        p: pValueText(c.pValue),
        test: c.test === 'exact' ? `exact, ${c.permutations} arrangements` : c.test === 'sequential' ? `sequential, settled after ${c.permutations} random permutations` : `${c.permutations} random permutations`,
        reason: c.reason,
      };
    });
  });
}
