import fc from 'fast-check';

/** Strings that have broken parsers, queries and pages elsewhere: SQL and script fragments, template and path tricks, odd code points. */
export const NASTY_STRINGS = [
  "' OR '1'='1",
  '1; DROP TABLE users; --',
  "'); DELETE FROM balls; --",
  '" OR ""="',
  '1 UNION SELECT password_hash FROM users',
  '<script>alert(1)</script>',
  '"><img src=x onerror=alert(1)>',
  'javascript:alert(1)',
  '${7*7}{{7*7}}<%= 7*7 %>',
  '../../../../etc/passwd',
  '..\\..\\windows\\win.ini',
  '%00',
  '\u0000',
  '\u0000\u0001\u001f',
  '\uFEFF',
  '\u202Eevil',
  '\uD800',
  '💥🎳🫠',
  'Ω≈ç√∫˜µ≤≥÷',
  '田中さんにあげて下さい',
  'ﷺ',
  'NaN',
  'Infinity',
  '-Infinity',
  '-0',
  '1e309',
  '0x1F',
  '1_000',
  '  12  ',
  '',
  ' ',
  'null',
  'undefined',
  'true',
  '[]',
  '{}',
  '__proto__',
  'constructor',
  '%E0%A4%A',
  '\r\n\r\nHTTP/1.1 200 OK',
  'a'.repeat(10_000),
];

export const NASTY_NUMBERS = [
  -1,
  0,
  -0,
  0.5,
  -(2 ** 31),
  2 ** 31,
  2 ** 31 - 1,
  2 ** 53 + 1,
  -(2 ** 63),
  1e308,
  -1e308,
  Number.MAX_SAFE_INTEGER,
  Number.MIN_VALUE,
  1e-320,
  123456789012345,
];

/** One malformed value of any JSON type. */
export const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...NASTY_STRINGS) },
  { weight: 3, arbitrary: fc.constantFrom(...NASTY_NUMBERS) },
  { weight: 2, arbitrary: fc.string({ maxLength: 40 }) },
  { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 40 }) },
  { weight: 1, arbitrary: fc.string({ unit: 'grapheme', maxLength: 20 }) },
  { weight: 2, arbitrary: fc.integer() },
  { weight: 1, arbitrary: fc.double() },
  { weight: 1, arbitrary: fc.boolean() },
  { weight: 1, arbitrary: fc.constant(null) },
  { weight: 1, arbitrary: fc.array(fc.oneof(fc.integer(), fc.string({ maxLength: 5 }), fc.constant(null)), { maxLength: 6 }) },
  { weight: 1, arbitrary: fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 4 }) },
  { weight: 1, arbitrary: fc.constant('x'.repeat(200_000)) },
  { weight: 1, arbitrary: fc.constant(JSON.parse('{"__proto__":{"admin":true},"constructor":{"prototype":{"admin":true}}}') as unknown) },
);

/** A JSON document nested `depth` levels deep, as text (no parser limit is assumed). */
export const deepJson = (depth: number, open = '[', close = ']'): string =>
  open === '{' ? '{"a":'.repeat(depth) + '1' + '}'.repeat(depth) : open.repeat(depth) + close.repeat(depth);

/** Bodies that are not JSON although they say so. */
export const MALFORMED_JSON = [
  '{',
  '{"a":',
  '{"a":1,}',
  "{'a':1}",
  '[1,2',
  '{"a":1}}',
  'nul',
  'NaN',
  '{"a":01}',
  '\u0000',
  '{"a":"\\uZZZZ"}',
  '{"a":1} trailing',
  '\uFEFF{"a":1',
  '{"__proto__":',
  '"unterminated',
];
