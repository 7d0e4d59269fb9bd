import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The caution beside every swatch shown for judging by eye (docs/colour.md, judging colour by eye). */
@Component({
  selector: 'hl-screen-caution',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="hl-notice caution">
      <mat-icon aria-hidden="true">visibility</mat-icon>
      <span>Screen colours are approximate; judge against the physical chip in good light.</span>
    </p>
  `,
  styles: `
    .caution {
      font: var(--mat-sys-body-medium);
    }
  `,
})
export class ScreenCaution {}
