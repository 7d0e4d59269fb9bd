import { Routes } from '@angular/router';

import { pageRoute } from '../../shared/page-route';

/** The Record section: the reading form, the photo page it sends photo readings through, and the plant sheet (descriptor entry, under the same address, is its own feature); the parent route limits the roles. */
export const RECORD_ROUTES: Routes = [
  pageRoute('', 'New reading', () => import('./pages/reading-form').then((m) => m.ReadingForm), { pathMatch: 'full' }),
  pageRoute('photo', 'Photo reading', () => import('./pages/photo-page').then((m) => m.PhotoPage)),
  pageRoute('plant/:plantId', 'Plant sheet', () => import('./pages/plant-sheet').then((m) => m.PlantSheetPage)),
];
