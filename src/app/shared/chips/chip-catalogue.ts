import { Injectable, computed, inject, signal } from '@angular/core';
import { map, switchMap } from 'rxjs';

import { matchAnswer } from '../../../../shared/api/match-answer.js';
import type { ChipDto, MatchAnswer, ReferenceSetSummary } from '../../../../shared/api/reference-set-answers.js';
import { pickerOrder } from '../../../../shared/colour/chip-name.js';
import { fieldChipsBySector, type HueSectorGroup } from '../../../../shared/colour/field-groups.js';
import { labFromTuple, type Lab } from '../../../../shared/colour/lab.js';
import { createMatcher, type Matcher } from '../../../../shared/colour/matcher.js';
import type { ChipMatch } from '../../../../shared/colour/nearest.js';
import { ReferenceSetApi } from './reference-set-api';

/** A chip seen with its kin, as the pickers offer them: the fine chips of its field chip. */
export interface ChipFamily {
  chip: ChipDto;
  /** The field chip: the chip itself, or its parent; null if the parent is missing from the set. */
  field: ChipDto | null;
  fines: readonly ChipDto[];
}

/** The current reference set held in the browser, indexed for lookups and instant matching. */
export class ChipSet {
  readonly matcher: Matcher<ChipDto>;
  readonly fieldGroups: HueSectorGroup<ChipDto>[];
  private readonly byCode = new Map<string, ChipDto>();
  private readonly finesByParent = new Map<string, ChipDto[]>();

  constructor(
    readonly summary: ReferenceSetSummary,
    readonly chips: readonly ChipDto[],
  ) {
    this.matcher = createMatcher(chips);
    this.fieldGroups = fieldChipsBySector(chips);
    for (const chip of chips) {
      this.byCode.set(chip.code, chip);
      if (chip.parent !== null) {
        const fines = this.finesByParent.get(chip.parent) ?? [];
        fines.push(chip);
        this.finesByParent.set(chip.parent, fines);
      }
    }
    for (const fines of this.finesByParent.values()) fines.sort((p, q) => pickerOrder(p.lab, q.lab));
  }

  /** The chip with this exact code. */
  chip(code: string): ChipDto | undefined {
    return this.byCode.get(code);
  }

  /** The fine chips that refine a field chip, in picker order: by sector, light to dark, strongest to greyest. */
  finesOf(fieldCode: string): readonly ChipDto[] {
    return this.finesByParent.get(fieldCode) ?? [];
  }

  /** The chip with this code, the field chip it belongs to (itself or its parent) and that field chip's fine chips; null for an unknown code. */
  family(code: string): ChipFamily | null {
    const chip = this.chip(code);
    if (!chip) return null;
    const field = chip.parent === null ? chip : this.chip(chip.parent);
    return { chip, field: field ?? null, fines: field ? this.finesOf(field.code) : [] };
  }

  /** The `count` chips nearest a chip by ΔE00, itself left out. */
  neighbours(chip: ChipDto, count: number): ChipMatch<ChipDto>[] {
    return this.matcher
      .nearest(labFromTuple(chip.lab), count + 1)
      .filter((m) => m.chip.code !== chip.code)
      .slice(0, count);
  }

  /** The match answer computed here, in the server's shape, for feedback before the server's arrives. */
  match(lab: Lab, k: number): MatchAnswer {
    return matchAnswer(this.matcher, this.summary.id, lab, k);
  }
}

/** Whether the chips are there yet. */
export type CatalogueStatus = 'idle' | 'loading' | 'ready' | 'failed';

/**
 * Loads the current set's chips once per session (the one cacheable chips answer) and keeps them
 * indexed, so both reference-set pages browse and match without asking again.
 */
@Injectable({ providedIn: 'root' })
export class ChipCatalogue {
  private readonly api = inject(ReferenceSetApi);
  private readonly loaded = signal<ChipSet | null>(null);
  private readonly state = signal<CatalogueStatus>('idle');

  /** The current set with its chips, once loaded. */
  readonly set = this.loaded.asReadonly();
  readonly status = this.state.asReadonly();
  /** Whether loading failed (the page offers to try again). */
  readonly failed = computed(() => this.state() === 'failed');

  /** Forgets the loaded set and loads the current one again (after an admin chose another). */
  reload(): void {
    if (this.state() === 'loading') return;
    this.state.set('idle');
    this.load();
  }

  /** Starts loading unless the chips are loaded or on their way. */
  load(): void {
    if (this.state() === 'loading' || this.state() === 'ready') return;
    this.state.set('loading');
    this.api
      .sets()
      .pipe(
        switchMap((sets) => {
          const current = sets.find((s) => s.current) ?? sets[0];
          if (!current) throw new Error('No reference set is loaded on the server.');
          return this.api.chips(current.id).pipe(map((chips) => new ChipSet(current, chips)));
        }),
      )
      .subscribe({
        next: (set) => {
          this.loaded.set(set);
          this.state.set('ready');
        },
        error: () => this.state.set('failed'),
      });
  }
}
