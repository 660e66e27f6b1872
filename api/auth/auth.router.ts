/**
 * `/api/auth`: login (rate-limited per address, and per account and address together; an account failing
 * from many addresses is slowed down by AuthService, not locked), refresh, logout, invites and resets.
 */
import { Router } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { loginRequestSchema, refreshRequestSchema } from '../../shared/schemas/auth';
import { acceptInviteSchema, forgotPasswordSchema, resetPasswordSchema } from '../../shared/schemas/mail';
import type { AccountsService } from '../accounts/accounts.service';
import type { AppConfig } from '../config';
import { HttpError, parseOrThrow } from '../errors';
import type { AuthService } from './auth.service';

const WINDOW_MS = 15 * 60 * 1000;

function tooMany(message: string): HttpError {
  return new HttpError(429, 'rate_limited', message);
}

/** Builds the auth router. Failed attempts count toward both limits; successful ones do not. */
export function authRouter(auth: AuthService, accounts: AccountsService, config: AppConfig): Router {
  const router = Router();
  const perIp = rateLimit({
    windowMs: WINDOW_MS,
    limit: config.loginFailuresPerIp,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? 'unknown')}`,
    handler: (_req, _res, next) => next(tooMany('Too many sign-in attempts from this network; wait 15 minutes and try again')),
  });
  const perAccount = rateLimit({
    windowMs: WINDOW_MS,
    limit: config.loginFailuresPerAccount,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => {
      const body: unknown = req.body;
      const email = body && typeof body === 'object' && 'email' in body && typeof body.email === 'string' ? body.email : '';
      // Account and address together: failures from elsewhere cannot lock the owner out of their own device.
      return `acct:${email.trim().toLowerCase()}|ip:${ipKeyGenerator(req.ip ?? 'unknown')}`;
    },
    handler: (_req, _res, next) =>
      next(tooMany('Too many failed sign-ins for this account from this network; wait 15 minutes and try again')),
  });

  router.post('/login', perIp, perAccount, async (req, res) => {
    const { email, password } = parseOrThrow(loginRequestSchema, req.body, 'Sign-in');
    res.json(await auth.login(email, password));
  });

  router.post('/refresh', (req, res) => {
    const { refreshToken } = parseOrThrow(refreshRequestSchema, req.body, 'Refresh');
    res.json(auth.refresh(refreshToken));
  });

  router.post('/logout', (req, res) => {
    const { refreshToken } = parseOrThrow(refreshRequestSchema, req.body, 'Sign-out');
    auth.logout(refreshToken);
    res.status(204).end();
  });

  const perIpAccountMail = rateLimit({
    windowMs: WINDOW_MS,
    limit: config.loginFailuresPerIp,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `mail:${ipKeyGenerator(req.ip ?? 'unknown')}`,
    handler: (_req, _res, next) => next(tooMany('Too many requests from this network; wait 15 minutes and try again')),
  });

  router.get('/invite', (req, res) => {
    const token = typeof req.query['token'] === 'string' ? req.query['token'] : '';
    const { token: checked } = parseOrThrow(acceptInviteSchema.pick({ token: true }), { token }, 'Invite');
    res.json(accounts.describeInvite(checked));
  });

  router.post('/accept-invite', perIp, async (req, res) => {
    const { token, password } = parseOrThrow(acceptInviteSchema, req.body, 'Invite');
    const userId = await accounts.acceptInvite(token, password);
    res.json(auth.signInUser(userId));
  });

  router.post('/forgot-password', perIpAccountMail, (req, res) => {
    const { email } = parseOrThrow(forgotPasswordSchema, req.body, 'Password reset');
    // The answer leaves before the lookup and the mail are done, so its timing says nothing about the account.
    setImmediate(() => {
      try {
        accounts.forgotPassword(email);
      } catch (err) {
        req.log?.error({ err }, 'password-reset mail failed');
      }
    });
    res
      .status(202)
      .json({ message: 'If an account uses this e-mail, a link to choose a new password is on its way. It works for 1 hour.' });
  });

  router.post('/reset-password', perIp, async (req, res) => {
    const { token, password } = parseOrThrow(resetPasswordSchema, req.body, 'Password reset');
    await accounts.resetPassword(token, password);
    res.status(204).end();
  });

  return router;
}
