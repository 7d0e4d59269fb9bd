import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { filter } from 'rxjs';

import type { Accession, Plant } from '../../../../../shared/api/collection-answers.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { UnitPreference } from '../../../core/units/unit-preference';
import { PlantValues } from '../../../shared/descriptors/plant-values';
import { PlantProgressList } from '../components/plant-progress-list';
import { AccessionDialog, type AccessionDialogData } from '../components/accession-dialog';
import { Characterisation } from '../components/characterisation';
import { PlantDialog, type PlantDialogData } from '../components/plant-dialog';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { PASSPORT_LABELS, type PassportField, mcpdDateWords, plantAgeWords, sampleStatusWords } from '../../../shared/collection/passport-fields';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** Passport fields in the order the page lists them. */
const SHOWN: readonly PassportField[] = [
  'accessionNumber', 'name', 'otherNames', 'genus', 'species', 'speciesAuthor', 'cropName', 'originCountry',
  'collectingSite', 'collectingLatitude', 'collectingLongitude', 'collectingElevationM', 'acquisitionDate', 'sampleStatus', 'instituteCode', 'donorName', 'remarks',
];

/** One accession: passport with MCPD names, its plants with their age, and the latest descriptor values per plant. */
@Component({
  selector: 'hl-accession-page',
  imports: [LocalDateTimePipe, Characterisation, MatButtonModule, MatIconModule, MatProgressSpinnerModule, PlantProgressList, PlantValues, RouterLink],
  templateUrl: './accession-page.html',
  styleUrl: './accession-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccessionPage {
  private readonly api = inject(CollectionApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly auth = inject(AuthStore);

  /** The accession's id from the route. */
  readonly id = input.required<string>();

  protected readonly units = inject(UnitPreference).system;
  protected readonly isAdmin = computed(() => this.auth.role() === 'admin');
  protected readonly canRecord = computed(() => ['recorder', 'trainer', 'admin'].includes(this.auth.role() ?? ''));
  protected readonly accession = rxResource({ params: () => Number(this.id()), stream: ({ params }) => this.api.accession(params) });
  protected readonly sites = rxResource({ stream: () => this.api.sites(), defaultValue: [] });
  protected readonly reloads = signal(0);
  protected readonly passport = computed(() => {
    const a = this.accession.value();
    if (!a) return [];
    return SHOWN.map((field) => ({ field, ...PASSPORT_LABELS[field], value: factOf(a, field) }));
  });

  protected siteName(siteId: number): string {
    const site = this.sites.value().find((s) => s.id === siteId);
    return site ? `${site.code} · ${site.name}` : `site ${siteId}`;
  }

  protected plantAge(plantedOn: string): string {
    return plantAgeWords(plantedOn);
  }

  protected editPassport(accession: Accession): void {
    const data: AccessionDialogData = { accession, sites: this.sites.value() };
    this.dialog
      .open<AccessionDialog, AccessionDialogData, Accession>(AccessionDialog, { data, width: '640px', maxWidth: '100vw' })
      .afterClosed()
      .pipe(filter((saved): saved is Accession => saved !== undefined))
      .subscribe((saved) => {
        this.accession.set(saved);
        this.snackBar.open(`Passport of ${saved.accessionNumber} saved.`, 'OK', { duration: 4000 });
      });
  }

  protected editPlant(accession: Accession, plant: Plant | null): void {
    const data: PlantDialogData = { accession, plant, sites: this.sites.value() };
    this.dialog
      .open<PlantDialog, PlantDialogData, Plant>(PlantDialog, { data, width: '480px', maxWidth: '100vw' })
      .afterClosed()
      .pipe(filter((saved): saved is Plant => saved !== undefined))
      .subscribe((saved) => {
        this.accession.update((a) => a && { ...a, plants: replacePlant(a.plants, saved) });
        this.reloads.update((n) => n + 1);
        this.snackBar.open(`Plant ${saved.label} ${plant ? 'saved' : 'added'}.`, 'OK', { duration: 4000 });
      });
  }
}

/** A passport field as words for the page; null when it is not given. */
function factOf(accession: Accession, field: PassportField): string | null {
  switch (field) {
    case 'otherNames':
      return accession.otherNames.length ? accession.otherNames.join('; ') : null;
    case 'acquisitionDate':
      return accession.acquisitionDate ? `${mcpdDateWords(accession.acquisitionDate)} (${accession.acquisitionDate})` : null;
    case 'sampleStatus':
      return sampleStatusWords(accession.sampleStatus);
    default: {
      const value = accession[field];
      return value === null || value === '' ? null : String(value);
    }
  }
}

function replacePlant(plants: readonly Plant[], saved: Plant): Plant[] {
  return plants.some((p) => p.id === saved.id) ? plants.map((p) => (p.id === saved.id ? saved : p)) : [...plants, saved];
}
