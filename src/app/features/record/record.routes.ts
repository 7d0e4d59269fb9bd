import { Routes } from '@angular/router';

/** The Record section: the reading form, the photo page it sends photo readings through, and the plant sheet (descriptor entry, under the same address, is its own feature); the parent route limits the roles. */
export const RECORD_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'New reading · Hueledger',
    loadComponent: () => import('./pages/reading-form').then((m) => m.ReadingForm),
  },
  {
    path: 'photo',
    title: 'Photo reading · Hueledger',
    loadComponent: () => import('./pages/photo-page').then((m) => m.PhotoPage),
  },
  {
    path: 'plant/:plantId',
    title: 'Plant sheet · Hueledger',
    loadComponent: () => import('./pages/plant-sheet').then((m) => m.PlantSheetPage),
  },
];
