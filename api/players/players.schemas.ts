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
    from: isoDate('from').optional(),
    to: isoDate('to').optional(),
    technique: z.enum(TECHNIQUES, { error: `technique must be one of ${TECHNIQUES.join(', ')}` }).optional(),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { error: 'from must not be after to', path: ['from'] });
