import { ChangeDetectionStrategy, Component, type OnInit, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSliderModule } from '@angular/material/slider';

import { ACCEPTABILITY_THRESHOLD_DE00 } from '../../../../../shared/colour/constants.js';
import { ScreenCaution } from '../../../shared/chips/screen-caution';
import { ChipCatalogue } from '../../../shared/chips/chip-catalogue';
import { formatNumber, normaliseCode } from '../../../shared/chips/chip-words';
import { CalibrationTabs } from '../components/calibration-tabs';
import { chipCentre, visionRows, type VisionCentre } from '../data/vision-rows';
import { VISION_LABELS } from '../data/vision-simulation';

/** How many neighbouring chips the preview shows (our own: one row fits a phone at two lines). */
const NEIGHBOURS = 6;
/** Below this ΔE00 a chip is the centre colour itself (rounding of stored CIELAB, our own). */
const SAME_COLOUR_DE00 = 0.01;
/** The chip shown when none is asked for: the first field chip. */
const DEFAULT_CODE = 'F-001';

/**
 * A chip (or a specimen's reference colour) and its nearest chips as seen with normal vision and
 * with simulated protanopia, deuteranopia and tritanopia (culori's filters), with what that means.
 */
@Component({
  selector: 'hl-vision-page',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressSpinnerModule, MatSliderModule, CalibrationTabs, ScreenCaution],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './vision-page.html',
  styleUrl: './vision-page.scss',
})
export class VisionPage implements OnInit {
  protected readonly catalogue = inject(ChipCatalogue);
  /** From the address (component input binding): a specimen's colour (`?lab=L,a,b&label=…`), else a chip code. */
  readonly lab = input<string>();
  readonly label = input<string>();
  readonly chip = input<string>();

  protected readonly specimen = signal<VisionCentre | null>(null);
  protected readonly code = signal(DEFAULT_CODE);
  protected readonly severity = signal(1);
  protected readonly codeProblem = signal<string | null>(null);
  protected readonly labels = VISION_LABELS;
  protected readonly threshold = ACCEPTABILITY_THRESHOLD_DE00;
  protected readonly number = formatNumber;

  protected readonly centre = computed<VisionCentre | null>(() => {
    const given = this.specimen();
    if (given) return given;
    const chip = this.catalogue.set()?.chip(this.code());
    return chip ? chipCentre(chip) : null;
  });
  protected readonly rows = computed(() => {
    const set = this.catalogue.set();
    const centre = this.centre();
    if (!set || !centre) return [];
    const neighbours = set.matcher
      .nearest(centre.lab, NEIGHBOURS + 1)
      // The centre itself (a chip, or a specimen whose reference is a chip) is not its own neighbour.
      .filter((m) => m.chip.code !== centre.label && m.deltaE > SAME_COLOUR_DE00)
      .map((m) => m.chip)
      .slice(0, NEIGHBOURS);
    return visionRows(centre, neighbours, this.severity());
  });

  constructor() {
    this.catalogue.load();
  }

  ngOnInit(): void {
    this.specimen.set(labCentre(this.lab() ?? null, this.label() ?? null));
    this.code.set(normaliseCode(this.chip() ?? '') ?? DEFAULT_CODE);
  }

  /** Shows a chip typed as on the card ("87", "F-087.014"). */
  protected showCode(text: string): void {
    const code = normaliseCode(text);
    const set = this.catalogue.set();
    if (!set) return;
    if (code && set.chip(code)) {
      this.codeProblem.set(null);
      this.specimen.set(null);
      this.code.set(code);
    } else this.codeProblem.set(code ? `There is no chip ${code} in set ${set.summary.id}.` : 'Type a code such as F-087 or F-087.014.');
  }

  /** A neighbour becomes the centre. */
  protected centreOn(code: string): void {
    this.specimen.set(null);
    this.code.set(code);
  }
}

function labCentre(text: string | null, label: string | null): VisionCentre | null {
  const parts = (text ?? '').split(',').map(Number);
  if (parts.length !== 3 || !parts.every(Number.isFinite)) return null;
  return { label: label?.trim().slice(0, 80) || 'the specimen', lab: { l: parts[0], a: parts[1], b: parts[2] } };
}
