import assert from 'node:assert/strict';
import type { Response } from 'supertest';
import type { Problem } from '../../shared/api/auth.js';

/** What a stack trace or a source location leaves in a text: "    at fn (file.ts:12:5)", "file://…", "node_modules". */
const LEAK_PATTERNS: readonly RegExp[] = [/^\s*at\s/m, /\bat (?:async )?\S+ \(/, /[\w-]+\.(?:[cm]?js|ts):\d+/, /file:\/\//, /node_modules/];

/** Whether a text carries a stack trace or a source location. */
export function leaksInternals(text: string): boolean {
  return LEAK_PATTERNS.some((p) => p.test(text));
}

/** Fails when an answer carries a stack trace, a source location or a `stack` member. */
export function assertNoLeak(res: Response): void {
  assert.ok(!leaksInternals(res.text ?? ''), `the answer leaks internals:\n${res.text}`);
  if (res.body && typeof res.body === 'object') assert.ok(!('stack' in res.body), 'the answer has a stack member');
}

/** Asserts an RFC 9457 problem+json answer of the status, without internals; returns the problem. */
export function assertProblem(res: Response, status: number): Problem {
  assert.equal(res.status, status, `expected ${status}, got ${res.status}: ${res.text}`);
  assert.match(String(res.headers['content-type']), /^application\/problem\+json\b/);
  const problem = res.body as Problem;
  assert.equal(problem.status, status);
  assert.equal(typeof problem.type, 'string');
  assert.ok(problem.title, 'the problem has a title');
  assertNoLeak(res);
  return problem;
}

/** Asserts a 400 validation problem that names each of the fields; returns every field it names. */
export function assertInvalidFields(res: Response, ...fields: string[]): string[] {
  const problem = assertProblem(res, 400);
  assert.ok(Array.isArray(problem.errors), `a validation problem lists its errors: ${res.text}`);
  const named = problem.errors.map((e) => e.field);
  for (const field of fields) assert.ok(named.includes(field), `errors name ${field}; they name ${named.join(', ')}`);
  return named;
}

/**
 * Asserts BrAPI's error answer (BrAPI v2.1 `400BadRequest`, `401Unauthorized`, `403Forbidden`,
 * `404NotFound`: a JSON string "ERROR - <timestamp> - <message>"), without internals; returns the message.
 */
export function assertBrapiError(res: Response, status: number): string {
  assert.equal(res.status, status, `expected ${status}, got ${res.status}: ${res.text}`);
  assert.match(String(res.headers['content-type']), /^application\/json\b/);
  assert.equal(typeof res.body, 'string', `a JSON string: ${res.text}`);
  const match = /^ERROR - (\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}Z) - (.+)$/s.exec(res.body as string);
  assert.ok(match, `the BrAPI error form "ERROR - <timestamp> - <message>": ${res.text}`);
  assert.ok(!Number.isNaN(Date.parse(match[1]!)));
  assertNoLeak(res);
  return match[2]!;
}
