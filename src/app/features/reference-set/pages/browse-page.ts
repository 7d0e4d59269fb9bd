import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, input, signal, viewChild } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router, RouterLink } from '@angular/router';

import { AuthStore } from '../../../core/auth/auth-store';
import { Viewport } from '../../../core/layout/viewport';
import { ChipDetail } from '../components/chip-detail';
import { CurrentSetChooser } from '../components/current-set-chooser';
import { ScreenCaution } from '../../../shared/chips/screen-caution';
import { ReferenceSetTabs } from '../components/reference-set-tabs';
import { SwatchGrid } from '../../../shared/chips/swatch-grid';
import { ChipCatalogue } from '../../../shared/chips/chip-catalogue';
import { familyLabel, normaliseCode } from '../../../shared/chips/chip-words';
import { ReferenceSetApi } from '../../../shared/chips/reference-set-api';

/** A code typed out in full ("F-087", "F-087.014"): the search jumps to it without waiting for Enter. */
const FULL_CODE = /^\s*F-\d{3}(?:\.\d{3})?\s*$/i;

/** How many neighbours a chip's detail lists (our own). */
const NEIGHBOURS = 6;

/**
 * Browse the current set: field chips by hue sector (light to dark), a field chip's fine chips, one chip's detail,
 * search by code and the printable card. The chip shown is in the URL (`?chip=F-087.014`).
 */
@Component({
  selector: 'hl-browse-page',
  imports: [ChipDetail, CurrentSetChooser, DecimalPipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressSpinnerModule, ScreenCaution, ReferenceSetTabs, RouterLink, SwatchGrid],
  templateUrl: './browse-page.html',
  styleUrl: './browse-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BrowsePage {
  private readonly router = inject(Router);
  private readonly api = inject(ReferenceSetApi);
  private readonly handset = inject(Viewport).handset;
  private readonly chosenPane = viewChild<ElementRef<HTMLElement>>('chosenPane');

  /** The chip to show (query parameter, bound by the router). */
  readonly chip = input<string>();

  protected readonly catalogue = inject(ChipCatalogue);
  private readonly auth = inject(AuthStore);
  /** Whether the signed-in person may choose the current set. */
  protected readonly isAdmin = computed(() => this.auth.currentUser()?.role === 'admin');
  protected readonly searchProblem = signal<string | null>(null);
  protected readonly familyLabel = familyLabel;

  private readonly family = computed(() => {
    const code = this.chip();
    return code ? (this.catalogue.set()?.family(code) ?? null) : null;
  });
  protected readonly selected = computed(() => this.family()?.chip ?? null);
  /** The field chip whose fine chips are shown: the chosen chip or its parent. */
  protected readonly field = computed(() => this.family()?.field ?? null);
  protected readonly fines = computed(() => this.family()?.fines ?? []);
  protected readonly neighbours = computed(() => {
    const chip = this.selected();
    return chip ? (this.catalogue.set()?.neighbours(chip, NEIGHBOURS) ?? []) : [];
  });
  protected readonly missingCode = computed(() => {
    const code = this.chip();
    return code && this.catalogue.set() && !this.selected() ? code : null;
  });
  protected readonly cardUrl = computed(() => {
    const set = this.catalogue.set();
    return set ? this.api.cardUrl(set.summary.id) : null;
  });
  protected readonly bookletUrl = computed(() => {
    const set = this.catalogue.set();
    return set ? this.api.bookletUrl(set.summary.id) : null;
  });

  constructor() {
    this.catalogue.load();
  }

  /** Opens a chip: into the URL, and on a phone the chip's pane is scrolled into view. */
  protected open(code: string): void {
    this.searchProblem.set(null);
    void this.router.navigate([], { queryParams: { chip: code }, replaceUrl: false }).then(() => {
      if (this.handset()) this.chosenPane()?.nativeElement.scrollIntoView({ block: 'start' });
    });
  }

  /** While typing: a code written out in full opens at once. */
  protected searchAsTyped(text: string): void {
    this.searchProblem.set(null);
    if (FULL_CODE.test(text)) this.search(text, false);
  }

  /** Enter: the text read as a code ("87.14" is F-087.014) opens its chip, or says there is none. */
  protected search(text: string, fromEnter = true): void {
    const code = normaliseCode(text);
    const set = this.catalogue.set();
    if (!set) return;
    if (code && set.chip(code)) {
      this.open(code);
      return;
    }
    if (fromEnter || code) this.searchProblem.set(code ? `There is no chip ${code} in set ${set.summary.id}.` : 'Type a code such as F-087 or F-087.014.');
  }
}
