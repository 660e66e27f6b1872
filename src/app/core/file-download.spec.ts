import { attachmentName } from './file-download';

describe('attachmentName', () => {
  // RFC 6266 §4.3: filename* (RFC 8187 encoding) is preferred over filename when both are given.
  it('prefers the encoded filename* over filename', () => {
    expect(attachmentName(`attachment; filename="Zoe.csv"; filename*=UTF-8''Zo%C3%AB.csv`, 'x.csv')).toBe('Zoë.csv');
  });

  it('reads a quoted or bare filename', () => {
    expect(attachmentName('attachment; filename="loftline-kicks-2026-11-01-2026-11-30.csv"', 'x.csv')).toBe(
      'loftline-kicks-2026-11-01-2026-11-30.csv',
    );
    expect(attachmentName('attachment; filename=kicks.csv', 'x.csv')).toBe('kicks.csv');
  });

  it('falls back when there is no name, and never lets a name point into another folder', () => {
    expect(attachmentName(null, 'x.csv')).toBe('x.csv');
    expect(attachmentName('attachment', 'x.csv')).toBe('x.csv');
    expect(attachmentName('attachment; filename="../../etc/passwd"', 'x.csv')).toBe('.._.._etc_passwd');
  });
});
