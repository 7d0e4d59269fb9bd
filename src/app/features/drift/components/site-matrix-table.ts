import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { SiteComparisonAnswer } from '../../../../../shared/api/analysis-answers.js';
import { pValueText } from '../data/drift-words';
import { siteMatrix } from '../data/site-matrix';

/** The site-by-site ΔE00 matrix: numbers, and each cell at or above the threshold marked by an icon and a word as well as shading. */
@Component({
  selector: 'hl-site-matrix-table',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="scroll">
      <table>
        <caption>ΔE00 between site means (rows against columns). <mat-icon aria-hidden="true" class="inline">warning</mat-icon> "differs": at or above {{ answer().threshold }}, this character's threshold; <mat-icon aria-hidden="true" class="inline">check</mat-icon> "within": below it. The p-value of a permutation test is under each number.</caption>
        <thead>
          <tr>
            <th scope="col">Site</th>
            @for (s of answer().sites; track s.siteId) {
              <th scope="col" class="num">{{ s.siteCode }}</th>
            }
          </tr>
        </thead>
        <tbody>
          @for (row of rows(); track row.siteCode) {
            <tr>
              <th scope="row">{{ row.siteCode }}</th>
              @for (cell of row.cells; track $index) {
                <td class="num cell" [class.marked]="cell.marked" [class.self]="cell.self" [attr.aria-label]="cell.label">
                  <span class="value">{{ cell.text }}</span>
                  @if (!cell.self) {
                    <span class="mark"><mat-icon aria-hidden="true">{{ cell.icon }}</mat-icon>{{ cell.word }}</span>
                    <span class="p hl-muted">{{ p(cell.pValue) }}</span>
                  }
                </td>
              }
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styleUrl: './drift-table.scss',
  styles: `
    // A matrix reads best at its own width, not stretched across a wide screen.
    table {
      width: auto;
      min-width: 100%;
    }
    .scroll {
      display: inline-block;
      max-width: 100%;
    }
    .cell {
      vertical-align: top;
      min-width: 96px;
    }
    .cell .value {
      display: block;
      font-size: 18px;
      font-weight: 600;
    }
    .mark {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      font-size: 13px;
    }
    .mark mat-icon,
    mat-icon.inline {
      font-size: 18px;
      width: 18px;
      height: 18px;
      vertical-align: middle;
    }
    .p {
      display: block;
      font-size: 12px;
    }
    .cell.marked {
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .cell.marked .p {
      color: inherit;
    }
    .cell.self {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class SiteMatrixTable {
  readonly answer = input.required<SiteComparisonAnswer>();

  protected readonly rows = computed(() => siteMatrix(this.answer()));
  protected p(value: number): string {
    return pValueText(value);
  }
}
