/**
 * Repetitions per player per session above which Pitchside shows the kicking-load caution
 * (docs/design.md §10: repeated maximal kicking strains hips and groin).
 *
 * TODO(sync/API owner): the club sets its own limit (`clubs.rep_limit_per_session` on the
 * server, 40 in the demo club), but no endpoint exposes it to the app yet; until one does,
 * Pitchside uses this default for every club. Read it from `/api/me` (club) once it is there.
 */
export const DEFAULT_REP_LIMIT_PER_SESSION = 40;

/** Whether a player's repetition count in this session has passed the club's limit. */
export function isOverLoadLimit(reps: number, limit: number = DEFAULT_REP_LIMIT_PER_SESSION): boolean {
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
