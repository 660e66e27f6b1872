import type { ChildWeek } from '../core/guardians/guardian-api';

/** Formats a share (0..1) as a whole percentage, "62 %". */
export function percentLabel(share: number): string {
  return `${Math.round(share * 100)} %`;
}

/**
 * The text alternative of a child's weekly chart: how many repetitions over how many weeks,
 * and whether the hit rate went up or down between the first and the last week that had one.
 * A guardian reading it aloud (or with a screen reader) gets the same story as the drawing.
 */
export function describeTrend(firstName: string, weeks: readonly ChildWeek[]): string {
  if (weeks.length === 0) {
    return `No training repetitions are recorded for ${firstName} yet.`;
  }
  const totalReps = weeks.reduce((sum, week) => sum + week.reps, 0);
  const span = weeks.length === 1 ? 'in 1 week' : `over ${weeks.length} weeks`;
  const repsSentence = `${firstName} logged ${totalReps} ${totalReps === 1 ? 'repetition' : 'repetitions'} ${span}.`;
  const rated = weeks.filter((week): week is ChildWeek & { hitRate: number } => week.hitRate !== null);
  const first = rated[0];
  const last = rated[rated.length - 1];
  if (first === undefined || last === undefined) {
    return `${repsSentence} No hit rate yet.`;
  }
  if (first === last) {
    return `${repsSentence} Hit rate ${percentLabel(first.hitRate)}.`;
  }
  const points = Math.round(last.hitRate * 100) - Math.round(first.hitRate * 100);
  const direction =
    points === 0
      ? 'unchanged'
      : points > 0
        ? `up ${points} ${points === 1 ? 'point' : 'points'}`
        : `down ${-points} ${points === -1 ? 'point' : 'points'}`;
  return `${repsSentence} Hit rate ${percentLabel(first.hitRate)} at first, ${percentLabel(last.hitRate)} in the latest week (${direction}).`;
}
