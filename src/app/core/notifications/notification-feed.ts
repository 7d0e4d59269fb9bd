import { Injectable, computed, inject, signal } from '@angular/core';
import { NavigationEnd, Router } from '@angular/router';
import { EMPTY, Subscription, catchError, filter, merge, switchMap, timer } from 'rxjs';

import type { NotificationDto, NotificationList } from '../../../../shared/api/review-answers.js';
import { NotificationsApi } from './notifications-api';

/** How often the bell asks for new notices while the app is open. */
export const NOTIFICATION_POLL_MS = 60_000;

/**
 * The signed-in person's notices, kept fresh while the shell is shown: asked for at once, every
 * minute, and after each navigation. A failed poll keeps the last list (the bell is a hint, not a
 * reason to interrupt anybody with an error).
 */
@Injectable({ providedIn: 'root' })
export class NotificationFeed {
  private readonly api = inject(NotificationsApi);
  private readonly router = inject(Router);
  private readonly list = signal<NotificationList | null>(null);
  private polling: Subscription | null = null;

  /** The last list received, or null before the first. */
  readonly current = this.list.asReadonly();
  readonly unread = computed(() => this.list()?.unread ?? 0);
  readonly items = computed<NotificationDto[]>(() => this.list()?.items ?? []);

  /** Starts polling (once; later calls do nothing until `stop`). */
  start(): void {
    if (this.polling) return;
    const navigations = this.router.events.pipe(filter((e) => e instanceof NavigationEnd));
    this.polling = merge(timer(0, NOTIFICATION_POLL_MS), navigations)
      .pipe(switchMap(() => this.api.list().pipe(catchError(() => EMPTY))))
      .subscribe((list) => this.list.set(list));
  }

  /** Stops polling and forgets the list (signed out). */
  stop(): void {
    this.polling?.unsubscribe();
    this.polling = null;
    this.list.set(null);
  }

  /** Asks again now, e.g. after marking notices read. */
  refresh(): void {
    this.api
      .list()
      .pipe(catchError(() => EMPTY))
      .subscribe((list) => this.list.set(list));
  }

  /** Marks a notice read here at once, then on the server; a failure is put right by the next poll. */
  markRead(id: number): void {
    const list = this.list();
    const item = list?.items.find((n) => n.id === id);
    if (!list || !item || item.readAt) return;
    this.list.set({ items: list.items.map((n) => (n.id === id ? { ...n, readAt: new Date().toISOString() } : n)), unread: Math.max(0, list.unread - 1) });
    this.api
      .markRead(id)
      .pipe(catchError(() => EMPTY))
      .subscribe({ complete: () => this.refresh() });
  }
}
