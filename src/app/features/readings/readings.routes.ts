import { Routes } from '@angular/router';

/** The Readings section: the table, and one reading's provenance and history. Every signed-in role may open both. */
export const READINGS_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Readings · Hueledger',
    loadComponent: () => import('./pages/readings-page').then((m) => m.ReadingsPage),
  },
  {
    path: ':id',
    title: 'Reading · Hueledger',
    loadComponent: () => import('./pages/reading-detail').then((m) => m.ReadingDetailPage),
  },
];
