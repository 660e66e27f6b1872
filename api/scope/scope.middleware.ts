/**
 * Attaches the caller's `Scope` to the request after authentication, so routers read
 * `req.scope` instead of recomputing (or forgetting) visibility.
 */
import type { RequestHandler } from 'express';
import type { Db } from '../db/client';
import { Unauthorized } from '../errors';
import { Scope } from './scope';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- Express's request types live in a global namespace; augmenting them needs one
  namespace Express {
    interface Request {
      /** The caller's scope; set by `attachScope` on every authenticated route. */
      scope?: Scope;
    }
  }
}

/** Computes and attaches the scope; requires `req.user`. */
export function attachScope(db: Db): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(new Unauthorized());
    req.scope = Scope.for(db, req.user);
    next();
  };
}

/** The request's scope, or 401 if authentication did not run. */
export function scopeOf(req: Express.Request): Scope {
  if (!req.scope) throw new Unauthorized();
  return req.scope;
}
