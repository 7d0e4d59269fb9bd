import { Routes } from '@angular/router';

import { authGuard } from './core/auth/auth-guard';
import { homeGuard } from './core/auth/home-guard';
import { roleGuard } from './core/auth/role-guard';
import { pageRoute } from './shared/page-route';

/** Public pages first, then the signed-in shell; each section's roles match its entry in nav-items.ts. */
export const routes: Routes = [
  pageRoute('sign-in', 'Sign in', () => import('./features/sign-in/pages/sign-in-page').then((m) => m.SignInPage)),
  pageRoute('forgot-password', 'Forgot password', () => import('./features/sign-in/pages/forgot-password-page').then((m) => m.ForgotPasswordPage)),
  pageRoute('reset-password/:token', 'New password', () => import('./features/sign-in/pages/reset-password-page').then((m) => m.ResetPasswordPage)),
  pageRoute('invitation/:token', 'Invitation', () => import('./features/sign-in/pages/invitation-page').then((m) => m.InvitationPage)),
  {
    path: '',
    canActivate: [authGuard],
    loadComponent: () => import('./core/layout/shell').then((m) => m.Shell),
    children: [
      // Each role starts on its own section; the guard runs after authGuard, so the account is known.
      { path: '', pathMatch: 'full', canActivate: [homeGuard], children: [] },
      // A plant's sheet to look at, open to every role (reviewers follow progress links here); Record's copy is the one to fill in.
      pageRoute('collection/plants/:plantId', 'Plant sheet', () => import('./features/record/pages/plant-sheet').then((m) => m.PlantSheetPage), { data: { readOnly: true } }),
      {
        path: 'collection',
        loadChildren: () => import('./features/collection/collection.routes').then((m) => m.COLLECTION_ROUTES),
      },
      pageRoute('record/descriptors', 'Descriptors', () => import('./features/descriptors/pages/descriptor-entry-page').then((m) => m.DescriptorEntryPage), { canActivate: [roleGuard('recorder', 'admin', 'trainer')] }),
      {
        path: 'record',
        canActivate: [roleGuard('recorder', 'admin', 'trainer')],
        loadChildren: () => import('./features/record/record.routes').then((m) => m.RECORD_ROUTES),
      },
      pageRoute('queue', 'Waiting to send', () => import('./features/queue/pages/queue-page').then((m) => m.QueuePage), { canActivate: [roleGuard('recorder', 'admin', 'trainer')] }),
      {
        path: 'readings',
        loadChildren: () => import('./features/readings/readings.routes').then((m) => m.READINGS_ROUTES),
      },
      {
        path: 'drift',
        loadChildren: () => import('./features/drift/drift.routes').then((m) => m.DRIFT_ROUTES),
      },
      pageRoute('review', 'Review', () => import('./features/review/pages/review-page').then((m) => m.ReviewPage), { canActivate: [roleGuard('reviewer', 'admin')] }),
      pageRoute('notifications', 'Notifications', () => import('./features/notifications/pages/notifications-page').then((m) => m.NotificationsPage)),
      {
        path: 'calibration',
        loadChildren: () => import('./features/calibration/calibration.routes').then((m) => m.CALIBRATION_ROUTES),
      },
      {
        path: 'reference-set',
        loadChildren: () => import('./features/reference-set/reference-set.routes').then((m) => m.REFERENCE_SET_ROUTES),
      },
      pageRoute('account', 'Account', () => import('./features/account/pages/account-page').then((m) => m.AccountPage)),
      {
        path: 'admin',
        canActivate: [roleGuard('admin')],
        loadChildren: () => import('./features/admin/admin.routes').then((m) => m.ADMIN_ROUTES),
      },
      { path: '**', redirectTo: '' },
    ],
  },
];
