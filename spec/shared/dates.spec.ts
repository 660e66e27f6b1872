import { parseLocalDateTime } from '../../shared/dates';

describe('parseLocalDateTime (device times read in the club’s zone)', () => {
  // Offsets from the IANA time zone database: UK GMT (+0) in winter and BST (+1) from the last Sunday of
  // March to the last Sunday of October; US Eastern −5 / −4 (from memory, checked against the runtime's own tz data).
  it('reads a bare wall-clock time in the club’s zone, winter and summer', () => {
    expect(parseLocalDateTime('2026-11-30 18:05:10', 'Europe/London')!.toISOString()).toBe('2026-11-30T18:05:10.000Z');
    expect(parseLocalDateTime('2026-07-01 18:00', 'Europe/London')!.toISOString()).toBe('2026-07-01T17:00:00.000Z');
    expect(parseLocalDateTime('2026-07-01T18:00:00', 'America/New_York')!.toISOString()).toBe('2026-07-01T22:00:00.000Z');
    expect(parseLocalDateTime('2026-01-15 09:30:00.250', 'America/New_York')!.toISOString()).toBe('2026-01-15T14:30:00.250Z');
  });

  it('is right on both sides of a change to summer time', () => {
    // UK clocks go forward at 01:00 GMT on Sunday 29 March 2026.
    expect(parseLocalDateTime('2026-03-29 00:30', 'Europe/London')!.toISOString()).toBe('2026-03-29T00:30:00.000Z');
    expect(parseLocalDateTime('2026-03-29 03:00', 'Europe/London')!.toISOString()).toBe('2026-03-29T02:00:00.000Z');
  });

  it('takes an explicit offset or Z as written', () => {
    expect(parseLocalDateTime('2026-07-01T18:00:00Z', 'Europe/London')!.toISOString()).toBe('2026-07-01T18:00:00.000Z');
    expect(parseLocalDateTime('2026-07-01T18:00:00+02:00', 'Europe/London')!.toISOString()).toBe('2026-07-01T16:00:00.000Z');
  });

  it('refuses what is not a date and time', () => {
    for (const bad of ['', 'yesterday', '2026-02-30 10:00', '2026-11-30 25:00', '30/11/2026 18:00'])
      expect(parseLocalDateTime(bad, 'Europe/London')).toBeNull();
  });
});

describe('parseLocalDateTime on a large device file', () => {
  it('builds one time-zone formatter per zone, not one per row', () => {
    const built = spyOn(Intl, 'DateTimeFormat').and.callThrough();
    const start = Date.UTC(2026, 2, 28, 22, 0, 0);
    for (let i = 0; i < 2000; i++) {
      const wall = new Date(start + i * 60_000).toISOString().slice(0, 19).replace('T', ' ');
      expect(parseLocalDateTime(wall, i % 2 ? 'Europe/London' : 'America/New_York')).not.toBeNull();
    }
    // Two zones: at most one formatter each (fewer when an earlier spec already built one).
    expect(built.calls.count()).toBeLessThanOrEqual(2);
  });
});
