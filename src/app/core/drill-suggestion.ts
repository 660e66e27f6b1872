import { Injectable, signal } from '@angular/core';
import { drillDataSchema, TECHNIQUES, type Technique } from '../../../shared/schemas/sync';

/** A drill proposed elsewhere (Next targets in the Player file or Squad week) for Pitchside to add. */
export interface SuggestedDrill {
  technique: Technique;
  targetDistanceM: number;
  targetRadiusM: number;
}

/**
 * Carries a suggested drill from the analysis screens to Pitchside: "Add as drill" navigates to
 * `/pitchside?drillTechnique=&drillTargetM=&drillRadiusM=`; Pitchside stores it here and the next
 * drill form opens prefilled with it, so adding it is one tap. Cleared once used or dismissed.
 */
@Injectable({ providedIn: 'root' })
export class DrillSuggestion {
  private readonly current = signal<SuggestedDrill | null>(null);

  /** The pending suggestion, if any. */
  readonly pending = this.current.asReadonly();

  /** Reads the query parameters; ignores them unless they make a valid drill. */
  offer(technique: string | undefined, targetM: string | undefined, radiusM: string | undefined): void {
    if (!technique || !targetM || !radiusM || !(TECHNIQUES as readonly string[]).includes(technique)) return;
    const distance = drillDataSchema.shape.targetDistanceM.safeParse(Number(targetM));
    const radius = drillDataSchema.shape.targetRadiusM.safeParse(Number(radiusM));
    if (!distance.success || !radius.success) return;
    this.current.set({ technique: technique as Technique, targetDistanceM: distance.data, targetRadiusM: radius.data });
  }

  /** Forgets the suggestion (after it was added, or when the coach dismisses it). */
  clear(): void {
    this.current.set(null);
  }
}
