import type * as z from 'zod';

/**
 * Thrown by the stores when a change would be rejected by the server's schema. Checked on the
 * phone, before anything is written, because a kick the server rejects hours later on the
 * training-ground car park is much harder to fix than one refused at the tap.
 */
export class InvalidEntryError extends Error {
  constructor(
    message: string,
    /** Each offending field and why, in the shared schema's words. */
    readonly fields: Readonly<Record<string, string>>,
  ) {
    super(message);
    this.name = 'InvalidEntryError';
  }
}

/** Parses `data` with one of the shared schemas or throws {@link InvalidEntryError}. */
export function validateEntry<S extends z.ZodType>(schema: S, data: unknown): z.infer<S> {
  const result = schema.safeParse(data);
  if (result.success) {
    return result.data;
  }
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const path = issue.path.map(String).join('.') || 'entry';
    fields[path] ??= issue.message;
  }
  throw new InvalidEntryError(Object.values(fields).join('; '), fields);
}
