import { Routes } from '@angular/router';

import { authGuard } from './core/auth/auth-guard';
import { homeGuard } from './core/auth/home-guard';
import { roleGuard } from './core/auth/role-guard';

/** Public pages first, then the signed-in shell; each section's roles match its entry in nav-items.ts. */
export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Hueledger',
    loadComponent: () => import('./features/sign-in/pages/sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: 'forgot-password',
    title: 'Forgot password · Hueledger',
    loadComponent: () => import('./features/sign-in/pages/forgot-password-page').then((m) => m.ForgotPasswordPage),
  },
  {
    path: 'reset-password/:token',
    title: 'New password · Hueledger',
    loadComponent: () => import('./features/sign-in/pages/reset-password-page').then((m) => m.ResetPasswordPage),
  },
  {
    path: 'invitation/:token',
    title: 'Invitation · Hueledger',
    loadComponent: () => import('./features/sign-in/pages/invitation-page').then((m) => m.InvitationPage),
  },
  {
    path: '',
    canActivate: [authGuard],
    loadComponent: () => import('./core/layout/shell').then((m) => m.Shell),
    children: [
      // Each role starts on its own section; the guard runs after authGuard, so the account is known.
      { path: '', pathMatch: 'full', canActivate: [homeGuard], children: [] },
      {
        // A plant's sheet to look at, open to every role (reviewers follow progress links here); Record's copy is the one to fill in.
        path: 'collection/plants/:plantId',
        title: 'Plant sheet · Hueledger',
        data: { readOnly: true },
        loadComponent: () => import('./features/record/pages/plant-sheet').then((m) => m.PlantSheetPage),
      },
      {
        path: 'collection',
        loadChildren: () => import('./features/collection/collection.routes').then((m) => m.COLLECTION_ROUTES),
      },
      {
        path: 'record/descriptors',
        title: 'Descriptors · Hueledger',
        canActivate: [roleGuard('recorder', 'admin', 'trainer')],
        loadComponent: () => import('./features/descriptors/pages/descriptor-entry-page').then((m) => m.DescriptorEntryPage),
      },
      {
        path: 'record',
        canActivate: [roleGuard('recorder', 'admin', 'trainer')],
        loadChildren: () => import('./features/record/record.routes').then((m) => m.RECORD_ROUTES),
      },
      {
        path: 'queue',
        title: 'Waiting to send · Hueledger',
        canActivate: [roleGuard('recorder', 'admin', 'trainer')],
        loadComponent: () => import('./features/queue/pages/queue-page').then((m) => m.QueuePage),
      },
      {
        path: 'readings',
        loadChildren: () => import('./features/readings/readings.routes').then((m) => m.READINGS_ROUTES),
      },
      {
        path: 'drift',
        loadChildren: () => import('./features/drift/drift.routes').then((m) => m.DRIFT_ROUTES),
      },
      {
        path: 'review',
        title: 'Review · Hueledger',
        canActivate: [roleGuard('reviewer', 'admin')],
        loadComponent: () => import('./features/review/pages/review-page').then((m) => m.ReviewPage),
      },
      {
        path: 'notifications',
        title: 'Notifications · Hueledger',
        loadComponent: () => import('./features/notifications/pages/notifications-page').then((m) => m.NotificationsPage),
      },
      {
        path: 'calibration',
        loadChildren: () => import('./features/calibration/calibration.routes').then((m) => m.CALIBRATION_ROUTES),
      },
      {
        path: 'reference-set',
        loadChildren: () => import('./features/reference-set/reference-set.routes').then((m) => m.REFERENCE_SET_ROUTES),
      },
      {
        path: 'account',
        title: 'Account · Hueledger',
        loadComponent: () => import('./features/account/pages/account-page').then((m) => m.AccountPage),
      },
      {
        path: 'admin',
        canActivate: [roleGuard('admin')],
        loadChildren: () => import('./features/admin/admin.routes').then((m) => m.ADMIN_ROUTES),
      },
      { path: '**', redirectTo: '' },
    ],
  },
];
