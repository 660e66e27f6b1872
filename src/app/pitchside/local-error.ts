import { InvalidEntryError } from '../core/entry-validation';

/**
 * A sentence for a failed local write. IndexedDB rarely fails, but when it does (storage full,
 * private mode) the coach must know the tap did not save rather than believe it did.
 */
export function describeLocalError(error: unknown): string {
  if (error instanceof InvalidEntryError) {
    return error.message;
  }
  if (error instanceof Error && error.name === 'QuotaExceededError') {
    return 'The phone is out of storage for Loftline. Nothing was saved; free some space and try again.';
  }
  return 'Saving on this phone failed. Nothing was saved; try again.';
}
