import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSliderModule } from '@angular/material/slider';

import { displayHex } from '../../../../../shared/colour/display-hex.js';
import { labToLch, lchToLab } from '../../../../../shared/colour/lab.js';
import { parseHex } from '../../../../../shared/colour/parse.js';

type Channel = 'l' | 'c' | 'h';

/** The three sliders, with a step for the − and + buttons a gloved thumb can hit (our own steps). */
const SLIDERS: readonly { key: Channel; label: string; words: string; prefix: string; suffix: string; min: number; max: number; step: number }[] = [
  { key: 'h', label: 'Hue', words: 'hue in degrees', prefix: '', suffix: '°', min: 0, max: 359, step: 5 },
  { key: 'l', label: 'Lightness', words: 'lightness L*', prefix: 'L* ', suffix: '', min: 5, max: 98, step: 2 },
  { key: 'c', label: 'Strength', words: 'colour strength C*', prefix: 'C* ', suffix: '', min: 0, max: 90, step: 2 },
];

/** Where the sliders start: a mid purple, a typical petiole colour, rather than black. */
const START = { l: 40, c: 35, h: 330 };

/**
 * An on-screen swatch matched by eye against the tissue: hue, lightness and chroma sliders in
 * CIELAB LCh (or the device's own colour picker) yielding a display hex. Screens are approximate.
 */
@Component({
  selector: 'hl-swatch-picker',
  imports: [MatButtonModule, MatIconModule, MatSliderModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="preview hl-swatch-surround">
      <span class="swatch" [style.background-color]="hex()" role="img" [attr.aria-label]="'On-screen swatch ' + hex()"></span>
      <span class="hex hl-number">{{ hex() }}</span>
    </div>
    @for (s of sliders; track s.key) {
      <div class="slider">
        <span class="slider-label">{{ s.label }} <span class="hl-number">{{ s.prefix }}{{ valueOf(s.key).toFixed(0) }}{{ s.suffix }}</span></span>
        <div class="slider-row">
          <button mat-icon-button type="button" class="step" [attr.aria-label]="'Less ' + s.words" (click)="nudge(s.key, -s.step)"><mat-icon>remove</mat-icon></button>
          <mat-slider [min]="s.min" [max]="s.max" step="1">
            <input matSliderThumb [value]="valueOf(s.key)" (valueChange)="setChannel(s.key, $event)" [attr.aria-label]="s.words" />
          </mat-slider>
          <button mat-icon-button type="button" class="step" [attr.aria-label]="'More ' + s.words" (click)="nudge(s.key, s.step)"><mat-icon>add</mat-icon></button>
        </div>
      </div>
    }
    <label class="native">
      <mat-icon aria-hidden="true">colorize</mat-icon>
      <span>Or use this device's colour picker</span>
      <input type="color" [value]="hex()" (input)="pickNative($any($event.target).value)" aria-label="Device colour picker" />
    </label>
    @if (!inGamut()) {
      <p class="hl-muted">That strength is beyond what a screen shows; the swatch is the nearest the screen can show, and its hex is what is saved.</p>
    }
  `,
  styleUrl: './swatch-picker.scss',
})
export class SwatchPicker {
  /** A hex to start from (a correction's earlier swatch), if any. */
  readonly initial = input<string | null>(null);
  /** The display hex of the swatch as set now. */
  readonly hexChange = output<string>();

  protected readonly sliders = SLIDERS;
  protected readonly l = signal(START.l);
  protected readonly c = signal(START.c);
  protected readonly h = signal(START.h);
  private readonly shown = computed(() => displayHex(lchToLab({ l: this.l(), c: this.c(), h: this.h() })));
  protected readonly hex = computed(() => this.shown().hex);
  protected readonly inGamut = computed(() => this.shown().inGamut);

  constructor() {
    effect(() => {
      const start = this.initial();
      if (start) this.pickNative(start);
    });
    effect(() => this.hexChange.emit(this.hex()));
  }

  protected valueOf(key: Channel): number {
    return key === 'l' ? this.l() : key === 'c' ? this.c() : this.h();
  }

  /** A − or + step, kept in range (hue goes round the circle). */
  protected nudge(key: Channel, by: number): void {
    const s = SLIDERS.find((x) => x.key === key)!;
    const next = this.valueOf(key) + by;
    this.setChannel(key, key === 'h' ? (next + 360) % 360 : Math.min(s.max, Math.max(s.min, next)));
  }

  protected setChannel(key: Channel, value: number): void {
    ({ l: this.l, c: this.c, h: this.h })[key].set(value);
  }

  /** The device picker's colour moves the sliders to it. */
  protected pickNative(hex: string): void {
    const lab = parseHex(hex);
    if (!lab) return;
    const lch = labToLch(lab);
    this.l.set(lch.l);
    this.c.set(lch.c);
    this.h.set(lch.c < 0.5 ? this.h() : lch.h);
  }
}
