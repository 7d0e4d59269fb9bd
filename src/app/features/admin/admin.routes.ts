import { Routes } from '@angular/router';

import { pageRoute } from '../../shared/page-route';

/** The admin section; the parent route already limits it to admins. */
export const ADMIN_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'users' },
  pageRoute('users', 'Users', () => import('./pages/users-page').then((m) => m.UsersPage)),
  pageRoute('outbox', 'Outbox', () => import('./pages/outbox-page').then((m) => m.OutboxPage)),
  pageRoute('api-tokens', 'BrAPI tokens', () => import('./pages/api-tokens-page').then((m) => m.ApiTokensPage)),
  pageRoute('walk-order', 'Walk order', () => import('./pages/walk-order-page').then((m) => m.WalkOrderPage)),
  pageRoute('audit', 'Audit', () => import('./pages/audit-page').then((m) => m.AuditPage)),
];
