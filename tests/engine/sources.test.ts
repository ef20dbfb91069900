import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

// The project cites the publications and standards it relies on (docs/sources.md) and its own conventions
// (engine/README.md), never a notes file that is not in the repository.

const root = join(__dirname, '..', '..');
const notes = ['TRADE', 'PHYSICS', 'PRODUCT', 'STYLE'].map((n) => `${n}.md`);

describe('sources', () => {
  it('no tracked file cites a notes file outside the repository', () => {
    const files = execFileSync('git', ['ls-files', '-z'], { cwd: root, encoding: 'utf8' }).split('\0').filter(Boolean);
    expect(files.length).toBeGreaterThan(100);
    const citing = files
      .filter((f) => !/\.(png|jpe?g|webp|woff2?|ico|pdf)$/.test(f))
      .filter((f) => {
        const text = readFileSync(join(root, f), 'utf8');
        return notes.some((n) => text.includes(n));
      });
    expect(citing).toEqual([]);
  });

  it('docs/sources.md names the governing body’s standards and the physics the engine uses', () => {
    const text = readFileSync(join(root, 'docs', 'sources.md'), 'utf8');
    for (const name of ['USBC equipment specifications', 'USBC playing rules', 'Frohlich', 'Brent', 'Wilson', 'common practice'])
      expect(text).toContain(name);
  });
});
