/**
 * Sign-in, refresh and sign-out. Password checks use bcryptjs; a missing account still costs
 * one bcrypt comparison at the same cost as a real one, so response time does not reveal which
 * e-mails exist. An account that keeps failing is slowed down, never locked.
 */
import bcrypt from 'bcryptjs';
import { eq } from 'drizzle-orm';
import type { AuthTokens, SessionUser } from '../../shared/schemas/auth';
import type { AppConfig } from '../config';
import type { Db } from '../db/client';
import { users } from '../db/schema';
import { Unauthorized } from '../errors';
import { LoginSlowdown } from './login-slowdown';
import { issueRefreshToken, revokeRefreshFamily, rotateRefreshToken, signAccessToken } from './tokens';

/** Signs users in and keeps their tokens turning over. */
export class AuthService {
  /**
   * A hash of nothing, compared against when the account does not exist or has no password yet. Same
   * cost as real accounts: a cheaper decoy answered unknown e-mails 75 times faster.
   */
  private readonly decoyHash: string;
  private readonly slowdown: LoginSlowdown;

  constructor(
    private readonly db: Db,
    private readonly config: AppConfig,
  ) {
    this.decoyHash = bcrypt.hashSync('loftline-decoy-password', config.bcryptCost);
    this.slowdown = new LoginSlowdown(config.loginFailuresPerAccount, config.loginSlowdownBaseMs, config.loginSlowdownMaxMs);
  }

  /** Checks the password and issues a token pair, or throws 401 with one message for every failure. */
  async login(email: string, password: string): Promise<AuthTokens> {
    const account = email.trim().toLowerCase();
    await this.slowdown.wait(account);
    const row = this.db.select().from(users).where(eq(users.email, email)).get();
    const ok = await bcrypt.compare(password, row?.passwordHash ?? this.decoyHash);
    if (!row || !row.passwordHash || !ok || row.disabledAt) {
      this.slowdown.fail(account);
      throw new Unauthorized('E-mail or password is wrong', 'invalid_credentials');
    }
    this.slowdown.clear(account);
    return this.tokensFor(row.id, issueRefreshToken(this.db, this.config, row.id).token);
  }

  /** Issues a token pair for a user who just proved themselves another way (an accepted invite). */
  signInUser(userId: string): AuthTokens {
    return this.tokensFor(userId, issueRefreshToken(this.db, this.config, userId).token);
  }

  /** Rotates a refresh token into a new pair; reuse of a rotated token revokes its family. */
  refresh(refreshToken: string): AuthTokens {
    const result = rotateRefreshToken(this.db, this.config, refreshToken);
    if (!result.ok) {
      const message =
        result.reason === 'reused'
          ? 'This sign-in was already used elsewhere and has been ended for safety; sign in again'
          : result.reason === 'expired'
            ? 'Your sign-in has expired; sign in again'
            : 'Your sign-in is not valid; sign in again';
      throw new Unauthorized(message, 'invalid_refresh_token');
    }
    return this.tokensFor(result.userId, result.token);
  }

  /** Ends the refresh-token family (this device's sign-in). */
  logout(refreshToken: string): void {
    revokeRefreshFamily(this.db, refreshToken);
  }

  /** Hashes a password at the configured cost. */
  hashPassword(password: string): Promise<string> {
    return bcrypt.hash(password, this.config.bcryptCost);
  }

  private tokensFor(userId: string, refreshToken: string): AuthTokens {
    const row = this.db.select().from(users).where(eq(users.id, userId)).get();
    if (!row || row.disabledAt) throw new Unauthorized('This account is disabled', 'invalid_credentials');
    const user: SessionUser = { id: row.id, email: row.email, displayName: row.displayName, role: row.role, clubId: row.clubId };
    return { accessToken: signAccessToken(this.config, user), refreshToken, user };
  }
}
