/**
 * The one CSV writer of the project: papaparse's `unparse` (RFC 4180: CRLF line ends, fields
 * quoted when they hold a comma, quote or line break) with one formula-neutralising rule. Every
 * export (results, import template and error report, comparison) writes through `toCsv`.
 * Pure: no I/O.
 */
import Papa from 'papaparse';

/**
 * Text a spreadsheet would evaluate as a formula: starting with = + - @ or their full-width
 * forms (＝ ＋ － ＠, which spreadsheets fold to the ASCII ones), possibly after white space, or
 * starting with a tab, carriage return or line feed (OWASP, "CSV Injection").
 */
export const FORMULA_START = /^(?:\s*[=+\-@\uFF1D\uFF0B\uFF0D\uFF20]|[\t\r\n])/u;

/** Prefixes text that a spreadsheet would run as a formula with an apostrophe; other text unchanged. */
export function neutraliseFormula(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** A cell value for a CSV file: numbers as written (never prefixed), booleans as yes/no, text neutralised. */
export type CsvValue = string | number | boolean | null | undefined;

function cellValue(value: CsvValue): string | number {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? value : '';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return value;
}

/**
 * Rows (the first one the header) → CSV text, every text cell neutralised; CRLF line ends and a
 * final one by default (RFC 4180), LF for a file people open and extend in a text editor (the
 * import template).
 */
export function toCsv(rows: readonly (readonly CsvValue[])[], eol: '\r\n' | '\n' = '\r\n'): string {
  if (!rows.length) return '';
  return `${Papa.unparse(rows.map((r) => r.map(cellValue)), { newline: eol, escapeFormulae: FORMULA_START, quotes: false, header: false })}${eol}`;
}
