import * as z from 'zod';

/** Query of `GET /api/players`. */
export const listPlayersQuerySchema = z.object({
  squadId: z.uuid({ error: 'squadId must be a UUID' }).optional(),
});
