import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { Verdict } from '../../../../shared/colour/verdict.js';
import { VERDICT_ICONS, VERDICT_MEANINGS } from './chip-words';

/** A ΔE00 verdict in plain words with an icon beside it (never colour alone). */
@Component({
  selector: 'hl-verdict-mark',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<mat-icon aria-hidden="true">{{ icon() }}</mat-icon><span [title]="meaning()">{{ verdict() }}</span>`,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      font-weight: 500;
    }
    mat-icon {
      font-size: 20px;
      width: 20px;
      height: 20px;
    }
  `,
})
export class VerdictMark {
  readonly verdict = input.required<Verdict>();

  protected readonly icon = computed(() => VERDICT_ICONS[this.verdict()]);
  protected readonly meaning = computed(() => VERDICT_MEANINGS[this.verdict()]);
}
