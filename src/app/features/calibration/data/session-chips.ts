import { Injectable, inject } from '@angular/core';
import { Observable, map, shareReplay, switchMap } from 'rxjs';

import { ChipSet } from '../../../shared/chips/chip-catalogue';
import { ReferenceSetApi } from '../../../shared/chips/reference-set-api';

/** The chips of the set a session was run against (not always the current one), loaded once per set. */
@Injectable({ providedIn: 'root' })
export class SessionChips {
  private readonly api = inject(ReferenceSetApi);
  private readonly loaded = new Map<string, Observable<ChipSet>>();

  /** The set with this id, indexed for lookups. */
  set(setId: string): Observable<ChipSet> {
    let set = this.loaded.get(setId);
    if (!set) {
      set = this.api.sets().pipe(
        switchMap((sets) => {
          const summary = sets.find((s) => s.id === setId);
          if (!summary) throw new Error(`The reference set ${setId} is not on the server.`);
          return this.api.chips(setId).pipe(map((chips) => new ChipSet(summary, chips)));
        }),
        shareReplay({ bufferSize: 1, refCount: false }),
      );
      this.loaded.set(setId, set);
    }
    return set;
  }

  /** Forgets a failed load so the next call tries again. */
  forget(setId: string): void {
    this.loaded.delete(setId);
  }
}
