/** The caller's club settings: read by staff devices, changed by the club's admin. */
import { eq } from 'drizzle-orm';
import { DEFAULT_DRAG_CRISIS_RE, type ClubSettings, type ClubSettingsUpdate } from '../../shared/schemas/club';
import { QuantityFormat } from '../../shared/quantity-format';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { clubs } from '../db/schema';
import { NotFound } from '../errors';
import type { Scope } from '../scope/scope';
import { clearClubStillAirCarry } from '../analysis/still-air';

/** The settings of the caller's club (scoped by club: nobody reads another club's); the ball's crisis defaults to the model's. */
export function clubSettings(db: Db, scope: Scope): Required<ClubSettings> {
  return settingsOfClub(db, scope.user.clubId);
}

/** The settings of one club, for server-side work that has no caller (mail jobs) and for the scoped read. */
export function settingsOfClub(db: Db, clubId: string): Required<ClubSettings> {
  const row = db
    .select({
      timingBiasS: clubs.timingBiasS,
      timingSdS: clubs.timingSdS,
      dragCrisisRe: clubs.dragCrisisRe,
      distanceUnit: clubs.distanceUnit,
      locale: clubs.locale,
      repLimitPerSession: clubs.repLimitPerSession,
    })
    .from(clubs)
    .where(eq(clubs.id, clubId))
    .get();
  if (!row) throw new NotFound('Your club no longer exists');
  return { ...row, dragCrisisRe: row.dragCrisisRe ?? DEFAULT_DRAG_CRISIS_RE };
}

/** A formatter for one club's distance unit and locale (mail and exports speak the club's units too). */
export function clubFormat(db: Db, clubId: string): QuantityFormat {
  return new QuantityFormat(settingsOfClub(db, clubId));
}

/** Stores new settings for the caller's club and audits the change (old and new values). */
export function updateClubSettings(db: Db, scope: Scope, next: ClubSettingsUpdate): Required<ClubSettings> {
  const before = clubSettings(db, scope);
  const ballChanged = next.dragCrisisRe !== undefined && next.dragCrisisRe !== before.dragCrisisRe;
  db.transaction(() => {
    db.update(clubs)
      .set({
        timingBiasS: next.timingBiasS,
        timingSdS: next.timingSdS,
        ...(next.dragCrisisRe === undefined ? {} : { dragCrisisRe: next.dragCrisisRe }),
        // Left out, the display settings stay as they were.
        ...(next.distanceUnit === undefined ? {} : { distanceUnit: next.distanceUnit }),
        ...(next.locale === undefined ? {} : { locale: next.locale }),
        updatedAt: new Date().toISOString(),
      })
      .where(eq(clubs.id, scope.user.clubId))
      .run();
    // Timed repetitions are solved with the calibration, and every kick is flown with the club's ball:
    // profiles fitted with the old values are refitted (the unit and locale change only how figures are
    // shown, so they alone refit nothing).
    if (next.timingBiasS !== before.timingBiasS || next.timingSdS !== before.timingSdS || ballChanged)
      db.$client
        .prepare('DELETE FROM player_profiles WHERE player_id IN (SELECT id FROM players WHERE club_id = ?)')
        .run(scope.user.clubId);
    // A different ball changes every still-air carry: the refresher normalises them again.
    if (ballChanged) clearClubStillAirCarry(db, scope.user.clubId);
  });
  audit(db, {
    clubId: scope.user.clubId,
    userId: scope.user.id,
    action: 'club.settings_updated',
    entity: 'club',
    entityId: scope.user.clubId,
    detail: { before, after: next },
  });
  return clubSettings(db, scope);
}
