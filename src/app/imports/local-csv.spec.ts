import { MAX_UPLOAD_BYTES } from './import-types';
import { LocalCsvError, parseCsv, readLocalCsv, rowAt, valueAt } from './local-csv';

const csvFile = (text: string | Uint8Array<ArrayBuffer>, name = 'kicks.csv'): File => new File([text], name, { type: 'text/csv' });

async function refusal(file: File): Promise<string> {
  try {
    await readLocalCsv(file);
  } catch (error) {
    expect(error).toBeInstanceOf(LocalCsvError);
    return (error as Error).message;
  }
  fail('the file was accepted');
  return '';
}

describe('parseCsv', () => {
  // RFC 4180 §2: quoted fields may hold delimiters, line breaks and doubled quotes.
  it('reads quoted commas, doubled quotes and line breaks inside quotes', () => {
    const { records } = parseCsv('name,note\r\n"Okafor, Nia","said ""left foot"""\r\n"Two\nlines",x\r\n');
    expect(records).toEqual([
      ['name', 'note'],
      ['Okafor, Nia', 'said "left foot"'],
      ['Two\nlines', 'x'],
    ]);
  });

  it('finds a semicolon or tab delimiter from the header row', () => {
    expect(parseCsv('a;b;c\n1;2,5;3\n')).toEqual({
      delimiter: ';',
      records: [
        ['a', 'b', 'c'],
        ['1', '2,5', '3'],
      ],
    });
    expect(parseCsv('a\tb\n1\t2').delimiter).toBe('\t');
  });

  it('skips blank lines, trims unquoted fields and drops a byte-order mark', () => {
    const { records } = parseCsv('\ufeff squad , name \n\n U14 ,"  Ada "\r\n\r\n');
    expect(records).toEqual([
      ['squad', 'name'],
      ['U14', '  Ada '],
    ]);
  });

  it('reads LF, CRLF and lone CR line ends alike', () => {
    expect(parseCsv('a\rb\r\nc\nd').records).toEqual([['a'], ['b'], ['c'], ['d']]);
  });
});

describe('readLocalCsv', () => {
  it('numbers data rows as the server does: the header is row 1', async () => {
    const csv = await readLocalCsv(csvFile('Kicker,Speed\n7,24.1\n\n9,25\n'));
    expect(csv.header).toEqual(['Kicker', 'Speed']);
    expect(rowAt(csv, 2)).toEqual(['7', '24.1']);
    expect(rowAt(csv, 3)).toEqual(['9', '25']);
    expect(valueAt(csv, 3, 'speed')).toBe('25');
    expect(rowAt(csv, 4)).toBeNull();
  });

  it('pads short rows so every row has a value per column', async () => {
    const csv = await readLocalCsv(csvFile('a,b,c\n1\n'));
    expect(csv.rows).toEqual([['1', '', '']]);
  });

  it('reads Windows-1252 text when the bytes are not UTF-8', async () => {
    // "Zoë" with ë as the single Windows-1252 byte 0xEB.
    const bytes = new Uint8Array([0x6e, 0x61, 0x6d, 0x65, 0x0a, 0x5a, 0x6f, 0xeb, 0x0a]);
    const csv = await readLocalCsv(csvFile(bytes));
    expect(csv.encoding).toBe('windows-1252');
    expect(csv.rows).toEqual([['Zoë']]);
  });

  it('refuses what the server would refuse, saying why', async () => {
    expect(await refusal(csvFile('a,b\n1,2', 'kicks.xlsx'))).toContain('Only CSV files');
    expect(await refusal(csvFile(''))).toContain('is empty');
    expect(await refusal(csvFile('a,b\n'))).toContain('no data rows');
    expect(await refusal(csvFile(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00])))).toContain('not a CSV text file');
    expect(await refusal(csvFile('a\n' + 'x\n'.repeat(50_001)))).toContain('at most 50,000');
  });

  it('refuses a file over 5 MB before reading it', async () => {
    const big = csvFile(new Uint8Array(MAX_UPLOAD_BYTES + 1).fill(0x41));
    expect(await refusal(big)).toContain('the largest file accepted is 5.0 MB');
  });
});
