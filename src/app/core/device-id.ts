import { InjectionToken, inject } from '@angular/core';
import { BROWSER_STORAGE } from './browser-storage';
import { newId } from './loftline-db';

/** The localStorage key of this device's id (versioned like the session key). */
export const DEVICE_ID_STORAGE_KEY = 'loftline.device.v1';

/**
 * A stable id for this browser install, sent with every push and stored by the server on each
 * row it creates, so staff can tell which phone logged a session. Created once and kept; a
 * browser that refuses storage gets a fresh id per visit, which only loses that attribution.
 */
export const DEVICE_ID = new InjectionToken<string>('DEVICE_ID', {
  providedIn: 'root',
  factory: () => {
    const storage = inject(BROWSER_STORAGE);
    const known = storage.getItem(DEVICE_ID_STORAGE_KEY);
    if (known) {
      return known;
    }
    const id = newId();
    try {
      storage.setItem(DEVICE_ID_STORAGE_KEY, id);
    } catch {
      // Storage refused: the id lasts for this visit.
    }
    return id;
  },
});
