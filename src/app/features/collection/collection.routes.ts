import { Routes } from '@angular/router';

import { pageRoute } from '../../shared/page-route';

/** The Collection section: everyone reads; the pages show edit actions to admins only (the server checks again). */
export const COLLECTION_ROUTES: Routes = [
  pageRoute('', 'Collection', () => import('./pages/collection-page').then((m) => m.CollectionPage), { pathMatch: 'full' }),
  pageRoute('progress', 'Characterisation progress', () => import('./pages/progress-page').then((m) => m.ProgressPage)),
  pageRoute('sites/:id', 'Site', () => import('./pages/site-page').then((m) => m.SitePage)),
  pageRoute('accessions/:id/similar', 'Look-alike accessions', () => import('./pages/similar-page').then((m) => m.SimilarPage)),
  pageRoute('accessions/:id', 'Accession', () => import('./pages/accession-page').then((m) => m.AccessionPage)),
];
