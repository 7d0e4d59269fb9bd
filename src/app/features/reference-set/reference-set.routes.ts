import { Routes } from '@angular/router';

/** The reference-set section, open to every role: match a colour, browse the chips, see how far each printed card is from them. */
export const REFERENCE_SET_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'match' },
  {
    path: 'match',
    title: 'Match a colour · Hueledger',
    loadComponent: () => import('./pages/match-page').then((m) => m.MatchPage),
  },
  {
    path: 'browse',
    title: 'Browse chips · Hueledger',
    loadComponent: () => import('./pages/browse-page').then((m) => m.BrowsePage),
  },
  {
    path: 'prints',
    title: 'Printed cards · Hueledger',
    loadComponent: () => import('./pages/prints-page').then((m) => m.PrintsPage),
  },
  {
    path: 'prints/:id',
    title: 'Print batch · Hueledger',
    loadComponent: () => import('./pages/print-batch-page').then((m) => m.PrintBatchPage),
  },
];
