import { QuantityFormat } from '../../../shared/quantity-format';
import { createMappingForm, fillMapping, mappingOf } from './kick-mapping-form';
import type { LocalCsv } from './local-csv';
import { mappingSample } from './mapping-sample';
import { MS_PER_MPH, toMetres, toMetresPerSecond, toRevsPerSecond } from './unit-conversion';

const csv = (rows: string[][], delimiter: LocalCsv['delimiter'] = ','): LocalCsv => ({
  fileName: 'k.csv',
  sizeBytes: 100,
  header: ['Kicker', 'When', 'Speed', 'Spin', 'Carry'],
  rows,
  delimiter,
  encoding: 'utf-8',
});

describe('unit conversion', () => {
  // International yard and pound agreement (1959): 1 yd = 0.9144 m exactly, so 1 mph = 0.44704 m/s.
  it('uses the exact definitions of the yard and the mile per hour', () => {
    expect(toMetres(100, 'yd')).toBeCloseTo(91.44, 10);
    expect(MS_PER_MPH).toBeCloseTo(0.44704, 12);
    expect(toMetresPerSecond(36, 'km/h')).toBeCloseTo(10, 12);
    expect(toRevsPerSecond(600, 'rpm')).toBeCloseTo(10, 12);
    expect(toMetresPerSecond(20, 'm/s')).toBe(20);
  });
});

const EN = new QuantityFormat({ locale: 'en-GB', distanceUnit: 'm' });

describe('mappingSample', () => {
  it('shows the first rows in Loftline units, with the units in the headings', () => {
    const form = createMappingForm();
    fillMapping(
      form,
      csv([]).header,
      { player: 'Kicker', speed: 'Speed', spin: 'Spin', carry: 'Carry' },
      { speed: 'mph', spin: 'rpm', distance: 'yd' },
    );
    const sample = mappingSample(csv([['7', '', '50', '600', '40']]), form.getRawValue(), EN);
    expect(sample.fields.map((f) => f.label)).toEqual(['Player', 'Ball speed (m/s)', 'Spin (rev/s)', 'Carry (m)']);
    expect(sample.rows[0]?.row).toBe(2);
    // 50 mph = 22.352 m/s; 600 rpm = 10 rev/s; 40 yd = 36.576 m.
    expect(sample.rows[0]?.cells.map((c) => c.text)).toEqual(['7', '22.4', '10', '36.6']);
    expect(sample.rows[0]?.cells.every((c) => c.warning === null)).toBeTrue();
  });

  it('flags a value that the chosen unit puts out of range, a non-number and an unreadable time', () => {
    const form = createMappingForm();
    fillMapping(form, csv([]).header, { player: 'Kicker', time: 'When', speed: 'Speed' }, { speed: 'm/s', spin: 'rev/s', distance: 'm' });
    const sample = mappingSample(
      csv([
        ['', 'yesterday', '90'],
        ['8', '2026-11-30 18:05:10', 'fast'],
      ]),
      form.getRawValue(),
      EN,
    );
    const [first, second] = sample.rows;
    expect(first?.cells[0]?.warning).toBe('No player given');
    expect(first?.cells[1]?.warning).toContain('Not a date and time');
    expect(first?.cells[2]?.warning).toContain('is the unit right?');
    expect(second?.cells[1]?.warning).toBeNull();
    expect(second?.cells[2]?.warning).toBe('Not a number');
  });

  it('writes numbers and times in the club’s locale', () => {
    const form = createMappingForm();
    fillMapping(form, csv([]).header, { player: 'Kicker', time: 'When', speed: 'Speed' }, { speed: 'm/s', spin: 'rev/s', distance: 'm' });
    const de = new QuantityFormat({ locale: 'de-DE', distanceUnit: 'yd' });
    const cells = mappingSample(csv([['7', '2026-11-30 18:05:10', '24.5']]), form.getRawValue(), de).rows[0]?.cells ?? [];
    // CLDR German: decimal comma, day-month-year with dots, 24-hour clock.
    expect(cells[2]?.text).toBe('24,5');
    expect(cells[1]?.text).toBe('30.11.2026, 18:05:10');
  });

  it('reads a decimal comma in a semicolon-separated file, as the server does', () => {
    const form = createMappingForm();
    fillMapping(form, csv([]).header, { player: 'Kicker', speed: 'Speed' }, { speed: 'm/s', spin: 'rev/s', distance: 'm' });
    expect(mappingSample(csv([['7', '', '24,5']], ';'), form.getRawValue(), EN).rows[0]?.cells[1]?.text).toBe('24.5');
    expect(mappingSample(csv([['7', '', '24,5']], ','), form.getRawValue(), EN).rows[0]?.cells[1]?.warning).toBe('Not a number');
  });
});

describe('the mapping form', () => {
  const header = ['Kicker', 'When', 'Speed', 'Spin', 'Carry'];

  it('asks for a player column, and for a speed or a carry column, as the server does', () => {
    const form = createMappingForm();
    expect(form.errors?.['mapping']).toContain('names the player');
    fillMapping(form, header, { player: 'Kicker', spin: 'Spin' }, { speed: 'm/s', spin: 'rev/s', distance: 'm' });
    expect(form.errors?.['mapping']).toContain('ball speed or a carry');
    form.controls.carry.setValue('Carry');
    expect(form.valid).toBeTrue();
  });

  it('refuses one column chosen for two fields', () => {
    const form = createMappingForm();
    fillMapping(form, header, { player: 'Kicker', speed: 'Speed', carry: 'Speed' }, { speed: 'm/s', spin: 'rev/s', distance: 'm' });
    expect(form.errors?.['mapping']).toBe('“Speed” is chosen for both ball speed and carry.');
  });

  it('takes saved columns as this file spells them and reports those it lacks', () => {
    const form = createMappingForm();
    const missing = fillMapping(
      form,
      header,
      { player: 'KICKER', speed: 'Speed', lateral: 'Side' },
      { speed: 'mph', spin: 'rev/s', distance: 'm' },
      'Radar',
    );
    expect(missing).toEqual(['Side']);
    expect(mappingOf(form.getRawValue())).toEqual({
      columns: { player: 'Kicker', speed: 'Speed' },
      units: { speed: 'mph', spin: 'rev/s', distance: 'm' },
      device: 'Radar',
    });
  });
});
