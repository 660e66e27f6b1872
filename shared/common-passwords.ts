/**
 * A small list of passwords that are long enough to pass the length rule but far too common to
 * be safe (compiled from memory of widely published breach top lists; not exhaustive), plus our
 * own demo password. Checked case-insensitively when a password is set.
 */
export const COMMON_PASSWORDS: ReadonlySet<string> = new Set([
  '1234567890',
  '0123456789',
  '0987654321',
  '1111111111',
  '0000000000',
  '1231231234',
  '123123123123',
  '1234512345',
  '123456789a',
  'a123456789',
  '1q2w3e4r5t',
  '1qaz2wsx3edc',
  'qwertyuiop',
  'qwerty1234',
  'qwerty12345',
  'asdfghjkl1',
  'zxcvbnm123',
  'password12',
  'password123',
  'password1234',
  'passw0rd12',
  'p@ssw0rd12',
  'iloveyou12',
  'iloveyou123',
  'football12',
  'football123',
  'football1234',
  'soccer1234',
  'letmein123',
  'welcome123',
  'welcome1234',
  'abcdefghij',
  'abcd123456',
  'abc1234567',
  'changeme123',
  'trustno1234',
  'monkey1234',
  'dragon1234',
  'sunshine12',
  'princess12',
  'superman12',
  'baseball12',
  'starwars12',
  'liverpool1',
  'liverpool12',
  'arsenal123',
  'chelsea123',
  'manchester',
  'manutd1234',
  'loftline-demo',
  'loftline123',
  'kestrelvale',
]);

/** Whether a password is on the common list. */
export function isCommonPassword(password: string): boolean {
  return COMMON_PASSWORDS.has(password.trim().toLowerCase());
}
