import { Injectable } from '@angular/core';

/** What the reading form remembers between readings and visits, so a recorder walking a row taps little. */
export interface RememberedChoices {
  accessionId: number | null;
  characterId: number | null;
  light: string | null;
  /** How the last reading was taken, so a walk round one plant keeps its method. */
  method?: string | null;
  /** The instrument's make or name, kept with the method. */
  instrument?: string | null;
  /** The illuminant/observer the instrument reports, kept with the instrument. */
  illuminant?: string | null;
}

/** The localStorage key (one per browser profile; the choices are not secret). */
export const READING_MEMORY_KEY = 'hueledger.reading-form';

const NOTHING: RememberedChoices = { accessionId: null, characterId: null, light: null, method: null, instrument: null, illuminant: null };

/**
 * Keeps the last accession, character and light in localStorage. Anything unreadable (private
 * mode, a full store, an old or hand-edited value) reads as nothing remembered rather than failing.
 */
@Injectable({ providedIn: 'root' })
export class ReadingMemory {
  /** The choices last saved, or nothing. */
  recall(): RememberedChoices {
    try {
      const raw = localStorage.getItem(READING_MEMORY_KEY);
      if (!raw) return NOTHING;
      const value = JSON.parse(raw) as Partial<Record<keyof RememberedChoices, unknown>>;
      return {
        accessionId: positiveInteger(value.accessionId),
        characterId: positiveInteger(value.characterId),
        light: typeof value.light === 'string' ? value.light : null,
        method: typeof value.method === 'string' ? value.method : null,
        instrument: typeof value.instrument === 'string' ? value.instrument : null,
        illuminant: typeof value.illuminant === 'string' ? value.illuminant : null,
      };
    } catch {
      return NOTHING;
    }
  }

  /** Remembers the choices of the reading just saved. */
  remember(choices: RememberedChoices): void {
    try {
      localStorage.setItem(READING_MEMORY_KEY, JSON.stringify(choices));
    } catch {
      // A full or refused store only costs the recorder a few taps next time.
    }
  }
}

function positiveInteger(value: unknown): number | null {
  return typeof value === 'number' && Number.isSafeInteger(value) && value > 0 ? value : null;
}

/** The sessionStorage key of a form left half-filled for the photo page (or a lost connection). */
export const READING_DRAFT_KEY = 'hueledger.reading-draft';

/**
 * The whole half-filled form, kept for this tab while the recorder goes to the photo page and
 * back; unreadable drafts read as none.
 */
@Injectable({ providedIn: 'root' })
export class ReadingDraftStore {
  /** Keeps the form's value. */
  keep(value: object): void {
    try {
      sessionStorage.setItem(READING_DRAFT_KEY, JSON.stringify(value));
    } catch {
      // Without storage the recorder re-enters a few fields; nothing is lost on the server.
    }
  }

  /** The kept value, or null. */
  read<T extends object>(): Partial<T> | null {
    try {
      const raw = sessionStorage.getItem(READING_DRAFT_KEY);
      const value: unknown = raw ? JSON.parse(raw) : null;
      return typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Partial<T>) : null;
    } catch {
      return null;
    }
  }

  /** Forgets the kept value (after a save). */
  drop(): void {
    try {
      sessionStorage.removeItem(READING_DRAFT_KEY);
    } catch {
      // Nothing to forget.
    }
  }
}
