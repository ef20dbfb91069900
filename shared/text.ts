/**
 * Characters a name or title may not hold: C0/C1 control characters, and the Unicode bidirectional
 * embedding, override and isolate controls (U+202A–U+202E, U+2066–U+2069) with the directional marks
 * (U+200E, U+200F, U+061C), which can make a name display as something else ("Trojan Source",
 * CVE-2021-42574; Unicode Technical Report #36, Unicode Security Considerations). Line and paragraph
 * separators (U+2028, U+2029) are refused too: a name is one line.
 */
export const UNSAFE_NAME_CHARS = /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u2028-\u202e\u2066-\u2069]/;

export const UNSAFE_NAME_MESSAGE = 'Remove control or text-direction characters';

/** True when the text holds none of UNSAFE_NAME_CHARS (use with zod's `.refine`). */
export const isSafeName = (s: string): boolean => !UNSAFE_NAME_CHARS.test(s);
