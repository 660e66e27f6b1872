import type { ImportAnswer } from './import-types';

/**
 * "3 problems in 2 of 412 rows": how much of a file the server refused, counted the way a coach
 * fixes it (rows to correct), not only as a number of messages.
 */
export function problemsSentence(answer: ImportAnswer<unknown>): string {
  const problems = answer.errors.length;
  const rows = new Set(answer.errors.map((error) => error.row)).size;
  return `${problems} ${problems === 1 ? 'problem' : 'problems'} in ${rows} of ${answer.rows} ${answer.rows === 1 ? 'row' : 'rows'}`;
}
