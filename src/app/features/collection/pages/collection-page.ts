import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatTabsModule } from '@angular/material/tabs';

import { AccessionList } from '../components/accession-list';
import { CharacterList } from '../components/character-list';
import { LoadState } from '../components/load-state';
import { SiteList } from '../components/site-list';
import { CollectionApi } from '../data/collection-api';

/** The collection, read-only: accessions, sites and their seasons, and the character catalogue. */
@Component({
  selector: 'hl-collection-page',
  imports: [AccessionList, CharacterList, LoadState, MatTabsModule, SiteList],
  templateUrl: './collection-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styles: `
    .tab {
      padding: 16px 0;
    }
  `,
})
export class CollectionPage {
  private readonly api = inject(CollectionApi);

  protected readonly accessions = rxResource({ stream: () => this.api.accessions() });
  protected readonly sites = rxResource({ stream: () => this.api.sites() });
  protected readonly characters = rxResource({ stream: () => this.api.characters() });
}
