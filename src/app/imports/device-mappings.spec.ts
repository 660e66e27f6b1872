import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { DEVICE_MAPPINGS_KEY, DeviceMappings, missingColumns } from './device-mappings';
import type { KickUnits } from './import-types';

const YARDS: KickUnits = { speed: 'mph', spin: 'rpm', distance: 'yd' };

describe('DeviceMappings', () => {
  let storage: MemoryStorage;

  function fresh(): DeviceMappings {
    TestBed.resetTestingModule();
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection(), { provide: BROWSER_STORAGE, useValue: storage }] });
    return TestBed.inject(DeviceMappings);
  }

  beforeEach(() => {
    storage = new MemoryStorage();
  });

  it('keeps a mapping under the device name for the next visit, matched without regard to case', () => {
    fresh().save('  Pitch radar A ', { player: 'Kicker', speed: 'Speed (mph)' }, YARDS, new Date('2026-11-30T18:00:00Z'));
    const later = fresh();
    expect(later.find('pitch RADAR a')).toEqual({
      device: 'Pitch radar A',
      columns: { player: 'Kicker', speed: 'Speed (mph)' },
      units: YARDS,
      savedAt: '2026-11-30T18:00:00.000Z',
    });
    expect(later.find('')).toBeNull();
  });

  it('replaces a device’s mapping and forgets it on request', () => {
    const devices = fresh();
    devices.save('Radar', { player: 'A', carry: 'B' }, YARDS);
    devices.save('RADAR', { player: 'P', carry: 'C' }, YARDS);
    expect(devices.saved().length).toBe(1);
    expect(devices.find('radar')?.columns).toEqual({ player: 'P', carry: 'C' });
    devices.forget('Radar');
    expect(fresh().saved()).toEqual([]);
  });

  it('offers the most recent mapping whose every column the file has', () => {
    const devices = fresh();
    devices.save('Old radar', { player: 'Kicker', speed: 'Speed' }, YARDS, new Date('2026-01-01T00:00:00Z'));
    devices.save('New radar', { player: 'Kicker', speed: 'Speed', spin: 'Spin' }, YARDS, new Date('2026-06-01T00:00:00Z'));
    expect(devices.bestFor(['kicker', 'speed', 'spin'])?.device).toBe('New radar');
    expect(devices.bestFor(['Kicker', 'Speed'])?.device).toBe('Old radar');
    expect(devices.bestFor(['Name', 'Carry'])).toBeNull();
    expect(missingColumns(devices.find('New radar')!, ['Kicker'])).toEqual(['Speed', 'Spin']);
  });

  it('ignores stored data it cannot read instead of failing', () => {
    storage.setItem(DEVICE_MAPPINGS_KEY, JSON.stringify([{ device: 'Bad', columns: {}, units: YARDS, savedAt: 'x' }, 'junk']));
    expect(fresh().saved()).toEqual([]);
    storage.setItem(DEVICE_MAPPINGS_KEY, '{not json');
    expect(fresh().saved()).toEqual([]);
  });
});
