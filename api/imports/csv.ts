/**
 * Reads an uploaded CSV safely: refuses binaries and empty or oversized files with a clear
 * message, strips a UTF-8 byte-order mark, reads Latin-1 when the bytes are not UTF-8, finds
 * the delimiter (comma, semicolon or tab) from the header, and parses RFC 4180 quoting
 * (quoted commas, line breaks and doubled quotes; CRLF or LF line ends).
 */
import { parse } from 'csv-parse/sync';
import { HttpError } from '../errors';

/** Largest upload accepted, bytes. */
export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;
/** Most data rows accepted in one file. */
export const MAX_ROWS = 50_000;

/** A parsed file: the header names (trimmed, lower-cased for matching) and the data rows. */
export interface CsvTable {
  header: string[];
  /** Each data row with its 1-based line number in the file (the header is row 1). */
  rows: { row: number; values: Record<string, string> }[];
  delimiter: string;
  encoding: 'utf-8' | 'latin1';
}

function refuse(code: string, message: string): never {
  throw new HttpError(400, code, message, [{ field: 'file', message }]);
}

/** Whether the bytes look like a binary file rather than text. */
function looksBinary(buf: Buffer): boolean {
  const sample = buf.subarray(0, 8192);
  let control = 0;
  for (const b of sample) {
    if (b === 0) return true;
    if (b < 9 || (b > 13 && b < 32)) control++;
  }
  return control > sample.length * 0.02;
}

function decode(buf: Buffer): { text: string; encoding: 'utf-8' | 'latin1' } {
  try {
    return { text: new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(buf), encoding: 'utf-8' };
  } catch {
    return { text: new TextDecoder('latin1').decode(buf), encoding: 'latin1' };
  }
}

function detectDelimiter(firstLine: string): string {
  let best = ',';
  let bestCount = 0;
  for (const d of [',', ';', '\t']) {
    let count = 0;
    let quoted = false;
    for (const ch of firstLine) {
      if (ch === '"') quoted = !quoted;
      else if (!quoted && ch === d) count++;
    }
    if (count > bestCount) {
      best = d;
      bestCount = count;
    }
  }
  return best;
}

/** Parses an uploaded file or throws 400 naming `file` and the reason. */
export function readCsv(buf: Buffer, requiredColumns: readonly string[]): CsvTable {
  if (buf.length === 0) refuse('file_empty', 'The file is empty');
  if (buf.length > MAX_UPLOAD_BYTES) refuse('file_too_large', `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB`);
  if (looksBinary(buf)) refuse('file_not_csv', 'The file is not a CSV text file (it looks binary)');
  const { text, encoding } = decode(buf);
  const body = text.replace(/^\uFEFF/, '');
  if (body.trim() === '') refuse('file_empty', 'The file has no rows');
  const firstLine = body.split(/\r?\n/, 1)[0] ?? '';
  const delimiter = detectDelimiter(firstLine);
  let records: string[][];
  try {
    records = parse(body, {
      delimiter,
      skip_empty_lines: true,
      relax_column_count: true,
      trim: true,
      max_record_size: 65_536,
    }) as string[][];
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    refuse('file_malformed', `The CSV cannot be read: ${message}`);
  }
  const [headerRow, ...data] = records;
  if (!headerRow || headerRow.every((h) => h === '')) refuse('file_no_header', 'The file has no header row');
  const header = headerRow.map((h) => h.trim());
  const lower = header.map((h) => h.toLowerCase());
  const missing = requiredColumns.filter((c) => !lower.includes(c.toLowerCase()));
  if (missing.length) {
    const hint = delimiter === ',' && header.length === 1 ? ' (is the delimiter a comma, semicolon or tab?)' : '';
    refuse('file_missing_columns', `The header row lacks the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}${hint}`);
  }
  if (data.length === 0) refuse('file_empty', 'The file has a header but no data rows');
  if (data.length > MAX_ROWS)
    refuse(
      'file_too_many_rows',
      `The file has ${data.length.toLocaleString('en-GB')} data rows; at most ${MAX_ROWS.toLocaleString('en-GB')} are accepted`,
    );
  const rows = data.map((values, i) => {
    const record: Record<string, string> = {};
    header.forEach((h, j) => {
      record[h.toLowerCase()] = values[j] ?? '';
    });
    return { row: i + 2, values: record };
  });
  return { header, rows, delimiter, encoding };
}
