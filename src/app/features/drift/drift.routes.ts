import { Routes } from '@angular/router';

import { pageRoute } from '../../shared/page-route';

/** The Drift section, open to every role: season groups of one accession and character, and the same across sites. */
export const DRIFT_ROUTES: Routes = [
  pageRoute('', 'Drift', () => import('./pages/drift-page').then((m) => m.DriftPage), { pathMatch: 'full' }),
  pageRoute('sites', 'Site comparison', () => import('./pages/sites-page').then((m) => m.SitesPage)),
];
