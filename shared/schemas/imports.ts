/**
 * The answers of `POST /api/imports/roster` and `POST /api/imports/kicks`: a preview (`dryRun=true`) or a
 * commit, with each refused row and what the import did or would do. One definition for the server's import
 * services, the client's import screens and the OpenAPI document.
 */
import * as z from 'zod';

/** One problem with one cell (or row) of an upload. */
export const importRowErrorSchema = z
  .object({
    /** The row's line number in the file: the header row is 1, so the first data row is 2. */
    row: z.number().int(),
    /** The column the problem is in, as the file's header names it. */
    column: z.string(),
    /** Why the row was refused, worded by the server for the coach. */
    message: z.string(),
  })
  .meta({ id: 'ImportRowError' });
export type ImportRowError = z.infer<typeof importRowErrorSchema>;

/** What a roster import did (commit) or would do (preview). */
export const rosterSummarySchema = z
  .object({
    squadsCreated: z.number().int(),
    playersCreated: z.number().int(),
    playersUpdated: z.number().int(),
    guardiansCreated: z.number().int(),
    linksCreated: z.number().int(),
  })
  .meta({ id: 'RosterSummary' });
export type RosterSummary = z.infer<typeof rosterSummarySchema>;

/** What a measured-kick import did (commit) or would do (preview). */
export const kicksSummarySchema = z
  .object({
    kicksCreated: z.number().int(),
    kicksSkipped: z.number().int(),
    /** The training session the kicks were filed under (null for a preview). */
    sessionId: z.string().nullable(),
  })
  .meta({ id: 'KicksSummary' });
export type KicksSummary = z.infer<typeof kicksSummarySchema>;

/** The part of an import answer both imports share. */
const importAnswerBaseSchema = z.object({
  /** Whether nothing was written (a preview). */
  dryRun: z.boolean(),
  /** The stored upload, once committed (null for a preview). */
  uploadId: z.string().nullable(),
  /** Whether this exact file was committed before, so nothing was applied again. */
  alreadyImported: z.boolean(),
  /** Data rows the server read. */
  rows: z.number().int(),
  errors: z.array(importRowErrorSchema),
});

/** A preview or commit answer of either import, with the summary of that import. */
export type ImportAnswer<S> = z.infer<typeof importAnswerBaseSchema> & { summary: S };

/** Answer of `POST /api/imports/roster` (200 for a preview or a file imported before, 201 for a commit). */
export const rosterImportAnswerSchema = importAnswerBaseSchema.extend({ summary: rosterSummarySchema }).meta({ id: 'RosterImportAnswer' });

/** Answer of `POST /api/imports/kicks` (200 for a preview or a file imported before, 201 for a commit). */
export const kicksImportAnswerSchema = importAnswerBaseSchema.extend({ summary: kicksSummarySchema }).meta({ id: 'KicksImportAnswer' });
