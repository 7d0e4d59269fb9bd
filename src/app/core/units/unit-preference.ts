import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';

import type { Preferences } from '../../../../shared/api/preferences.js';

import type { UnitSystem } from '../../../../shared/units/units.js';

export type { UnitSystem };

/** The systems offered, in the order the Account page lists them. */
export const UNIT_SYSTEMS: readonly UnitSystem[] = ['metric', 'imperial'];

/** The localStorage key: this browser's copy, so the choice holds out of range; the server keeps the person's own. */
export const UNIT_PREFERENCE_KEY = 'hueledger.units';

/**
 * The person's chosen units, kept in localStorage. Values are always stored in SI on the server;
 * everything that shows a length or mass reads `system()` and converts for display only.
 */
@Injectable({ providedIn: 'root' })
export class UnitPreference {
  /** Optional, so code that only reads the choice needs no HTTP. */
  private readonly http = inject(HttpClient, { optional: true });
  private readonly chosen = signal<UnitSystem>(readStored());

  /** The current system ("metric" until someone chooses otherwise). */
  readonly system = this.chosen.asReadonly();

  /** Takes the person's units from the server (the same on every device they sign in on); a failure keeps this browser's. */
  loadFromServer(): void {
    this.http?.get<Preferences>('/api/account/preferences').subscribe({
      next: (p) => this.choose(p.unitSystem),
      error: () => undefined,
    });
  }

  /** Chooses a system here and keeps it on the server for the person's other devices. */
  chooseAndKeep(system: UnitSystem): void {
    this.choose(system);
    this.http?.put<Preferences>('/api/account/preferences', { unitSystem: system } satisfies Preferences).subscribe({ error: () => undefined });
  }

  /** Chooses a system and remembers it in this browser. */
  choose(system: UnitSystem): void {
    this.chosen.set(system);
    try {
      localStorage.setItem(UNIT_PREFERENCE_KEY, system);
    } catch {
      // Private windows may refuse storage: the choice still holds for this visit.
    }
  }
}

function readStored(): UnitSystem {
  try {
    const value = localStorage.getItem(UNIT_PREFERENCE_KEY);
    return value === 'imperial' ? 'imperial' : 'metric';
  } catch {
    return 'metric';
  }
}
