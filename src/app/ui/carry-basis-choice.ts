import { Injectable, computed, inject, signal } from '@angular/core';
import type { CarryBasis } from '../../../shared/schemas/analysis';
import { BROWSER_STORAGE } from '../core/browser-storage';

/** localStorage key of the chosen carry basis. */
export const CARRY_BASIS_STORAGE_KEY = 'loftline.carryBasis.v1';

/** What each basis means, said on screen next to the toggle. */
export const CARRY_BASIS_TEXT: Readonly<Record<CarryBasis, string>> = {
  logged: 'Carries as logged, in each session’s wind and air.',
  'still-air': 'Carries normalised through the flight model to still air at ISA sea level, 15 °C, no wind.',
};

/**
 * Whether the analysis screens show carries as logged or normalised to still air. One choice for
 * the Player file and Squad week (kept on the device), so a coach who switched to still air to
 * look past a windy week sees the same basis on both screens.
 */
@Injectable({ providedIn: 'root' })
export class CarryBasisChoice {
  private readonly storage = inject(BROWSER_STORAGE);
  private readonly chosen = signal<CarryBasis>(this.restore());

  /** The basis shown now. */
  readonly basis = this.chosen.asReadonly();
  /** Whether still-air carries are shown. */
  readonly stillAir = computed(() => this.chosen() === 'still-air');
  /** The sentence that says which carries are shown. */
  readonly description = computed(() => CARRY_BASIS_TEXT[this.chosen()]);

  /** Switches between logged and still-air carries. */
  setStillAir(stillAir: boolean): void {
    const basis: CarryBasis = stillAir ? 'still-air' : 'logged';
    this.chosen.set(basis);
    try {
      this.storage.setItem(CARRY_BASIS_STORAGE_KEY, basis);
    } catch {
      // Storage refused: the choice lasts until the tab closes.
    }
  }

  private restore(): CarryBasis {
    try {
      return this.storage.getItem(CARRY_BASIS_STORAGE_KEY) === 'still-air' ? 'still-air' : 'logged';
    } catch {
      return 'logged';
    }
  }
}
