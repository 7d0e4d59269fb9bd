import { Routes } from '@angular/router';

import { pageRoute } from '../../shared/page-route';

/** The reference-set section, open to every role: match a colour, browse the chips, see how far each printed card is from them. */
export const REFERENCE_SET_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'match' },
  pageRoute('match', 'Match a colour', () => import('./pages/match-page').then((m) => m.MatchPage)),
  pageRoute('browse', 'Browse chips', () => import('./pages/browse-page').then((m) => m.BrowsePage)),
  pageRoute('prints', 'Printed cards', () => import('./pages/prints-page').then((m) => m.PrintsPage)),
  pageRoute('prints/:id', 'Print batch', () => import('./pages/print-batch-page').then((m) => m.PrintBatchPage)),
];
