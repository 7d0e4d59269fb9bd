import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { Router, RouterLink } from '@angular/router';
import { filter } from 'rxjs';

import type { Accession, Character } from '../../../../../shared/api/collection-answers.js';
import type { Descriptor } from '../../../../../shared/api/descriptor-answers.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { DescriptorDialog, type DescriptorDialogData } from '../components/descriptor-dialog';
import { DescriptorList } from '../components/descriptor-list';
import { DescriptorsApi } from '../../../shared/descriptors/descriptors-api';
import { AccessionDialog, type AccessionDialogData } from '../components/accession-dialog';
import { AccessionList } from '../components/accession-list';
import { CharacterDialog } from '../components/character-dialog';
import { CharacterList } from '../components/character-list';
import { CollectionTab } from '../components/collection-tab';
import { LoadState } from '../../../shared/load-state';
import { ProgressSummary } from '../../../shared/collection/progress-summary';
import { SiteList } from '../components/site-list';
import { CollectionApi, PASSPORT_CSV_URL } from '../../../shared/collection/collection-api';

/** The tabs, in order, by the name used in `?tab=`. */
const TABS = ['accessions', 'sites', 'characters', 'descriptors'] as const;

/** The collection: accessions, sites and their seasons, characters, descriptors; admins also add and edit. */
@Component({
  selector: 'hl-collection-page',
  imports: [AccessionList, CharacterList, CollectionTab, DescriptorList, LoadState, MatButtonModule, MatIconModule, MatTabsModule, RouterLink, SiteList, ProgressSummary],
  templateUrl: './collection-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styles: `
    [tabAction] {
      min-height: 48px;
    }
  `,
})
export class CollectionPage {
  private readonly api = inject(CollectionApi);
  private readonly descriptorsApi = inject(DescriptorsApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly auth = inject(AuthStore);

  /** The open tab, from `?tab=` so the back link of a site lands on Sites. */
  readonly tab = input<string>();

  protected readonly isAdmin = computed(() => this.auth.role() === 'admin');
  protected readonly tabIndex = computed(() => Math.max(0, TABS.indexOf((this.tab() ?? 'accessions') as (typeof TABS)[number])));
  protected readonly passportCsvUrl = PASSPORT_CSV_URL;
  protected readonly accessions = rxResource({ stream: () => this.api.accessions() });
  protected readonly sites = rxResource({ stream: () => this.api.sites() });
  protected readonly characters = rxResource({ stream: () => this.api.characters() });
  protected readonly descriptors = rxResource({ stream: () => this.descriptorsApi.descriptors() });

  protected showTab(index: number): void {
    void this.router.navigate([], { queryParams: { tab: TABS[index] }, replaceUrl: true });
  }

  protected addAccession(): void {
    const data: AccessionDialogData = { accession: null, sites: this.sites.value() ?? [] };
    this.dialog
      .open<AccessionDialog, AccessionDialogData, Accession>(AccessionDialog, { data, width: '640px', maxWidth: '100vw' })
      .afterClosed()
      .pipe(filter((accession): accession is Accession => accession !== undefined))
      .subscribe((accession) => void this.router.navigate(['/collection/accessions', accession.id]));
  }

  protected editCharacter(character: Character | null): void {
    this.dialog
      .open<CharacterDialog, Character | null, Character>(CharacterDialog, { data: character, width: '560px', maxWidth: '100vw' })
      .afterClosed()
      .pipe(filter((saved): saved is Character => saved !== undefined))
      .subscribe((saved) => {
        this.characters.reload();
        this.snackBar.open(`Character “${saved.label}” saved.`, 'OK', { duration: 4000 });
      });
  }

  protected editDescriptor(descriptor: Descriptor | null): void {
    const data: DescriptorDialogData = { descriptor, catalogue: this.descriptors.value() ?? [] };
    this.dialog
      .open<DescriptorDialog, DescriptorDialogData, Descriptor>(DescriptorDialog, { data, width: '600px', maxWidth: '100vw' })
      .afterClosed()
      .pipe(filter((saved): saved is Descriptor => saved !== undefined))
      .subscribe((saved) => {
        this.descriptors.reload();
        this.snackBar.open(`Descriptor “${saved.label}” saved.`, 'OK', { duration: 4000 });
      });
  }
}
