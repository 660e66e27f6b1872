import { DOCUMENT } from '@angular/common';
import { Injectable, inject, signal } from '@angular/core';

/**
 * Whether the browser has promised to keep Loftline's data, and how much it uses. Browsers may
 * evict site storage under pressure — some after days without a visit — and an outbox that is
 * evicted is kicks lost, so the app asks for persistent storage once a coach starts logging
 * and shows the answer. Usage and quota are estimates by the browser's own admission.
 */
@Injectable({ providedIn: 'root' })
export class StorageStatus {
  private readonly storage = inject(DOCUMENT).defaultView?.navigator.storage;

  /** Whether storage is persistent: true/false once known, null before or when unsupported. */
  readonly persisted = signal<boolean | null>(null);
  /** Bytes used by this site, as estimated by the browser, or null. */
  readonly usageBytes = signal<number | null>(null);
  /** Bytes this site may use, as estimated by the browser, or null. */
  readonly quotaBytes = signal<number | null>(null);
  /** Whether the browser offers the Storage API at all. */
  readonly supported = typeof this.storage?.persisted === 'function';

  /** Reads the current state without asking for anything. */
  async refresh(): Promise<void> {
    if (!this.storage) {
      return;
    }
    try {
      if (typeof this.storage.persisted === 'function') {
        this.persisted.set(await this.storage.persisted());
      }
      if (typeof this.storage.estimate === 'function') {
        const estimate = await this.storage.estimate();
        this.usageBytes.set(estimate.usage ?? null);
        this.quotaBytes.set(estimate.quota ?? null);
      }
    } catch {
      // Some browsers throw in private windows; the status simply stays unknown.
    }
  }

  /**
   * Asks the browser to keep the data (it decides without a prompt in most browsers, from how
   * much the site is used or whether it is installed), then refreshes the figures.
   */
  async requestPersistence(): Promise<boolean | null> {
    if (this.storage && typeof this.storage.persist === 'function' && this.persisted() !== true) {
      try {
        this.persisted.set(await this.storage.persist());
      } catch {
        // Refused outright: reported as not persistent by refresh().
      }
    }
    await this.refresh();
    return this.persisted();
  }
}
