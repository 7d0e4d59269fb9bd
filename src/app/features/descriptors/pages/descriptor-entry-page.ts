import { ChangeDetectionStrategy, Component, ElementRef, afterRenderEffect, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';

import { ApiError } from '../../../core/http/api-error';
import { UnitPreference, type UnitSystem } from '../../../core/units/unit-preference';
import { LoadState } from '../../../shared/load-state';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { plantAgeWords } from '../../../shared/collection/passport-fields';
import { DescriptorRow } from '../components/descriptor-row';
import { PlantValues } from '../../../shared/descriptors/plant-values';
import { type RowEntry, blankEntry, defaultUnit, observationOf, orderForEntry, ratioOf, ratioSource, switchUnit } from '../data/descriptor-entry';
import { DescriptorsApi } from '../../../shared/descriptors/descriptors-api';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';
import { ProblemNotice } from '../../../shared/problem-notice';

/**
 * The recorder's descriptor entry: choose accession and plant, then type each descriptor of the
 * catalogue in cm or in, kg or lb, a count or a category; ratios show live, computed from their
 * parts. Each value is saved as its own observation (the server stores SI and what was typed).
 */
@Component({
  selector: 'hl-descriptor-entry-page',
  imports: [ProblemNotice, LocalDateTimePipe, DescriptorRow, LoadState, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatSelectModule, PlantValues, RouterLink],
  templateUrl: './descriptor-entry-page.html',
  styleUrl: './descriptor-entry-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DescriptorEntryPage {
  private readonly api = inject(DescriptorsApi);
  private readonly collection = inject(CollectionApi);
  private readonly units = inject(UnitPreference);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);

  /** `?accession=` from a link on the accession page or the record form. */
  readonly accession = input<string>();
  /** `?plant=` likewise. */
  readonly plant = input<string>();
  /** `?sheet=` the plant whose sheet opened the page: saving goes back to it. */
  readonly sheet = input<string>();
  /** `?descriptor=` the row tapped on the sheet, brought into view. */
  readonly descriptor = input<string>();

  protected readonly system = this.units.system;
  protected readonly accessions = rxResource({ stream: () => this.collection.accessions() });
  protected readonly descriptors = rxResource({ stream: () => this.api.descriptors() });
  protected readonly accessionId = computed(() => idOf(this.accession()));
  protected readonly plantId = computed(() => idOf(this.plant()));
  protected readonly sheetPlantId = computed(() => idOf(this.sheet()));
  protected readonly focusId = computed(() => idOf(this.descriptor()));
  protected readonly chosenAccession = computed(() => this.accessions.value()?.find((a) => a.id === this.accessionId()) ?? null);
  protected readonly chosenPlant = computed(() => this.chosenAccession()?.plants.find((p) => p.id === this.plantId()) ?? null);
  /** Active descriptors, each ratio right after its parts. */
  protected readonly shown = computed(() => orderForEntry((this.descriptors.value() ?? []).filter((d) => d.active)));
  private readonly edited = signal<Record<number, RowEntry>>({});
  /** Every row's state: what was typed, or a blank row in the person's units. */
  protected readonly entries = computed(() => {
    const edited = this.edited();
    return Object.fromEntries(this.shown().map((d) => [d.id, edited[d.id] ?? blankEntry(d.kind, this.system())])) as Record<number, RowEntry>;
  });
  protected readonly ratios = computed(() => {
    const typed = new Map(this.shown().flatMap((d) => (this.entries()[d.id]?.typed ? [[d.code, this.entries()[d.id].typed!] as const] : [])));
    return new Map(this.shown().filter((d) => d.kind === 'ratio').map((d) => [d.id, ratioOf(d, typed)]));
  });
  protected readonly ratioSources = computed(() => {
    const all = this.descriptors.value() ?? [];
    return new Map(all.filter((d) => d.kind === 'ratio').map((d) => [d.id, ratioSource(d, all)]));
  });
  /** The observations the save button would send. */
  protected readonly ready = computed(() => {
    const accessionId = this.accessionId();
    if (accessionId === null) return [];
    return this.shown().flatMap((d) => observationOf(d, this.entries()[d.id], accessionId, this.plantId()));
  });
  protected readonly busy = signal(false);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private scrolledTo: number | null = null;
  protected readonly problem = signal<string | null>(null);
  protected readonly savedCount = signal(0);

  constructor() {
    this.units.loadFromServer();
    // The row tapped on the plant sheet comes into view once the catalogue is drawn.
    afterRenderEffect(() => {
      const id = this.focusId();
      if (id === null || id === this.scrolledTo || !this.shown().length) return;
      const row = this.host.nativeElement.querySelector<HTMLElement>(`#descriptor-${id}`);
      if (!row) return;
      this.scrolledTo = id;
      row.scrollIntoView?.({ block: 'center' });
      row.querySelector<HTMLElement>('input, mat-select, [role="radio"], button')?.focus?.();
    });
  }

  protected chooseSystem(system: UnitSystem): void {
    this.units.chooseAndKeep(system);
    // Rows follow the page's units; each row's own toggle can still differ afterwards.
    this.edited.update((rows) => {
      const next: Record<number, RowEntry> = {};
      for (const d of this.shown()) {
        const unit = defaultUnit(d.kind, system);
        const row = rows[d.id];
        if (row) next[d.id] = unit ? switchUnit(row, unit, d) : row;
      }
      return next;
    });
  }

  protected chooseAccession(id: number): void {
    this.edited.set({});
    void this.router.navigate([], { queryParams: { accession: id, plant: null }, queryParamsHandling: 'merge', replaceUrl: true });
  }

  protected choosePlant(id: number | null): void {
    void this.router.navigate([], { queryParams: { plant: id }, queryParamsHandling: 'merge', replaceUrl: true });
  }

  protected setEntry(descriptorId: number, entry: RowEntry): void {
    this.edited.update((rows) => ({ ...rows, [descriptorId]: entry }));
  }

  protected plantAge(plantedOn: string): string {
    return plantAgeWords(plantedOn);
  }

  protected saveValues(): void {
    const observations = this.ready();
    if (observations.length === 0) return;
    // Checked here as the server would, so a doomed value is never sent.
    const wrong = this.shown().filter((d) => this.entries()[d.id]?.invalid || this.entries()[d.id]?.problem);
    if (wrong.length) {
      this.problem.set(`Nothing was saved. Fix the marked ${wrong.length === 1 ? 'value' : 'values'} first: ${wrong.map((d) => d.label).join(', ')}.`);
      this.focusRow(wrong[0]!.id);
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    // All or nothing: one refused value leaves every value in the form and nothing on the server.
    this.api.recordAll(observations).subscribe({
      next: (saved) => this.showSaved(saved.length),
      error: (error: unknown) => this.showRefusal(error, observations.map((o) => o.descriptorId)),
    });
  }

  private showSaved(count: number): void {
    this.busy.set(false);
    this.edited.set({});
    this.savedCount.update((n) => n + 1);
    this.snackBar.open(`${count} ${count === 1 ? 'value' : 'values'} saved.`, 'OK', { duration: 4000 });
    const sheet = this.sheetPlantId();
    if (sheet !== null) void this.router.navigate(['/record/plant', sheet]);
  }

  private showRefusal(error: unknown, sent: number[]): void {
    this.busy.set(false);
    const why = error instanceof ApiError ? error.message : 'The server could not be reached.';
    const index = error instanceof ApiError ? refusedIndex(error) : null;
    const refused = index === null ? undefined : this.shown().find((d) => d.id === sent[index]);
    this.problem.set(`Nothing was saved. ${refused ? `${refused.label}: ` : ''}${why}`);
    if (refused) this.focusRow(refused.id);
  }

  private focusRow(id: number): void {
    const row = this.host.nativeElement.querySelector<HTMLElement>(`#descriptor-${id}`);
    row?.scrollIntoView?.({ block: 'center' });
    row?.querySelector<HTMLElement>('input')?.focus();
  }
}

/** Which value of a batch the server refused (`observations.3.value` → 3), if it says. */
function refusedIndex(error: ApiError): number | null {
  for (const e of error.fieldErrors ?? []) {
    const m = /^observations\.(\d+)\./.exec(e.field);
    if (m) return Number(m[1]);
  }
  return null;
}

function idOf(text: string | undefined): number | null {
  const id = Number(text);
  return Number.isInteger(id) && id > 0 ? id : null;
}
