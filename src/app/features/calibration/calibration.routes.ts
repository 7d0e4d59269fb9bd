import { Routes } from '@angular/router';

/** The Calibration section, open to every role: trainers run sessions, anyone signed in takes part. */
export const CALIBRATION_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Calibration · Hueledger',
    loadComponent: () => import('./pages/sessions-page').then((m) => m.SessionsPage),
  },
  {
    path: 'sessions/:id',
    title: 'Calibration session · Hueledger',
    loadComponent: () => import('./pages/session-page').then((m) => m.SessionPage),
  },
  {
    path: 'sessions/:id/take',
    title: 'Take part · Hueledger',
    loadComponent: () => import('./pages/take-page').then((m) => m.TakePage),
  },
  {
    path: 'records',
    title: 'Certificates and screening · Hueledger',
    loadComponent: () => import('./pages/records-page').then((m) => m.RecordsPage),
  },
  {
    path: 'practice',
    title: 'Practice · Hueledger',
    loadComponent: () => import('./pages/practice-page').then((m) => m.PracticePage),
  },
  {
    path: 'vision',
    title: 'Colour-vision preview · Hueledger',
    loadComponent: () => import('./pages/vision-page').then((m) => m.VisionPage),
  },
];
