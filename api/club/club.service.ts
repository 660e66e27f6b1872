/** The caller's club settings: read by staff devices, changed by the club's admin. */
import { eq } from 'drizzle-orm';
import type { ClubSettings, ClubSettingsUpdate } from '../../shared/schemas/club';
import { QuantityFormat } from '../../shared/quantity-format';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { clubs } from '../db/schema';
import { NotFound } from '../errors';
import type { Scope } from '../scope/scope';

/** The settings of the caller's club (scoped by club: nobody reads another club's). */
export function clubSettings(db: Db, scope: Scope): ClubSettings {
  return settingsOfClub(db, scope.user.clubId);
}

/** The settings of one club, for server-side work that has no caller (mail jobs) and for the scoped read. */
export function settingsOfClub(db: Db, clubId: string): ClubSettings {
  const row = db
    .select({ timingBiasS: clubs.timingBiasS, timingSdS: clubs.timingSdS, distanceUnit: clubs.distanceUnit, locale: clubs.locale })
    .from(clubs)
    .where(eq(clubs.id, clubId))
    .get();
  if (!row) throw new NotFound('Your club no longer exists');
  return row;
}

/** A formatter for one club's distance unit and locale (mail and exports speak the club's units too). */
export function clubFormat(db: Db, clubId: string): QuantityFormat {
  return new QuantityFormat(settingsOfClub(db, clubId));
}

/** Stores new settings for the caller's club and audits the change (old and new values). */
export function updateClubSettings(db: Db, scope: Scope, next: ClubSettingsUpdate): ClubSettings {
  const before = clubSettings(db, scope);
  db.transaction(() => {
    db.update(clubs)
      .set({
        timingBiasS: next.timingBiasS,
        timingSdS: next.timingSdS,
        // Left out, the display settings stay as they were.
        ...(next.distanceUnit === undefined ? {} : { distanceUnit: next.distanceUnit }),
        ...(next.locale === undefined ? {} : { locale: next.locale }),
        updatedAt: new Date().toISOString(),
      })
      .where(eq(clubs.id, scope.user.clubId))
      .run();
    // Timed repetitions are solved with the calibration: profiles fitted with the old one are refitted
    // (the unit and locale change only how figures are shown, so they alone refit nothing).
    if (next.timingBiasS !== before.timingBiasS || next.timingSdS !== before.timingSdS)
      db.$client
        .prepare('DELETE FROM player_profiles WHERE player_id IN (SELECT id FROM players WHERE club_id = ?)')
        .run(scope.user.clubId);
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
