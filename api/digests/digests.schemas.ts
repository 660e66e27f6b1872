import * as z from 'zod';

/** Body of `POST /api/digests/run`: the week to send (its Monday); the last full week when left out. */
export const runSchema = z
  .strictObject({ weekStart: z.iso.date({ error: 'weekStart must be a date (YYYY-MM-DD)' }).optional() })
  .default({});
