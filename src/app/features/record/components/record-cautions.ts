import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The two cautions of the Record flow: raw tissue irritates; screens are approximate. */
@Component({
  selector: 'hl-record-cautions',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="hl-notice caution" role="note">
      <mat-icon aria-hidden="true">back_hand</mat-icon>
      <p>Raw corm, leaf and sap irritate skin, mouth and eyes: wear gloves, never taste raw tissue, wash hands and tools.</p>
    </div>
    <div class="hl-notice caution" role="note">
      <mat-icon aria-hidden="true">monitor</mat-icon>
      <p>Screen colours are approximate. Trust the numbers and chip codes; compare with the printed card in open shade.</p>
    </div>
  `,
  styles: `
    .caution {
      margin: 4px 0;
      font: var(--mat-sys-body-medium);
    }
  `,
})
export class RecordCautions {}
