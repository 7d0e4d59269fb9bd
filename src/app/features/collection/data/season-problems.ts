import { type SchemeIssue, checkSeasonScheme } from '../../../../../shared/collection/season-scheme.js';
import type { SeasonDraft } from './season-form';

/** One thing wrong with a season scheme, in words, and whether it stops the save. */
export interface SchemeProblem {
  kind: 'overlap' | 'gap' | 'name';
  text: string;
  /** Whether the server will refuse the scheme for it (gaps are allowed, with a warning). */
  blocking: boolean;
}

/**
 * What is wrong with a scheme as typed, from the same shared check the server applies on save:
 * seasons sharing days, two seasons with one name (both refused), days no season covers (allowed;
 * readings on them get no season). Bad dates are left to the fields' own messages, and half-typed
 * rows are not judged until they hold real dates.
 */
export function schemeProblems(drafts: readonly SeasonDraft[]): SchemeProblem[] {
  if (drafts.length === 0) return [];
  const check = checkSeasonScheme(drafts);
  const blocking = check.errors.flatMap((issue) => problemOf(issue, true, drafts));
  return [...blocking, ...check.warnings.flatMap((issue) => problemOf(issue, false, drafts))];
}

function problemOf(issue: SchemeIssue, blocking: boolean, drafts: readonly SeasonDraft[]): SchemeProblem[] {
  switch (issue.kind) {
    case 'overlap':
      return [{ kind: 'overlap', text: `${sentence(issue.message)} — a day may belong to one season only.`, blocking }];
    case 'gap':
      return [{ kind: 'gap', text: `${sentence(issue.message)}; readings on those days get no season.`, blocking }];
    case 'name':
      // An empty name is shown on its own field; a repeated one needs both rows named.
      return drafts[issue.index]?.name.trim() ? [{ kind: 'name', text: `Season ${issue.index + 1} ${issue.message}.`, blocking }] : [];
    case 'date':
      return [];
  }
}

function sentence(message: string): string {
  return message.charAt(0).toUpperCase() + message.slice(1);
}
