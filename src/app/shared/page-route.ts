import type { Route } from '@angular/router';

/** What `loadComponent` takes: a lazy import of the page's component. */
export type PageLoader = NonNullable<Route['loadComponent']>;

/**
 * A lazily loaded page at `path`, its browser-tab title "`title` · Hueledger". Every page route is
 * built here so that the product name is written once; `extra` adds guards, data or `pathMatch`.
 */
export function pageRoute(path: string, title: string, loadComponent: PageLoader, extra: Omit<Route, 'path' | 'title' | 'loadComponent'> = {}): Route {
  return { path, title: `${title} · Hueledger`, loadComponent, ...extra };
}
