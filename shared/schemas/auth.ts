import * as z from 'zod';
import { ROLES } from '../roles';

/** Body of `POST /api/auth/login`. */
export const loginRequestSchema = z.strictObject({
  email: z
    .string({ error: 'E-mail is required' })
    .trim()
    .toLowerCase()
    .pipe(z.email({ error: 'Not a valid e-mail address' })),
  password: z
    .string({ error: 'Password is required' })
    .min(1, { error: 'Password is required' })
    .max(200, { error: 'Password is too long' }),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

/** Body of `POST /api/auth/refresh` and `POST /api/auth/logout`. */
export const refreshRequestSchema = z.strictObject({
  refreshToken: z.string({ error: 'Refresh token is required' }).min(20, { error: 'Not a refresh token' }).max(500),
});
export type RefreshRequest = z.infer<typeof refreshRequestSchema>;

/** The signed-in user as the API reports it (`user` in the login answer, and `GET /api/me`). */
export const sessionUserSchema = z.object({
  id: z.string(),
  email: z.string(),
  displayName: z.string(),
  role: z.enum(ROLES),
  clubId: z.string(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

/** Answer of `POST /api/auth/login`, `POST /api/auth/refresh` and `POST /api/auth/accept-invite`. */
export const authTokensSchema = z.object({ accessToken: z.string(), refreshToken: z.string(), user: sessionUserSchema });
export type AuthTokens = z.infer<typeof authTokensSchema>;

/** Answer of `GET /api/me`: the user plus the club's name for the app shell. */
export interface MeResponse {
  user: SessionUser;
  club: { id: string; name: string };
  /** For a player account: their own player row id; for a guardian: linked children. */
  playerId: string | null;
  childPlayerIds: string[];
}
