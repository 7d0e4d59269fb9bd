import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { Observable, catchError, map, of, tap } from 'rxjs';

/** The API's health answer: whether it is up and which version runs. */
@Injectable({ providedIn: 'root' })
export class ServerStatus {
  private readonly http = inject(HttpClient);
  private readonly serverVersion = signal<string | null>(null);

  /** The server's version, once checked; null while unknown or unreachable. */
  readonly version = this.serverVersion.asReadonly();

  /** Asks GET /api/health, which also hands out the XSRF cookie the first form post needs. */
  check(): Observable<boolean> {
    return this.http.get<{ status: string; version: string }>('/api/health').pipe(
      tap((answer) => this.serverVersion.set(answer.version)),
      map((answer) => answer.status === 'ok'),
      catchError(() => of(false)),
    );
  }
}
