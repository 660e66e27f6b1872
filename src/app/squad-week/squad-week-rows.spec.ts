import { PROFILE_WARNING_TEXT } from '../../../shared/flight';
import { toCsv } from '../../../shared/csv';
import { FIXTURE_IDS, fixtureWeek } from '../core/analysis/spec-fixtures';
import { busiestTechniqueOfWeek, changeMark, csvFileName, squadRows, squadWeekCsv } from './squad-week-rows';

describe('Squad week rows', () => {
  const next = {
    byPlayer: new Map([
      [
        FIXTURE_IDS.playerAda,
        { status: 'ready' as const, result: { kind: 'target' as const, distanceM: 31.5, radiusM: 3, probability: 0.552 } },
      ],
    ]),
    otherwise: { status: 'unavailable' as const, reason: 'no repetitions' },
  };

  it('builds one line per player with the chosen technique’s figures', () => {
    const rows = squadRows(fixtureWeek(), 'lofted', next);
    expect(rows.map((r) => r.displayName)).toEqual(['Ada Okafor', 'Bo Lind', 'Cy Marsh']);
    expect(rows[0]!.techniqueReps).toBe(30);
    expect(rows[0]!.techniqueMedianCarryM).toBe(31);
    expect(rows[1]!.loadFlags).toBe(1);
    expect(rows[2]!.techniqueHitRate).toBeNull();
    expect(rows[2]!.next).toEqual({ status: 'unavailable', reason: 'no repetitions' });
    expect(squadRows(fixtureWeek(), 'driven', next)[0]!.techniqueReps).toBe(0);
  });

  it('turns the profile’s warning codes into plain words beside the reach', () => {
    const week = fixtureWeek();
    week.players[0]!.reach[0]!.warnings = ['few_repetitions', 'reach_beyond_drilled'];
    const rows = squadRows(week, 'lofted', next);
    expect(rows[0]!.reachWarnings).toEqual([PROFILE_WARNING_TEXT.few_repetitions, PROFILE_WARNING_TEXT.reach_beyond_drilled]);
    expect(rows[1]!.reachWarnings).toEqual([]);
  });

  it('words week-on-week change in whole points', () => {
    expect(changeMark(0.1)).toEqual({ points: 10, direction: 'up', words: 'up 10 points' });
    expect(changeMark(-0.012)).toEqual({ points: -1, direction: 'down', words: 'down 1 point' });
    expect(changeMark(0.004)).toEqual({ points: 0, direction: 'flat', words: 'no change' });
    expect(changeMark(null)).toBeNull();
  });

  it('opens on the technique with the most repetitions', () => {
    expect(busiestTechniqueOfWeek(fixtureWeek())).toBe('lofted');
  });

  it('quotes CSV cells per RFC 4180 and defuses formulas', () => {
    // RFC 4180 §2.6–2.7: fields with commas, quotes or line breaks are quoted, inner quotes doubled.
    const cell = (v: string | number | null) => toCsv(['h'], [[v]]).split('\r\n')[1];
    expect(cell('Okafor, Ada')).toBe('"Okafor, Ada"');
    expect(cell('Ada "Rocket" Okafor')).toBe('"Ada ""Rocket"" Okafor"');
    expect(cell('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(cell(-5)).toBe('-5');
    expect(cell(null)).toBe('');
  });

  it('exports the rows in the order given, with units and basis in the header', () => {
    const rows = squadRows(fixtureWeek(), 'lofted', next).reverse();
    const csv = squadWeekCsv(rows, 'lofted', 'still-air');
    const lines = csv.split('\r\n');
    expect(lines.length).toBe(5);
    expect(lines[4]).toBe('');
    expect(lines[0]).toContain('Lofted median still-air carry (m)');
    expect(lines[1]!.startsWith('11,Cy Marsh,0,,,,,0,')).toBeTrue();
    expect(lines[3]).toBe('7,Ada Okafor,30,60,50,10,Lofted,30,60,31,28,3,31.5,55.2,0');
  });

  it('names the file after squad, week and technique', () => {
    expect(csvFileName('U16 Kestrels', '2025-03-03', 'lofted')).toBe('squad-week-u16-kestrels-2025-03-03-lofted.csv');
  });
});
