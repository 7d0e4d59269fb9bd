import { Routes } from '@angular/router';

import { pageRoute } from '../../shared/page-route';

/** The Readings section: the table, and one reading's provenance and history. Every signed-in role may open both. */
export const READINGS_ROUTES: Routes = [
  pageRoute('', 'Readings', () => import('./pages/readings-page').then((m) => m.ReadingsPage), { pathMatch: 'full' }),
  pageRoute(':id', 'Reading', () => import('./pages/reading-detail').then((m) => m.ReadingDetailPage)),
];
