import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// The engine's own rules (engine/README.md): no imports from server/, client/ or shared/, no I/O,
// clocks, logging or randomness; the only runtime dependencies may be simple-statistics and the
// stdlib-js distribution functions (@stdlib/…). This test reads the first layer's source files (engine/motion has its own
// owner and tests).

const engineDir = fileURLToPath(new URL('../../engine', import.meta.url));

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return name === 'motion' ? [] : sources(path);
    return name.endsWith('.ts') ? [path] : [];
  });
}

const files = sources(engineDir).map((path) => ({ path: relative(engineDir, path), text: readFileSync(path, 'utf8') }));

describe('engine purity', () => {
  it('finds the engine sources', () => {
    expect(files.length).toBeGreaterThan(20);
  });

  it('every file imports only engine files, simple-statistics or stdlib-js functions (none from server/, client/, shared/)', () => {
    const offenders = files.flatMap((f) =>
      [...f.text.matchAll(/from\s+'([^']+)'/g)]
        .map((m) => m[1])
        .filter(
          (s) =>
            !(s.startsWith('./') || s.startsWith('../') || s === 'simple-statistics' || s.startsWith('@stdlib/')) ||
            /(^|\/)(server|client|shared)(\/|$)/.test(s),
        )
        .map((s) => `${f.path}: ${s}`),
    );
    expect(offenders).toEqual([]);
  });

  it('no file uses randomness, a clock, logging or I/O', () => {
    const banned = /Math\.random|Date\.now|new Date|performance\.now|console\.|process\.|require\(|node:/;
    expect(files.filter((f) => banned.test(f.text)).map((f) => f.path)).toEqual([]);
  });

  it('index.ts only re-exports', () => {
    const index = files.find((f) => f.path === 'index.ts');
    const code = (index?.text ?? '').replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '');
    const statements = code
      .split(';')
      .map((s) => s.trim())
      .filter(Boolean);
    for (const s of statements) expect(s).toMatch(/^export (type )?(\*|\{)[\s\S]*from '\.\/[^']+'$/);
  });
});
