/**
 * Nesting limit for every JSON the server parses (request bodies, uploaded pattern files). Real documents
 * here nest three or four levels; a limit far below what recursive parsers survive keeps a deeply nested
 * document from exhausting the stack (OWASP, "Denial of Service Cheat Sheet": limit nesting depth).
 */
export const MAX_JSON_DEPTH = 32;

const QUOTE = 0x22;
const BACKSLASH = 0x5c;
const OPEN = new Set([0x7b, 0x5b]); // { [
const CLOSE = new Set([0x7d, 0x5d]); // } ]

/** True when the JSON text (bytes or string) nests objects/arrays deeper than `limit`; one pass, no parsing, strings skipped. */
export function exceedsJsonDepth(input: Buffer | string, limit = MAX_JSON_DEPTH): boolean {
  const buf = typeof input === 'string' ? Buffer.from(input, 'utf8') : input;
  let depth = 0;
  let inString = false;
  for (let i = 0; i < buf.length; i++) {
    const c = buf[i];
    if (inString) {
      if (c === BACKSLASH) i++;
      else if (c === QUOTE) inString = false;
    } else if (c === QUOTE) {
      inString = true;
    } else if (OPEN.has(c)) {
      if (++depth > limit) return true;
    } else if (CLOSE.has(c)) {
      depth--;
    }
  }
  return false;
}
