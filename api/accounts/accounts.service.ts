/**
 * Invites, invitation acceptance and password reset. Responses never reveal whether an
 * e-mail has an account (the forgot-password answer is always the same).
 */
import { audit } from '../audit';
import bcrypt from 'bcryptjs';
import { randomUUID } from 'node:crypto';
import { and, eq, gt, inArray } from 'drizzle-orm';
import type { InviteCreated, InviteView } from '../../shared/schemas/accounts';
import type { InviteRequest } from '../../shared/schemas/mail';
import type { AuthUser } from '../auth/passport';
import type { AppConfig } from '../config';
import type { Db } from '../db/client';
import { accountTokens, clubs, guardianLinks, players, squads, squadStaff, users } from '../db/schema';
import { revokeAllRefreshFamilies } from '../auth/tokens';
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
  invite(admin: AuthUser, req: InviteRequest): InviteCreated {
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
      const { expiresAt } = this.mailInvite(admin, { id: userId, email: req.email, displayName: req.displayName }, now);
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

  /** Issues an invite token and queues its mail (inside the caller's transaction; the caller flushes). */
  private mailInvite(admin: AuthUser, user: { id: string; email: string; displayName: string }, now: string): { expiresAt: string } {
    const { token, expiresAt } = issueAccountToken(this.db, user.id, 'invite', admin.id);
    const club = this.db.select({ name: clubs.name }).from(clubs).where(eq(clubs.id, admin.clubId)).get();
    const mail = inviteMail({
      name: user.displayName,
      clubName: club?.name ?? 'your club',
      inviter: admin.displayName,
      link: `${this.config.publicUrl}/accept-invite?token=${token}`,
    });
    this.mailer.queue({ clubId: admin.clubId, kind: 'invite', dedupeKey: `invite:${user.id}:${now}`, to: user.email, ...mail });
    return { expiresAt };
  }

  /**
   * Sends a fresh invitation to an account of the admin's club that never set a password: an expired
   * invite, or a guardian the roster import created (who had no way in before). Earlier links stop working.
   */
  reinvite(admin: AuthUser, userId: string): InviteCreated {
    const user = this.db.select().from(users).where(eq(users.id, userId)).get();
    if (!user || user.clubId !== admin.clubId) throw new NotFound('No such user in your club');
    if (user.passwordHash) throw new Invalid('This account already has a password; its owner can reset it from the sign-in page');
    if (user.disabledAt) throw new Invalid('This account is disabled');
    const now = new Date().toISOString();
    const result = this.db.transaction(() => {
      const { expiresAt } = this.mailInvite(admin, user, now);
      this.db.update(users).set({ invitedAt: now, updatedAt: now }).where(eq(users.id, userId)).run();
      audit(this.db, { clubId: admin.clubId, userId: admin.id, action: 'invite.renewed', entity: 'user', entityId: userId });
      return { userId, email: user.email, expiresAt };
    });
    void this.mailer.flush();
    return result;
  }

  /** Disables an account of the admin's club: it can no longer sign in, and every device it is signed in on is signed out. */
  disable(admin: AuthUser, userId: string): void {
    const user = this.db.select().from(users).where(eq(users.id, userId)).get();
    if (!user || user.clubId !== admin.clubId) throw new NotFound('No such user in your club');
    if (user.id === admin.id) throw new Invalid('You cannot disable your own account');
    const now = new Date().toISOString();
    this.db.transaction(() => {
      this.db.update(users).set({ disabledAt: now, updatedAt: now }).where(eq(users.id, userId)).run();
      revokeAllRefreshFamilies(this.db, userId);
      audit(this.db, { clubId: admin.clubId, userId: admin.id, action: 'user.disabled', entity: 'user', entityId: userId });
    });
  }

  /** Who an invitation is for (the accept page shows it). */
  describeInvite(token: string): InviteView {
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

  /**
   * Mails a reset link when the account exists and is active; answers the same either way. At most
   * `resetMailsPerAccountPerHour` links an hour per account: past that nothing is sent and the last link
   * keeps working (each new link replaces the previous one, so a stranger must not be able to keep
   * voiding it).
   */
  forgotPassword(email: string): void {
    const user = this.db.select().from(users).where(eq(users.email, email)).get();
    if (!user || user.disabledAt || !user.passwordHash) return;
    const hourAgo = new Date(Date.now() - 3600 * 1000).toISOString();
    const recent = this.db
      .select({ id: accountTokens.id })
      .from(accountTokens)
      .where(and(eq(accountTokens.userId, user.id), eq(accountTokens.kind, 'reset'), gt(accountTokens.createdAt, hourAgo)))
      .all().length;
    if (recent >= this.config.resetMailsPerAccountPerHour) return;
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
      // Whoever knew the old password may hold a signed-in device: a reset ends every sign-in.
      revokeAllRefreshFamilies(this.db, userId);
      audit(this.db, { userId, action: 'password.reset', entity: 'user', entityId: userId });
    });
  }
}
