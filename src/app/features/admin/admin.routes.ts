import { Routes } from '@angular/router';

/** The admin section; the parent route already limits it to admins. */
export const ADMIN_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'users' },
  {
    path: 'users',
    title: 'Users · Hueledger',
    loadComponent: () => import('./pages/users-page').then((m) => m.UsersPage),
  },
  {
    path: 'outbox',
    title: 'Outbox · Hueledger',
    loadComponent: () => import('./pages/outbox-page').then((m) => m.OutboxPage),
  },
  {
    path: 'api-tokens',
    title: 'BrAPI tokens · Hueledger',
    loadComponent: () => import('./pages/api-tokens-page').then((m) => m.ApiTokensPage),
  },
  {
    path: 'walk-order',
    title: 'Walk order · Hueledger',
    loadComponent: () => import('./pages/walk-order-page').then((m) => m.WalkOrderPage),
  },
  {
    path: 'audit',
    title: 'Audit · Hueledger',
    loadComponent: () => import('./pages/audit-page').then((m) => m.AuditPage),
  },
];
