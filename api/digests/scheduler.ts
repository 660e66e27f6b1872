/**
 * Runs each club's weekly digests at the club's weekday and time in the club's time zone
 * (croner). Running twice is harmless (see DigestJob), so a restart near the hour is safe.
 */
import { Cron } from 'croner';
import type { Logger } from 'pino';
import type { Db } from '../db/client';
import { clubs } from '../db/schema';
import type { DigestJob } from './digests.service';

/** Starts one cron job per club; returns a stop function. */
export function scheduleDigests(db: Db, job: DigestJob, logger: Logger): () => void {
  const crons = db
    .select()
    .from(clubs)
    .all()
    .map((club) => {
      const [hh, mm] = club.digestTime.split(':').map(Number);
      return new Cron(`${mm ?? 0} ${hh ?? 7} * * ${club.digestWeekday}`, { timezone: club.timezone, protect: true }, async () => {
        try {
          const result = await job.run({ clubId: club.id });
          logger.info({ club: club.id, result }, 'weekly digests run');
        } catch (err) {
          logger.error({ err, club: club.id }, 'weekly digests failed');
        }
      });
    });
  return () => crons.forEach((c) => c.stop());
}
