/**
 * Answers of the data-protection calls: a player's own data as one JSON file (right of access, GDPR Art. 15)
 * and the erasure of a player (Art. 17). The export carries the stored rows as they are; the schema names
 * the fields a reader relies on and lets the rest of each row through, so a new column never breaks it.
 */
import * as z from 'zod';
import { ROLES } from '../roles';

/** A stored row: its id and whatever other columns it has. */
const rowSchema = z.looseObject({ id: z.string() });

/** One guardian link of the exported player, with the guardian's name and address. */
const exportedGuardianLinkSchema = z.object({
  id: z.string(),
  guardianName: z.string(),
  guardianEmail: z.string(),
  relationship: z.string(),
  consentAt: z.string().nullable(),
  consentTextVersion: z.string().nullable(),
  consentWithdrawnAt: z.string().nullable(),
  digestOptIn: z.boolean(),
});

/** Answer of `GET /api/exports/players/:id.json` (admin): everything stored about one player. */
export const playerDataExportSchema = z
  .object({
    exportedAt: z.string(),
    player: z.looseObject({ id: z.string(), squadId: z.string(), displayName: z.string() }),
    squad: z.looseObject({ id: z.string(), name: z.string() }),
    /** The player's own account, if they have one. */
    account: z
      .object({ id: z.string(), email: z.string(), displayName: z.string(), role: z.enum(ROLES), createdAt: z.string() })
      .nullable(),
    guardianLinks: z.array(exportedGuardianLinkSchema),
    /** The training sessions the player's kicks were logged in. */
    sessions: z.array(rowSchema),
    kicks: z.array(z.looseObject({ id: z.string(), sessionId: z.string(), playerId: z.string() })),
    /** Cached reach profiles, one per technique. */
    profiles: z.array(z.looseObject({ playerId: z.string(), technique: z.string() })),
  })
  .meta({ id: 'PlayerDataExport' });
export type PlayerDataExport = z.infer<typeof playerDataExportSchema>;

/** Answer of `POST /api/admin/players/:id/erase`: done, and how many kicks lost the player's identity. */
export const erasureSchema = z.object({ erased: z.literal(true), kicksAffected: z.number().int() }).meta({ id: 'Erasure' });
export type Erasure = z.infer<typeof erasureSchema>;
