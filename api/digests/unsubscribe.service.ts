/** The one-click unsubscribe of a Family digest (RFC 8058): a signed link turns one guardian link's digests off. */
import { eq } from 'drizzle-orm';
import type { UnsubscribeResult } from '../../shared/schemas/mail';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { guardianLinks, players } from '../db/schema';
import { HttpError } from '../errors';
import { firstNameOf } from '../guardians/guardians.service';
import { verifyUnsubscribeToken } from './unsubscribe-token';

/**
 * Turns off the digests of the guardian link a valid `token` names (idempotent: a second click
 * changes nothing and audits nothing) and answers the child's first name for the confirmation.
 */
export function unsubscribe(db: Db, secret: string, token: string): UnsubscribeResult {
  const linkId = verifyUnsubscribeToken(secret, token);
  const link = linkId ? db.select().from(guardianLinks).where(eq(guardianLinks.id, linkId)).get() : undefined;
  if (!link)
    throw new HttpError(
      400,
      'unsubscribe_invalid',
      'This unsubscribe link is not valid or has expired; sign in to change your digest settings',
    );
  if (link.digestOptIn) {
    db.update(guardianLinks).set({ digestOptIn: false, updatedAt: new Date().toISOString() }).where(eq(guardianLinks.id, link.id)).run();
    audit(db, { userId: link.guardianUserId, action: 'digest.unsubscribed', entity: 'guardian_link', entityId: link.id });
  }
  const player = db.select({ name: players.displayName }).from(players).where(eq(players.id, link.playerId)).get();
  return { unsubscribed: true, firstName: player ? firstNameOf(player.name) : '' };
}
