/**
 * passport-jwt wiring: verifies the Bearer access token and loads the (still enabled) user,
 * so a disabled account loses access as soon as its token is checked.
 */
import { eq } from 'drizzle-orm';
import type { RequestHandler } from 'express';
import { Passport } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import { STAFF_ROLES, type Role } from '../../shared/roles';
import type { AppConfig } from '../config';
import type { Db } from '../db/client';
import { users } from '../db/schema';
import { Forbidden, Unauthorized } from '../errors';
import type { AccessClaims } from './tokens';

/** The authenticated caller, as every router sees it on `req.user`. */
export interface AuthUser {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  clubId: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- Express's request types live in a global namespace; augmenting them needs one
  namespace Express {
    // passport augments Express.User; make it our AuthUser.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type -- declaration merging: passport's empty User becomes our AuthUser
    interface User extends AuthUser {}
  }
}

/** Builds the `requireAuth` middleware for an app instance (one Passport per app, no globals). */
export function createAuthMiddleware(db: Db, config: AppConfig): RequestHandler {
  const passport = new Passport();
  passport.use(
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
        secretOrKey: config.jwtSecret,
        algorithms: ['HS256'],
        issuer: 'loftline',
      },
      (claims: AccessClaims, done: (err: unknown, user?: AuthUser | false) => void) => {
        // Every token we sign expires; one without `exp` was not made by this server's rules (RFC 7519 §4.1.4).
        if (claims.typ !== 'access' || typeof claims.exp !== 'number') return done(null, false);
        const row = db.select().from(users).where(eq(users.id, claims.sub)).get();
        if (!row || row.disabledAt) return done(null, false);
        done(null, { id: row.id, email: row.email, displayName: row.displayName, role: row.role, clubId: row.clubId });
      },
    ),
  );
  const authenticate = passport.authenticate('jwt', { session: false, failWithError: true });
  return (req, res, next) => {
    authenticate(req, res, (err?: unknown) => {
      if (err || !req.user) {
        next(new Unauthorized('Your sign-in has expired or is not valid; sign in again', 'invalid_token'));
        return;
      }
      next();
    });
  };
}

/** Allows only the listed roles (after `requireAuth`). */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(new Unauthorized());
    if (!roles.includes(req.user.role)) return next(new Forbidden());
    next();
  };
}

/** Allows club staff only (`STAFF_ROLES`: admin, head coach, assistant coach). */
export function requireStaff(): RequestHandler {
  return requireRole(...STAFF_ROLES);
}
