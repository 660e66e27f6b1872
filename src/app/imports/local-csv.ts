import { MAX_UPLOAD_BYTES, MAX_UPLOAD_ROWS } from './import-types';

/**
 * A CSV file as read on the device, before anything is uploaded: the header row (for the column
 * mapping) and the data rows (to show the values the server's row errors point at).
 */
export interface LocalCsv {
  readonly fileName: string;
  readonly sizeBytes: number;
  /** The header row's names, trimmed, as written in the file. */
  readonly header: readonly string[];
  /** Each data row's values, one per header column ('' where a row is short). */
  readonly rows: readonly (readonly string[])[];
  readonly delimiter: ',' | ';' | '\t';
  readonly encoding: 'utf-8' | 'windows-1252';
}

/** Why a file cannot be imported at all; the message is meant for the coach. */
export class LocalCsvError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LocalCsvError';
  }
}

/** The row number the server gives the data row at `index` (0-based): the header is row 1. */
export function rowNumberOf(index: number): number {
  return index + 2;
}

/** The data row the server calls row `row`, if the file has it. */
export function rowAt(csv: LocalCsv, row: number): readonly string[] | null {
  return csv.rows[row - 2] ?? null;
}

/** The value of column `column` (matched without regard to case) in row `row`, or null. */
export function valueAt(csv: LocalCsv, row: number, column: string): string | null {
  const index = columnIndex(csv.header, column);
  const values = rowAt(csv, row);
  return index < 0 || values === null ? null : (values[index] ?? '');
}

/** Where `column` sits in the header, matched without regard to case (as the server matches). */
export function columnIndex(header: readonly string[], column: string): number {
  const wanted = column.trim().toLowerCase();
  return header.findIndex((name) => name.toLowerCase() === wanted);
}

/**
 * Reads a chosen file on the device. The server reads it again and is the judge; reading it
 * here lets the coach map columns without a round trip (on a pitch, often without signal) and
 * refuses at once what the server would refuse anyway: empty, binary, too large, too many rows.
 */
export async function readLocalCsv(file: File): Promise<LocalCsv> {
  if (!/\.(csv|txt)$/i.test(file.name)) {
    throw new LocalCsvError(
      `${file.name} is not a CSV file. Only CSV files (.csv) can be imported: save the sheet as CSV and choose that file.`,
    );
  }
  if (file.size === 0) {
    throw new LocalCsvError(`${file.name} is empty.`);
  }
  if (file.size > MAX_UPLOAD_BYTES) {
    throw new LocalCsvError(
      `${file.name} is ${megabytes(file.size)}; the largest file accepted is ${megabytes(MAX_UPLOAD_BYTES)}. Split it and import the parts one by one.`,
    );
  }
  const bytes = new Uint8Array(await file.arrayBuffer());
  if (looksBinary(bytes)) {
    throw new LocalCsvError(
      `${file.name} is not a CSV text file (it looks like a spreadsheet or other binary file). Save it as CSV and try again.`,
    );
  }
  const { text, encoding } = decode(bytes);
  const { delimiter, records } = parseCsv(text);
  const [headerRow, ...data] = records;
  if (!headerRow || headerRow.every((name) => name === '')) {
    throw new LocalCsvError(`${file.name} has no header row.`);
  }
  if (data.length === 0) {
    throw new LocalCsvError(`${file.name} has a header but no data rows.`);
  }
  if (data.length > MAX_UPLOAD_ROWS) {
    throw new LocalCsvError(
      `${file.name} has ${count(data.length)} data rows; at most ${count(MAX_UPLOAD_ROWS)} are accepted in one file.`,
    );
  }
  const header = headerRow.map((name) => name.trim());
  const rows = data.map((values) => header.map((_, i) => values[i] ?? ''));
  return { fileName: file.name, sizeBytes: file.size, header, rows, delimiter, encoding };
}

