import { Routes } from '@angular/router';

import { pageRoute } from '../../shared/page-route';

/** The Calibration section, open to every role: trainers run sessions, anyone signed in takes part. */
export const CALIBRATION_ROUTES: Routes = [
  pageRoute('', 'Calibration', () => import('./pages/sessions-page').then((m) => m.SessionsPage), { pathMatch: 'full' }),
  pageRoute('sessions/:id', 'Calibration session', () => import('./pages/session-page').then((m) => m.SessionPage)),
  pageRoute('sessions/:id/take', 'Take part', () => import('./pages/take-page').then((m) => m.TakePage)),
  pageRoute('records', 'Certificates and screening', () => import('./pages/records-page').then((m) => m.RecordsPage)),
  pageRoute('practice', 'Practice', () => import('./pages/practice-page').then((m) => m.PracticePage)),
  pageRoute('vision', 'Colour-vision preview', () => import('./pages/vision-page').then((m) => m.VisionPage)),
];
