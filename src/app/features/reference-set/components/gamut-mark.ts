import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** Whether a colour lies inside sRGB, as an icon and words (a screen can only show a stand-in otherwise). */
@Component({
  selector: 'hl-gamut-mark',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (inGamut()) {
      <mat-icon aria-hidden="true">check_circle</mat-icon><span>inside sRGB</span>
    } @else {
      <mat-icon aria-hidden="true">warning</mat-icon><span>outside sRGB: the screen shows the nearest it can</span>
    }
  `,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
    }
    mat-icon {
      font-size: 20px;
      width: 20px;
      height: 20px;
    }
  `,
})
export class GamutMark {
  /** Whether the colour lies inside the sRGB gamut. */
  readonly inGamut = input.required<boolean>();
}
