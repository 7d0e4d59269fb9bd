import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { catchError, debounce, map, of, switchMap, timer } from 'rxjs';

import { MATCH_K_DEFAULT, type MatchAnswer } from '../../../../../shared/api/reference-set-answers.js';
import { ApiError } from '../../../core/http/api-error';
import { BetweenBar } from '../../../shared/chips/between-bar';
import { ColourEntry } from '../components/colour-entry';
import { GamutMark } from '../components/gamut-mark';
import { MatchStrip } from '../../../shared/chips/match-strip';
import { ScreenCaution } from '../../../shared/chips/screen-caution';
import { ReferenceSetTabs } from '../components/reference-set-tabs';
import { ChipCatalogue } from '../../../shared/chips/chip-catalogue';
import { labText, lchText } from '../../../shared/chips/chip-words';
import type { ColourQuery } from '../../../shared/chips/colour-query';
import { ReferenceSetApi } from '../../../shared/chips/reference-set-api';

/** How long typing must pause before the server is asked (our own; the device answers at once). */
const SERVER_DELAY_MS = 300;

/** The server's answer to one query, or why there is none. */
type ServerResult = { key: string; answer: MatchAnswer } | { key: string; error: string };

/** What the page shows and where it came from. */
export interface ShownMatch {
  answer: MatchAnswer;
  /** `server`: the authoritative answer; `device`: computed here from the loaded chips while the server is asked. */
  source: 'server' | 'device';
}

/**
 * Match a colour: hex, an instrument's L*a*b*, or the screen picker. The nearest chips appear at
 * once from the chips loaded in the browser; the server's answer replaces them when it arrives.
 */
@Component({
  selector: 'hl-match-page',
  imports: [BetweenBar, ColourEntry, GamutMark, MatButtonModule, MatIconModule, MatProgressSpinnerModule, MatchStrip, ScreenCaution, ReferenceSetTabs],
  templateUrl: './match-page.html',
  styleUrl: './match-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MatchPage {
  private readonly api = inject(ReferenceSetApi);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly catalogue = inject(ChipCatalogue);
  protected readonly query = signal<ColourQuery | null>(null);
  private readonly server = signal<ServerResult | null>(null);

  /** The answer for the current query: the server's when it has come, else this device's. */
  protected readonly shown = computed<ShownMatch | null>(() => {
    const query = this.query();
    if (!query) return null;
    const server = this.server();
    if (server?.key === query.key && 'answer' in server) return { answer: server.answer, source: 'server' };
    const set = this.catalogue.set();
    return set ? { answer: set.match(query.lab, MATCH_K_DEFAULT), source: 'device' } : null;
  });
  /** Why the server gave no answer for the current query, if it failed. */
  protected readonly serverProblem = computed(() => {
    const server = this.server();
    return server && server.key === this.query()?.key && 'error' in server ? server.error : null;
  });
  /** The two chips the colour lies between, with their hexes. */
  protected readonly betweenChips = computed(() => {
    const answer = this.shown()?.answer;
    if (!answer?.between) return null;
    const hexOf = (code: string) => answer.matches.find((m) => m.code === code)?.hex ?? this.catalogue.set()?.chip(code)?.hex ?? '#777777';
    return { between: answer.between, fromHex: hexOf(answer.between.a), toHex: hexOf(answer.between.b) };
  });
  protected readonly labText = labText;
  protected readonly lchText = lchText;

  constructor() {
    this.catalogue.load();
    toObservable(this.query)
      .pipe(
        debounce((query) => timer(query?.now ? 0 : SERVER_DELAY_MS)),
        switchMap((query) => (query ? this.askServer(query) : of(null))),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe((result) => this.server.set(result));
  }

  protected useColour(query: ColourQuery | null): void {
    this.query.set(query);
  }

  private askServer(query: ColourQuery) {
    return this.api.match({ ...query.request, k: MATCH_K_DEFAULT }).pipe(
      map((answer): ServerResult => ({ key: query.key, answer })),
      catchError((error: unknown) => of<ServerResult>({ key: query.key, error: error instanceof ApiError ? error.message : 'The server could not be asked.' })),
    );
  }
}
