/**
 * Guardian links, consent and digest opt-in, and the child summary a guardian sees. Consent
 * and opt-in are separate: opting in needs active consent; withdrawing consent also opts out.
 * Every change is written to the audit log.
 */
import { audit } from '../audit';
import { randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { ChildSummary, GuardianLinkView } from '../../shared/schemas/mail';
import type { AuthUser } from '../auth/passport';
import type { Db } from '../db/client';
import { guardianLinks, players, squads, users } from '../db/schema';
import { Forbidden, HttpError, Invalid, NotFound } from '../errors';
import { CONSENT_TEXT } from './consent-text';

const guardian = alias(users, 'guardian');
const recorder = alias(users, 'recorder');

/** First name only: the most a digest or a guardian view shows of a child. */
export function firstNameOf(displayName: string): string {
  return displayName.trim().split(/\s+/)[0] ?? displayName;
}

/** Guardian-link operations for one club. */
export class GuardiansService {
  constructor(private readonly db: Db) {}

  private record(user: AuthUser, action: string, entityId: string, detail?: object): void {
    audit(this.db, { clubId: user.clubId, userId: user.id, action, entity: 'guardian_link', entityId, detail });
  }

  /** Links visible to the caller: all of the club for an admin, their own for a guardian. */
  list(user: AuthUser, onlyId?: string): GuardianLinkView[] {
    const conditions = [eq(players.clubId, user.clubId), isNull(players.deletedAt)];
    if (user.role === 'guardian') conditions.push(eq(guardianLinks.guardianUserId, user.id));
    else if (user.role !== 'admin') throw new Forbidden();
    if (onlyId) conditions.push(eq(guardianLinks.id, onlyId));
    return this.db
      .select({
        id: guardianLinks.id,
        guardianUserId: guardianLinks.guardianUserId,
        guardianName: guardian.displayName,
        guardianEmail: guardian.email,
        playerId: players.id,
        playerName: players.displayName,
        squadName: squads.name,
        relationship: guardianLinks.relationship,
        consentAt: guardianLinks.consentAt,
        consentTextVersion: guardianLinks.consentTextVersion,
        consentRecordedByName: recorder.displayName,
        consentWithdrawnAt: guardianLinks.consentWithdrawnAt,
        digestOptIn: guardianLinks.digestOptIn,
      })
      .from(guardianLinks)
      .innerJoin(players, eq(players.id, guardianLinks.playerId))
      .innerJoin(squads, eq(squads.id, players.squadId))
      .innerJoin(guardian, eq(guardian.id, guardianLinks.guardianUserId))
      .leftJoin(recorder, eq(recorder.id, guardianLinks.consentRecordedBy))
      .where(and(...conditions))
      .orderBy(players.displayName)
      .all()
      .map((r) => ({ ...r, playerFirstName: firstNameOf(r.playerName) }));
  }

  private one(user: AuthUser, id: string): GuardianLinkView {
    const link = this.list(user, id)[0];
    if (!link) throw new NotFound('No such guardian link');
    return link;
  }

  /** Links a guardian account to a player of the club (admin). */
  create(admin: AuthUser, guardianUserId: string, playerId: string, relationship = 'guardian'): GuardianLinkView {
    const g = this.db.select().from(users).where(eq(users.id, guardianUserId)).get();
    if (!g || g.clubId !== admin.clubId || g.role !== 'guardian') {
      throw new Invalid('That account is not a guardian of your club', [
        { field: 'guardianUserId', message: 'Not a guardian of this club' },
      ]);
    }
    const p = this.db.select().from(players).where(eq(players.id, playerId)).get();
    if (!p || p.clubId !== admin.clubId || p.deletedAt)
      throw new Invalid('That player is not in your club', [{ field: 'playerId', message: 'Unknown player' }]);
    const existing = this.db
      .select()
      .from(guardianLinks)
      .where(and(eq(guardianLinks.guardianUserId, guardianUserId), eq(guardianLinks.playerId, playerId)))
      .get();
    if (existing) throw new HttpError(409, 'already_linked', 'This guardian is already linked to this player');
    const id = randomUUID();
    this.db.insert(guardianLinks).values({ id, guardianUserId, playerId, relationship }).run();
    this.record(admin, 'guardian_link.created', id, { guardianUserId, playerId });
    return this.one(admin, id);
  }

  /** Removes a link (admin). */
  remove(admin: AuthUser, id: string): void {
    this.one(admin, id);
    this.db.delete(guardianLinks).where(eq(guardianLinks.id, id)).run();
    this.record(admin, 'guardian_link.removed', id);
  }

  private ownLink(user: AuthUser, id: string): GuardianLinkView {
    if (user.role !== 'guardian') throw new Forbidden('Only the guardian can give or withdraw consent');
    return this.one(user, id);
  }

  /** Records consent (with the text version) or withdraws it. */
  setConsent(user: AuthUser, id: string, consent: { consent: true; textVersion: string } | { consent: false }): GuardianLinkView {
    this.ownLink(user, id);
    const now = new Date().toISOString();
    if (consent.consent) {
      if (consent.textVersion !== CONSENT_TEXT.version) {
        throw new Invalid('The consent text has changed; read the current text and consent again', [
          { field: 'textVersion', message: `Current version is ${CONSENT_TEXT.version}` },
        ]);
      }
      this.db
        .update(guardianLinks)
        .set({
          consentAt: now,
          consentRecordedBy: user.id,
          consentTextVersion: consent.textVersion,
          consentWithdrawnAt: null,
          updatedAt: now,
        })
        .where(eq(guardianLinks.id, id))
        .run();
      this.record(user, 'consent.given', id, { textVersion: consent.textVersion });
    } else {
      this.db
        .update(guardianLinks)
        .set({ consentWithdrawnAt: now, digestOptIn: false, updatedAt: now })
        .where(eq(guardianLinks.id, id))
        .run();
      this.record(user, 'consent.withdrawn', id);
    }
    return this.one(user, id);
  }

  /** Opts in or out of the Family digest; opting in needs active consent. */
  setDigestOptIn(user: AuthUser, id: string, optIn: boolean): GuardianLinkView {
    const link = this.ownLink(user, id);
    if (optIn && (!link.consentAt || link.consentWithdrawnAt)) {
      throw new HttpError(400, 'consent_required', 'Give consent first: the digest is only sent with recorded consent');
    }
    this.db.update(guardianLinks).set({ digestOptIn: optIn, updatedAt: new Date().toISOString() }).where(eq(guardianLinks.id, id)).run();
    this.record(user, optIn ? 'digest.opted_in' : 'digest.opted_out', id);
    return this.one(user, id);
  }

  /** A guardian's view of their child: weekly reps and hit rate over the last eight weeks, and a highlight. */
  childSummary(user: AuthUser, playerId: string, now = new Date()): ChildSummary {
    const link = this.list(user).find((l) => l.playerId === playerId);
    if (!link || user.role !== 'guardian') throw new NotFound('No such child among yours');
    const since = new Date(now.getTime() - 8 * 7 * 86_400_000).toISOString();
    const weeks = this.db.$client
      .prepare(
        `SELECT date(recorded_at, 'weekday 0', '-6 days') AS weekStart, COUNT(*) AS reps, AVG(outcome = 'on_target') AS hitRate
           FROM kicks WHERE player_id = ? AND deleted_at IS NULL AND recorded_at >= ? GROUP BY weekStart ORDER BY weekStart`,
      )
      .all(playerId, since) as { weekStart: string; reps: number; hitRate: number | null }[];
    const best = this.db.$client
      .prepare(
        `SELECT technique, COUNT(*) AS n, AVG(outcome = 'on_target') AS rate FROM kicks
          WHERE player_id = ? AND deleted_at IS NULL AND recorded_at >= ? GROUP BY technique HAVING n >= 5 ORDER BY rate DESC LIMIT 1`,
      )
      .get(playerId, since) as { technique: string; n: number; rate: number } | undefined;
    return {
      playerId,
      firstName: link.playerFirstName,
      squadName: link.squadName,
      weeks,
      highlight: best
        ? `Most accurate with ${best.technique} kicks: ${Math.round(best.rate * 100)} % on target over ${best.n} repetitions`
        : null,
    };
  }
}
