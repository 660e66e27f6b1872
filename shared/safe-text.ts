/**
 * Names people type (players, squads, accounts, grounds) end up in lists, e-mails, CSV files and
 * PDFs. Control characters (NUL above all) and the Unicode bidirectional overrides and isolates can
 * make a name display as something else ("Trojan Source", CVE-2021-42574; Unicode Technical Standard
 * #39 and UAX #9 describe the controls), so names refuse them. The implicit marks U+200E/U+200F
 * stay allowed: mixed-script names legitimately need them.
 */

/**
 * C0 controls other than tab and line breaks (a quoted CSV field may hold those, and they display as what
 * they are), C1 controls, the bidi embeddings and overrides (U+202A–U+202E) and isolates (U+2066–U+2069).
 */
const UNSAFE_IN_NAMES = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/;

/** Whether a name holds a control or bidi-override character. */
export function hasUnsafeNameCharacters(name: string): boolean {
  return UNSAFE_IN_NAMES.test(name);
}

/** The message for a refused name. */
export function unsafeNameMessage(field: string): string {
  return `${field} must not contain control characters or text-direction overrides`;
}
