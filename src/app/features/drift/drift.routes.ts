import { Routes } from '@angular/router';

/** The Drift section, open to every role: season groups of one accession and character, and the same across sites. */
export const DRIFT_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Drift · Hueledger',
    loadComponent: () => import('./pages/drift-page').then((m) => m.DriftPage),
  },
  {
    path: 'sites',
    title: 'Site comparison · Hueledger',
    loadComponent: () => import('./pages/sites-page').then((m) => m.SitesPage),
  },
];
