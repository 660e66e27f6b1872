/**
 * The one server-side scoping module (docs/design.md §2). Every router asks a `Scope` what the caller
 * may read or write; nothing else decides visibility.
 *
 *  - Everything is limited to the caller's club first.
 *  - admin: every squad and player of the club.
 *  - head_coach / assistant_coach: the squads they staff (squad_staff) and those squads' players.
 *  - player: their own player row (and their squad's name), nothing of other players.
 *  - guardian: their linked children's player rows, nothing else.
 */
import { and, eq, inArray, isNull, type SQL } from 'drizzle-orm';
import type { AuthUser } from '../auth/passport';
import type { Db } from '../db/client';
import { guardianLinks, players, squads, squadStaff } from '../db/schema';

/** What one caller may see and change, computed once per request. */
export class Scope {
  private constructor(
    readonly user: AuthUser,
    /** Squads whose sessions, drills and kicks the caller may read. */
    readonly readableSquadIds: readonly string[],
    /** Squads the caller may log into (start sessions, log/edit/void kicks). */
    readonly writableSquadIds: readonly string[],
    /** For players and guardians: exactly the player rows they may read. `null` = by squad. */
    readonly ownPlayerIds: readonly string[] | null,
  ) {}

  /** Computes the scope of a signed-in user. */
  static for(db: Db, user: AuthUser): Scope {
    const live = isNull(squads.deletedAt);
    switch (user.role) {
      case 'admin': {
        const ids = db
          .select({ id: squads.id })
          .from(squads)
          .where(and(eq(squads.clubId, user.clubId), live))
          .all()
          .map((r) => r.id);
        return new Scope(user, ids, ids, null);
      }
      case 'head_coach':
      case 'assistant_coach': {
        const ids = db
          .select({ id: squads.id })
          .from(squadStaff)
          .innerJoin(squads, eq(squads.id, squadStaff.squadId))
          .where(and(eq(squadStaff.userId, user.id), eq(squads.clubId, user.clubId), live))
          .all()
          .map((r) => r.id);
        return new Scope(user, ids, ids, null);
      }
      case 'player': {
        const own = db
          .select({ id: players.id, squadId: players.squadId })
          .from(players)
          .where(and(eq(players.userId, user.id), eq(players.clubId, user.clubId), isNull(players.deletedAt)))
          .all();
        return new Scope(
          user,
          [],
          [],
          own.map((p) => p.id),
        );
      }
      case 'guardian': {
        const own = db
          .select({ id: players.id })
          .from(guardianLinks)
          .innerJoin(players, eq(players.id, guardianLinks.playerId))
          .where(and(eq(guardianLinks.guardianUserId, user.id), eq(players.clubId, user.clubId), isNull(players.deletedAt)))
          .all();
        return new Scope(
          user,
          [],
          [],
          own.map((p) => p.id),
        );
      }
    }
  }

  /** Whether the caller may read this squad's sessions and players. */
  canReadSquad(squadId: string): boolean {
    return this.readableSquadIds.includes(squadId);
  }

  /** Whether the caller may log, edit or void kicks for this squad. */
  canWriteSquad(squadId: string): boolean {
    return this.writableSquadIds.includes(squadId);
  }

  /** SQL condition on `players` limiting rows to what the caller may read. */
  playerCondition(): SQL {
    const base = and(eq(players.clubId, this.user.clubId), isNull(players.deletedAt)) as SQL;
    if (this.ownPlayerIds) return and(base, inArray(players.id, [...this.ownPlayerIds])) as SQL;
    return and(base, inArray(players.squadId, [...this.readableSquadIds])) as SQL;
  }

  /** Whether the caller may read this player (checked against the database row's squad). */
  canReadPlayer(player: { id: string; squadId: string; clubId: string }): boolean {
    if (player.clubId !== this.user.clubId) return false;
    if (this.ownPlayerIds) return this.ownPlayerIds.includes(player.id);
    return this.canReadSquad(player.squadId);
  }

  /** SQL condition on `squads` for the squads the caller may list. */
  squadCondition(db: Db): SQL {
    const base = and(eq(squads.clubId, this.user.clubId), isNull(squads.deletedAt)) as SQL;
    if (this.ownPlayerIds) {
      // A player sees the squad they belong to; a guardian sees no squads (only their child).
      if (this.user.role !== 'player' || this.ownPlayerIds.length === 0) return and(base, inArray(squads.id, [])) as SQL;
      const ids = db
        .select({ squadId: players.squadId })
        .from(players)
        .where(inArray(players.id, [...this.ownPlayerIds]))
        .all()
        .map((r) => r.squadId);
      return and(base, inArray(squads.id, ids)) as SQL;
    }
    return and(base, inArray(squads.id, [...this.readableSquadIds])) as SQL;
  }
}
