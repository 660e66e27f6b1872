import { METRIC_UNITS, distanceUnitIn, guessColumns, guessUnits, speedUnitIn, spinUnitIn } from './column-guess';

describe('guessColumns', () => {
  it('proposes a column for each field from typical header names', () => {
    const header = ['Shot', 'Kicker', 'Recorded', 'Ball speed (mph)', 'Launch (deg)', 'Spin (rpm)', 'Carry (yd)', 'Side (yd)'];
    expect(guessColumns(header)).toEqual({
      player: 'Kicker',
      time: 'Recorded',
      speed: 'Ball speed (mph)',
      launchAngle: 'Launch (deg)',
      spin: 'Spin (rpm)',
      carry: 'Carry (yd)',
      lateral: 'Side (yd)',
    });
  });

  it('reads a "side distance" as lateral, not as carry, and never proposes one column twice', () => {
    const guess = guessColumns(['Player', 'Side distance', 'Distance']);
    expect(guess.lateral).toBe('Side distance');
    expect(guess.carry).toBe('Distance');
  });

  it('leaves out fields no header looks like', () => {
    expect(guessColumns(['No.', 'velocity'])).toEqual({ player: 'No.', speed: 'velocity' });
  });
});

describe('unit guesses', () => {
  it('reads units from header names', () => {
    expect(speedUnitIn('Speed (mph)')).toBe('mph');
    expect(speedUnitIn('Speed km/h')).toBe('km/h');
    expect(speedUnitIn('v [m/s]')).toBe('m/s');
    expect(speedUnitIn('Speed')).toBeNull();
    expect(spinUnitIn('Spin rpm')).toBe('rpm');
    expect(spinUnitIn('Spin (rev/s)')).toBe('rev/s');
    expect(distanceUnitIn('Carry (yd)')).toBe('yd');
    expect(distanceUnitIn('Carry (m)')).toBe('m');
    expect(distanceUnitIn('Carry')).toBeNull();
  });

  it('falls back to the given units where the headers say nothing', () => {
    expect(guessUnits({ speed: 'Speed', spin: 'Spin rpm', lateral: 'Side yards' }, METRIC_UNITS)).toEqual({
      speed: 'm/s',
      spin: 'rpm',
      distance: 'yd',
    });
  });
});
