import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { SwUpdate, type VersionEvent } from '@angular/service-worker';
import { Subject } from 'rxjs';
import { AppUpdate } from './app-update';

describe('AppUpdate (new version offer)', () => {
  const events = new Subject<VersionEvent>();
  const ready: VersionEvent = {
    type: 'VERSION_READY',
    currentVersion: { hash: 'old' },
    latestVersion: { hash: 'new' },
  };

  let checks = 0;

  beforeEach(() => {
    checks = 0;
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        {
          provide: SwUpdate,
          useValue: {
            isEnabled: true,
            versionUpdates: events,
            activateUpdate: () => Promise.resolve(true),
            checkForUpdate: () => {
              checks++;
              return Promise.resolve(false);
            },
          },
        },
      ],
    });
  });

  it('offers the reload once the service worker has the new version ready', () => {
    const update = TestBed.inject(AppUpdate);
    expect(update.offer()).toBeFalse();
    events.next({ type: 'VERSION_DETECTED', version: { hash: 'new' } });
    expect(update.offer()).toBeFalse();
    events.next(ready);
    expect(update.offer()).toBeTrue();
  });

  it('holds the offer back while a repetition is being entered, and shows it when the entry is done', () => {
    const update = TestBed.inject(AppUpdate);
    const release = update.hold();
    events.next(ready);
    expect(update.versionReady()).toBeTrue();
    expect(update.offer()).toBeFalse();
    expect(update.held()).toBeTrue();
    release();
    release();
    expect(update.offer()).toBeTrue();
    update.dismiss();
    expect(update.offer()).toBeFalse();
  });

  it('asks the service worker for a new version when the connection returns and when the app comes back into view', async () => {
    TestBed.inject(AppUpdate);
    window.dispatchEvent(new Event('online'));
    // One check at a time: the next event counts once the first check has answered.
    await new Promise((done) => setTimeout(done));
    document.dispatchEvent(new Event('visibilitychange'));
    expect(checks).toBe(document.visibilityState === 'visible' ? 2 : 1);
  });
});
