/**
 * Signed, expiring unsubscribe tokens for the one-click link (RFC 8058): the link id and an
 * expiry, with an HMAC-SHA256 over both, so the endpoint needs no sign-in and cannot be forged.
 */
import { createHmac, timingSafeEqual } from 'node:crypto';

/** How long an unsubscribe link in a digest keeps working. */
export const UNSUBSCRIBE_TTL_MS = 90 * 24 * 3600 * 1000;

function sign(secret: string, payload: string): string {
  return createHmac('sha256', `unsubscribe:${secret}`).update(payload).digest('base64url');
}

/** A token for one guardian link. */
export function unsubscribeToken(secret: string, linkId: string, now = Date.now()): string {
  const payload = `${linkId}.${now + UNSUBSCRIBE_TTL_MS}`;
  return `${payload}.${sign(secret, payload)}`;
}

/** The link id of a valid, unexpired token, or null. */
export function verifyUnsubscribeToken(secret: string, token: string, now = Date.now()): string | null {
  const parts = token.split('.');
  if (parts.length !== 3) return null;
  const [linkId, exp, sig] = parts as [string, string, string];
  const expected = Buffer.from(sign(secret, `${linkId}.${exp}`));
  const given = Buffer.from(sig);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  if (!/^\d+$/.test(exp) || Number(exp) < now) return null;
  return linkId;
}
