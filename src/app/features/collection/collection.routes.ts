import { Routes } from '@angular/router';

/** The Collection section: everyone reads; the pages show edit actions to admins only (the server checks again). */
export const COLLECTION_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Collection · Hueledger',
    loadComponent: () => import('./pages/collection-page').then((m) => m.CollectionPage),
  },
  {
    path: 'progress',
    title: 'Characterisation progress · Hueledger',
    loadComponent: () => import('./pages/progress-page').then((m) => m.ProgressPage),
  },
  {
    path: 'sites/:id',
    title: 'Site · Hueledger',
    loadComponent: () => import('./pages/site-page').then((m) => m.SitePage),
  },
  {
    path: 'accessions/:id/similar',
    title: 'Look-alike accessions · Hueledger',
    loadComponent: () => import('./pages/similar-page').then((m) => m.SimilarPage),
  },
  {
    path: 'accessions/:id',
    title: 'Accession · Hueledger',
    loadComponent: () => import('./pages/accession-page').then((m) => m.AccessionPage),
  },
];
