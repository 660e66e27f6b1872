import * as z from 'zod';
import { TECHNIQUES } from '../../shared/schemas/sync';

/** Query of `GET /api/players`. */
export const listPlayersQuerySchema = z.object({
  squadId: z.uuid({ error: 'squadId must be a UUID' }).optional(),
});

const isoDate = (name: string) => z.iso.date({ error: `${name} must be a date (YYYY-MM-DD)` });

/** Query of `GET /api/players/:id/progress`. */
export const progressQuerySchema = z
  .object({
    carry: z.enum(['logged', 'still-air'], { error: 'carry must be logged or still-air' }).default('logged'),
    from: isoDate('from').optional(),
    to: isoDate('to').optional(),
    technique: z.enum(TECHNIQUES, { error: `technique must be one of ${TECHNIQUES.join(', ')}` }).optional(),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { error: 'from must not be after to', path: ['from'] });

const carrySchema = z.enum(['logged', 'still-air'], { error: 'carry must be logged or still-air' }).default('logged');
const techniqueSchema = z.enum(TECHNIQUES, { error: `technique must be one of ${TECHNIQUES.join(', ')}` });

/** The carry basis query parameter shared by progress and week. */
export const carryQuerySchema = z.object({ carry: carrySchema });

/** Query of `GET /api/players/:id/kicks`. */
export const kicksQuerySchema = z.object({
  technique: techniqueSchema.optional(),
  limit: z.coerce
    .number({ error: 'limit must be a number' })
    .int()
    .min(1, { error: 'limit must be at least 1' })
    .max(1000, { error: 'limit must be at most 1000' })
    .default(200),
});

/** Query of `GET /api/players/:id/profile` and `GET /api/squads/:id/profiles`. */
export const profileQuerySchema = z.object({ technique: techniqueSchema });
