import { Routes } from '@angular/router';

/** The Record section: each way of taking a reading has its own page; the parent route limits the roles. */
export const RECORD_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'photo' },
  {
    path: 'photo',
    title: 'Photo reading · Hueledger',
    loadComponent: () => import('./pages/photo-page').then((m) => m.PhotoPage),
  },
  {
    path: 'descriptors',
    title: 'Descriptors · Hueledger',
    loadComponent: () => import('../descriptors/pages/descriptor-entry-page').then((m) => m.DescriptorEntryPage),
  },
];
