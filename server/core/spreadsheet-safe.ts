/**
 * Characters that make a spreadsheet treat a cell as a formula (OWASP, "CSV Injection"): `=`, `+`,
 * `-`, `@`, and tab or carriage return at the start.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

/** A plain decimal number written as text (a latitude "-17.5"), which no spreadsheet runs. */
const PLAIN_NUMBER = /^[-+]?\d+(\.\d+)?$/;

/**
 * A text cell made inert for spreadsheets: prefixed with an apostrophe when it would start a
 * formula, so a name typed as `=HYPERLINK(…)` opens as text. Numbers are left alone, also when
 * written as text (a latitude "-17.5"), and so is text that cannot start a formula.
 */
export function spreadsheetSafe<T>(value: T): T | string {
  return typeof value === 'string' && FORMULA_START.test(value) && !PLAIN_NUMBER.test(value) ? `'${value}` : value;
}

/** `spreadsheetSafe` over every value of a record. */
export function spreadsheetSafeRow<K extends string>(row: Record<K, unknown>): Record<K, unknown> {
  return Object.fromEntries(Object.entries(row).map(([k, v]) => [k, spreadsheetSafe(v)])) as Record<K, unknown>;
}
