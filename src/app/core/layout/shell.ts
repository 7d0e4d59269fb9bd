import { ChangeDetectionStrategy, Component, computed, inject, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSidenav, MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';

import { AuthStore } from '../auth/auth-store';
import { RequestProgress } from '../http/request-progress';
import { ServerStatus } from '../http/server-status';
import { QueueIndicator } from '../offline/queue-indicator';
import { NotificationBell } from '../notifications/notification-bell';
import { navSectionsFor } from './nav-items';
import { Viewport } from './viewport';

/** The signed-in frame: toolbar, navigation by role, and the page outlet. */
@Component({
  selector: 'hl-shell',
  imports: [
    MatButtonModule,
    MatIconModule,
    MatListModule,
    MatMenuModule,
    MatProgressBarModule,
    MatSidenavModule,
    MatToolbarModule,
    NotificationBell,
    QueueIndicator,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly authStore = inject(AuthStore);
  private readonly router = inject(Router);
  private readonly sidenav = viewChild.required(MatSidenav);

  protected readonly user = this.authStore.currentUser;
  protected readonly progress = inject(RequestProgress);
  protected readonly version = inject(ServerStatus).version;
  protected readonly handset = inject(Viewport).handset;
  protected readonly sections = computed(() => navSectionsFor(this.authStore.role()));

  /** Closes the drawer after a choice on a phone, where it covers the page. */
  protected closeDrawerOnPhone(): void {
    if (this.handset()) void this.sidenav().close();
  }

  protected toggleDrawer(): void {
    void this.sidenav().toggle();
  }

  protected signOut(): void {
    this.authStore.signOut().subscribe(() => void this.router.navigate(['/sign-in']));
  }
}
