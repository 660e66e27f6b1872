/** Pitchside's kicking-load caution (docs/design.md §10); the limit is the club's own (`ClubSettings.repLimitPerSession`). */

/** Whether a player's repetition count in this session has passed the club's limit. */
export function isOverLoadLimit(reps: number, limit: number): boolean {
  return reps > limit;
}

/** The caution Pitchside shows, worded to defer to the club's medical staff. */
export function loadCautionText(names: readonly string[], limit: number): string {
  const who = names.length === 1 ? names[0] : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
  const verb = names.length === 1 ? 'has' : 'have';
  return (
    `${who} ${verb} passed ${limit} repetitions this session. Repeated hard kicking strains hips and groin: ` +
    `consider a rest and follow your club's medical staff.`
  );
}
