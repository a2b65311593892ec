// Layers only point down (pages → components → lib → db): nothing under src/lib, which the
// server, the pack and the PDF use, imports from src/components. Common practice — no published
// source; the layering is this project's own rule (DEVELOPERS.md).
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..');

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? filesUnder(path) : /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

const importsOf = (text: string) => [...text.matchAll(/(?:import|export)[^'"]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)].map((m) => m[1] ?? m[2]!);

describe('layers', () => {
  it('finds imports the way the check reads them', () => {
    expect(importsOf("import { a } from '../../components/x';\nexport { b } from '@/lib/y';")).toEqual(['../../components/x', '@/lib/y']);
  });

  it('keeps src/lib free of imports from src/components', () => {
    const offenders = filesUnder(join(root, 'src', 'lib')).flatMap((file) =>
      importsOf(readFileSync(file, 'utf8'))
        .filter((spec) => /(^|\/)components\//.test(spec) || spec.startsWith('@/components'))
        .map((spec) => `${relative(root, file)} imports ${spec}`),
    );
    expect(offenders).toEqual([]);
  });
});
