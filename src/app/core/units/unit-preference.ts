import { Injectable, signal } from '@angular/core';

import type { UnitSystem } from '../../../../shared/units/units.js';

export type { UnitSystem };

/** The systems offered, in the order the Account page lists them. */
export const UNIT_SYSTEMS: readonly UnitSystem[] = ['metric', 'imperial'];

/** The localStorage key; one per browser, not per account, since it follows the tape in the recorder's hand. */
export const UNIT_PREFERENCE_KEY = 'hueledger.units';

/**
 * The person's chosen units, kept in localStorage. Values are always stored in SI on the server;
 * everything that shows a length or mass reads `system()` and converts for display only.
 */
@Injectable({ providedIn: 'root' })
export class UnitPreference {
  private readonly chosen = signal<UnitSystem>(readStored());

  /** The current system ("metric" until someone chooses otherwise). */
  readonly system = this.chosen.asReadonly();

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
