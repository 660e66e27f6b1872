import type { SessionUser } from '../../../shared/schemas/auth';
import { SESSION_STORAGE_KEY } from './auth/auth-session';
import { MemoryStorage } from './browser-storage';
import { LoftlineDb, newId } from './loftline-db';

/*
 * Shared set-up for the specs beside the code that touch IndexedDB. Karma runs in real
 * Chromium, so every spec works on a real IndexedDB database — a fresh one per test, deleted
 * afterwards — rather than a stand-in. Nothing in the app imports this file.
 */

/** A new, empty database with a unique name. */
export function freshDb(): LoftlineDb {
  return new LoftlineDb(`loftline-spec-${newId()}`);
}

/** A storage holding a signed-in session for `user`, as AuthSession restores it. */
export function signedInStorage(user: SessionUser): MemoryStorage {
  const storage = new MemoryStorage();
  storage.setItem(
    SESSION_STORAGE_KEY,
    JSON.stringify({
      accessToken: 'access-1',
      refreshToken: 'refresh-token-number-1',
      user,
      club: { id: user.clubId, name: 'Harbour Academy' },
    }),
  );
  return storage;
}

/** Polls until `check` holds (IndexedDB and the queue work asynchronously). */
export async function until(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 10000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) {
      throw new Error(`Timed out waiting for ${what}`);
    }
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
}

/** A staff member (assistant coach) for specs. */
export const SPEC_COACH: SessionUser = {
  id: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1a01',
  email: 'coach@example.org',
  displayName: 'Robin Coach',
  role: 'assistant_coach',
  clubId: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1a02',
};

/** Ids that pass the shared schemas' UUID checks. */
export const SPEC_IDS = {
  squad: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1b01',
  playerA: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1c01',
  playerB: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1c02',
} as const;