/**
 * Parses CSV text (RFC 4180: quoted fields with doubled quotes and line breaks inside, CRLF, LF
 * or CR line ends). The delimiter is whichever of comma, semicolon or tab the first line has
 * most of outside quotes, because spreadsheets in much of Europe save with semicolons. Blank
 * lines are skipped and fields trimmed, as the server does, so row numbers agree.
 */
export function parseCsv(text: string): { delimiter: ',' | ';' | '\t'; records: string[][] } {
  const body = text.startsWith('\ufeff') ? text.slice(1) : text;
  const delimiter = detectDelimiter(body.split(/\r\n|\n|\r/, 1)[0] ?? '');
  const records: string[][] = [];
  let record: string[] = [];
  let field = '';
  let quoted = false;
  let fieldWasQuoted = false;
  const endField = (): void => {
    record.push(fieldWasQuoted ? field : field.trim());
    field = '';
    fieldWasQuoted = false;
  };
  const endRecord = (): void => {
    endField();
    const blank = record.length === 1 && record[0] === '';
    if (!blank) records.push(record);
    record = [];
  };
  for (let i = 0; i < body.length; i++) {
    const ch = body[i];
    if (quoted) {
      if (ch === '"') {
        if (body[i + 1] === '"') {
          field += '"';
          i++;
        } else {
          quoted = false;
        }
      } else {
        field += ch;
      }
    } else if (ch === '"' && field.trim() === '') {
      quoted = true;
      fieldWasQuoted = true;
      field = '';
    } else if (ch === delimiter) {
      endField();
    } else if (fieldWasQuoted && (ch === ' ' || ch === '\t')) {
      // Space after a closing quote, before the delimiter: not part of the value.
    } else if (ch === '\n' || ch === '\r') {
      if (ch === '\r' && body[i + 1] === '\n') i++;
      endRecord();
    } else {
      field += ch;
    }
  }
  if (field !== '' || fieldWasQuoted || record.length > 0) endRecord();
  return { delimiter, records };
}

function detectDelimiter(firstLine: string): ',' | ';' | '\t' {
  let best: ',' | ';' | '\t' = ',';
  let bestCount = 0;
  for (const candidate of [',', ';', '\t'] as const) {
    let count = 0;
    let quoted = false;
    for (const ch of firstLine) {
      if (ch === '"') quoted = !quoted;
      else if (!quoted && ch === candidate) count++;
    }
    if (count > bestCount) {
      best = candidate;
      bestCount = count;
    }
  }
  return best;
}

/** Whether the first bytes hold NULs or many control characters (an .xlsx, an image, …). */
function looksBinary(bytes: Uint8Array): boolean {
  const sample = bytes.subarray(0, 8192);
  let control = 0;
  for (const b of sample) {
    if (b === 0) return true;
    if (b < 9 || (b > 13 && b < 32)) control++;
  }
  return control > sample.length * 0.02;
}

/** UTF-8 when the bytes are valid UTF-8, else Windows-1252 (what older spreadsheet exports use). */
function decode(bytes: Uint8Array): { text: string; encoding: LocalCsv['encoding'] } {
  try {
    return { text: new TextDecoder('utf-8', { fatal: true }).decode(bytes), encoding: 'utf-8' };
  } catch {
    return { text: new TextDecoder('windows-1252').decode(bytes), encoding: 'windows-1252' };
  }
}

/**
 * The page's language, which ClubFormat keeps at the club's locale (`<html lang>`), so messages made far from
 * any screen still write numbers the club's way.
 */
function pageLocale(): string | undefined {
  return typeof document === 'undefined' ? undefined : document.documentElement.lang || undefined;
}

/** A count with the locale's digit grouping, e.g. "20,000" or "20.000". */
function count(n: number): string {
  return n.toLocaleString(pageLocale());
}

/** A size in MB with one decimal in the club's locale, e.g. "5.0 MB" or "5,0 MB". */
export function megabytes(bytes: number): string {
  return `${(bytes / 1024 / 1024).toLocaleString(pageLocale(), { minimumFractionDigits: 1, maximumFractionDigits: 1 })} MB`;
}
