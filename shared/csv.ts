/**
 * The one CSV writer of the product, used by the server (kicks export) and the client (Squad week,
 * the roster template): csv-stringify, RFC 4180 (CRLF line ends; fields with commas, quotes or line
 * breaks quoted, quotes doubled).
 *
 * Formula injection (OWASP "CSV Injection"): a spreadsheet runs a cell that begins with `=`, `+`, `-`,
 * `@`, a tab or a carriage return (and their full-width forms) as a formula, so such text cells get a
 * leading `'` (csv-stringify's `escape_formulas`), which spreadsheets show as text. Numbers are written
 * as numbers: a negative lateral stays −3.5, not '-3.5.
 *
 * The browser build of csv-stringify is imported (on both sides): the Node build uses Node's Buffer.
 */
import { stringify } from 'csv-stringify/browser/esm/sync';

/** A cell: text, a number, a boolean (written true/false) or nothing (an empty cell). */
export type CsvCell = string | number | boolean | null | undefined;

/** Formats a header and rows as CSV, every line ending in CRLF. */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return stringify([header, ...rows] as CsvCell[][], {
    record_delimiter: '\r\n',
    escape_formulas: true,
    // A number that is not finite has no honest cell: leave it empty rather than write NaN.
    cast: { boolean: (v) => String(v), number: (v) => (Number.isFinite(v) ? String(v) : '') },
  });
}
