/**
 * Names people type (players, squads, accounts, grounds) end up in lists, e-mails, CSV files and
 * PDFs. Control characters (NUL above all) and the Unicode bidirectional overrides and isolates can
 * make a name display as something else ("Trojan Source", CVE-2021-42574; Unicode Technical Standard
 * #39 and UAX #9 describe the controls), so names refuse them. The implicit marks U+200E/U+200F
 * stay allowed: mixed-script names legitimately need them.
 */

/**
 * Whether a code point may not appear in a name: C0 controls other than tab and line breaks (a quoted
 * CSV field may hold those, and they display as what they are), DEL and the C1 controls, the bidi
 * embeddings and overrides (U+202A–U+202E) and isolates (U+2066–U+2069).
 */
function unsafeInName(code: number): boolean {
  if (code === 0x09 || code === 0x0a || code === 0x0d) return false;
  return code <= 0x1f || (code >= 0x7f && code <= 0x9f) || (code >= 0x202a && code <= 0x202e) || (code >= 0x2066 && code <= 0x2069);
}

/** Whether a name holds a control or bidi-override character. */
export function hasUnsafeNameCharacters(name: string): boolean {
  for (let i = 0; i < name.length; i++) if (unsafeInName(name.charCodeAt(i))) return true;
  return false;
}

/** The message for a refused name. */
export function unsafeNameMessage(field: string): string {
  return `${field} must not contain control characters or text-direction overrides`;
}
