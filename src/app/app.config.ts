import { provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { ApplicationConfig, ErrorHandler, inject, isDevMode, provideAppInitializer, provideBrowserGlobalErrorListeners } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { provideServiceWorker } from '@angular/service-worker';
import { catchError, forkJoin, of } from 'rxjs';

import { routes } from './app.routes';
import { AuthStore } from './core/auth/auth-store';
import { AppErrorHandler } from './core/http/app-error-handler';
import { errorInterceptor } from './core/http/error-interceptor';
import { progressInterceptor } from './core/http/progress-interceptor';
import { ServerStatus } from './core/http/server-status';
import { OfflineQueue } from './core/offline/offline-queue';
import { offlineSessionInterceptor } from './core/offline/offline-session';

/** Icons come from the self-hosted Material Symbols font, set up before the first icon renders. */
function useSymbolIcons(): void {
  inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
}

/** Learns who is signed in (and collects the XSRF cookie) before the first route is chosen. */
function loadSession() {
  return forkJoin([inject(ServerStatus).check(), inject(AuthStore).load().pipe(catchError(() => of(null)))]);
}

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideRouter(routes, withComponentInputBinding()),
    provideHttpClient(
      // offlineSessionInterceptor last, nearest the network: it sees raw failures before they become ApiErrors.
      withInterceptors([progressInterceptor, errorInterceptor, offlineSessionInterceptor]),
      withXsrfConfiguration({ cookieName: 'XSRF-TOKEN', headerName: 'X-XSRF-TOKEN' }),
    ),
    { provide: ErrorHandler, useClass: AppErrorHandler },
    provideAppInitializer(useSymbolIcons),
    provideAppInitializer(loadSession),
    provideAppInitializer(() => inject(OfflineQueue).start()),
    // The app shell, fonts, icons and every screen are cached for use out of range (ngsw-config.json).
    provideServiceWorker('ngsw-worker.js', { enabled: !isDevMode(), registrationStrategy: 'registerWhenStable:30000' }),
  ],
};
