/**
 * Invites, invitation acceptance and password reset. Responses never reveal whether an
 * e-mail has an account (the forgot-password answer is always the same).
 */
import { audit } from '../audit';
import bcrypt from 'bcryptjs';
import { randomUUID } from 'node:crypto';
import { and, eq, inArray } from 'drizzle-orm';
import type { InviteRequest } from '../../shared/schemas/mail';
import type { AuthUser } from '../auth/passport';
import type { AppConfig } from '../config';
import type { Db } from '../db/client';
import { clubs, guardianLinks, players, squads, squadStaff, users } from '../db/schema';
import { Invalid, NotFound } from '../errors';
import { inviteMail, resetMail } from '../mail/templates';
import type { Mailer } from '../mail/mailer';
import { checkAccountToken, consumeAccountToken, issueAccountToken } from './account-tokens';

/** Account mail flows. */
export class AccountsService {
  constructor(
    private readonly db: Db,
    private readonly config: AppConfig,
    private readonly mailer: Mailer,
  ) {}

  /** Creates a not-yet-activated account with its links and mails the invitation. */
  invite(admin: AuthUser, req: InviteRequest): { userId: string; email: string; expiresAt: string } {
    if (this.db.select({ id: users.id }).from(users).where(eq(users.email, req.email)).get()) {
      throw new Invalid('An account with this e-mail already exists', [{ field: 'email', message: 'Already has an account' }]);
    }
    const staff = req.role === 'head_coach' || req.role === 'assistant_coach';
    if (req.squadIds?.length) {
      const found = this.db
        .select({ id: squads.id })
        .from(squads)
        .where(and(inArray(squads.id, req.squadIds), eq(squads.clubId, admin.clubId)))
        .all();
      if (found.length !== new Set(req.squadIds).size)
        throw new Invalid('A squad is not in your club', [{ field: 'squadIds', message: 'Unknown squad' }]);
    }
    if ((req.role === 'player' || req.role === 'guardian') && !req.playerId) {
      throw new Invalid(`A ${req.role} invite needs the player it is for`, [{ field: 'playerId', message: 'Required for this role' }]);
    }
    if (req.playerId) {
      const p = this.db.select().from(players).where(eq(players.id, req.playerId)).get();
      if (!p || p.clubId !== admin.clubId)
        throw new Invalid('The player is not in your club', [{ field: 'playerId', message: 'Unknown player' }]);
      if (req.role === 'player' && p.userId)
        throw new Invalid('This player already has an account', [{ field: 'playerId', message: 'Already linked' }]);
    }
    const userId = randomUUID();
    const now = new Date().toISOString();
    const result = this.db.transaction(() => {
      this.db
        .insert(users)
        .values({
          id: userId,
          clubId: admin.clubId,
          email: req.email,
          displayName: req.displayName,
          role: req.role,
          passwordHash: null,
          invitedAt: now,
        })
        .run();
      if (staff && req.squadIds) for (const squadId of new Set(req.squadIds)) this.db.insert(squadStaff).values({ squadId, userId }).run();
      if (req.role === 'player' && req.playerId) this.db.update(players).set({ userId }).where(eq(players.id, req.playerId)).run();
      if (req.role === 'guardian' && req.playerId)
        this.db.insert(guardianLinks).values({ id: randomUUID(), guardianUserId: userId, playerId: req.playerId }).run();
      const { token, expiresAt } = issueAccountToken(this.db, userId, 'invite', admin.id);
      const club = this.db.select({ name: clubs.name }).from(clubs).where(eq(clubs.id, admin.clubId)).get();
      const mail = inviteMail({
        name: req.displayName,
        clubName: club?.name ?? 'your club',
        inviter: admin.displayName,
        link: `${this.config.publicUrl}/accept-invite?token=${token}`,
      });
      this.mailer.queue({ clubId: admin.clubId, kind: 'invite', dedupeKey: `invite:${userId}:${now}`, to: req.email, ...mail });
      audit(this.db, {
        clubId: admin.clubId,
        userId: admin.id,
        action: 'invite.created',
        entity: 'user',
        entityId: userId,
        detail: { role: req.role },
      });
      return { userId, email: req.email, expiresAt };
    });
    void this.mailer.flush();
    return result;
  }

  /** Who an invitation is for (the accept page shows it). */
  describeInvite(token: string): { email: string; displayName: string; role: string } {
    const { userId } = checkAccountToken(this.db, token, 'invite');
    const user = this.db.select().from(users).where(eq(users.id, userId)).get();
    if (!user) throw new NotFound();
    return { email: user.email, displayName: user.displayName, role: user.role };
  }

  /** Sets the password of an invited account; returns its id so the caller can sign it in. */
  async acceptInvite(token: string, password: string): Promise<string> {
    checkAccountToken(this.db, token, 'invite');
    const hash = await bcrypt.hash(password, this.config.bcryptCost);
    return this.db.transaction(() => {
      const { id, userId } = checkAccountToken(this.db, token, 'invite');
      consumeAccountToken(this.db, id);
      this.db.update(users).set({ passwordHash: hash, updatedAt: new Date().toISOString() }).where(eq(users.id, userId)).run();
      audit(this.db, { userId, action: 'invite.accepted', entity: 'user', entityId: userId });
      return userId;
    });
  }

  /** Mails a reset link when the account exists and is active; answers the same either way. */
  forgotPassword(email: string): void {
    const user = this.db.select().from(users).where(eq(users.email, email)).get();
    if (!user || user.disabledAt || !user.passwordHash) return;
    const { token } = issueAccountToken(this.db, user.id, 'reset', null);
    const mail = resetMail({ name: user.displayName, link: `${this.config.publicUrl}/reset-password?token=${token}` });
    this.mailer.queue({
      clubId: user.clubId,
      kind: 'password_reset',
      dedupeKey: `reset:${user.id}:${Date.now()}`,
      to: user.email,
      ...mail,
    });
    void this.mailer.flush();
  }

  /** Sets a new password from a reset token. */
  async resetPassword(token: string, password: string): Promise<void> {
    checkAccountToken(this.db, token, 'reset');
    const hash = await bcrypt.hash(password, this.config.bcryptCost);
    this.db.transaction(() => {
      const { id, userId } = checkAccountToken(this.db, token, 'reset');
      consumeAccountToken(this.db, id);
      this.db.update(users).set({ passwordHash: hash, updatedAt: new Date().toISOString() }).where(eq(users.id, userId)).run();
      audit(this.db, { userId, action: 'password.reset', entity: 'user', entityId: userId });
    });
  }
}
