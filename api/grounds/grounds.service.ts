/** Training grounds of the caller's club: listed for staff, created and corrected by admins. */
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { Ground, GroundInput } from '../../shared/schemas/grounds';
import type { Db } from '../db/client';
import { trainingGrounds } from '../db/schema';
import { NotFound } from '../errors';
import type { Scope } from '../scope/scope';

type GroundRow = typeof trainingGrounds.$inferSelect;

/** A ground row as the API answers it. */
export function groundOf(r: GroundRow): Ground {
  return {
    id: r.id,
    name: r.name,
    latitude: r.latitude,
    longitude: r.longitude,
    altitudeM: r.altitudeM,
    kickingBearingDeg: r.kickingBearingDeg,
  };
}

/** The club's grounds by name. */
export function listGrounds(db: Db, scope: Scope): Ground[] {
  return db
    .select()
    .from(trainingGrounds)
    .where(eq(trainingGrounds.clubId, scope.user.clubId))
    .orderBy(trainingGrounds.name)
    .all()
    .map(groundOf);
}

/** One ground of the caller's club, or NotFound (another club's ground does not exist for the caller). */
export function groundRow(db: Db, scope: Scope, id: string): GroundRow {
  const row = db
    .select()
    .from(trainingGrounds)
    .where(and(eq(trainingGrounds.id, id), eq(trainingGrounds.clubId, scope.user.clubId)))
    .get();
  if (!row) throw new NotFound('No such training ground in your club');
  return row;
}

/** Adds a ground to the caller's club. */
export function createGround(db: Db, scope: Scope, input: GroundInput): Ground {
  const id = randomUUID();
  db.insert(trainingGrounds)
    .values({ id, clubId: scope.user.clubId, ...input })
    .run();
  return groundOf(groundRow(db, scope, id));
}

/** Corrects a ground. Sessions keep the conditions they were started with; new ones use the new values. */
export function updateGround(db: Db, scope: Scope, id: string, input: GroundInput): Ground {
  groundRow(db, scope, id);
  db.update(trainingGrounds)
    .set({ ...input, updatedAt: new Date().toISOString() })
    .where(and(eq(trainingGrounds.id, id), eq(trainingGrounds.clubId, scope.user.clubId)))
    .run();
  return groundOf(groundRow(db, scope, id));
}
