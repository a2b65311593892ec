// An Astro integration: after `astro build`, writes which browser scripts each script needs
// before it can run (every static import, followed to the end) to `module-preloads.json` in the
// server folder. The app's middleware (src/lib/server/module-preloads.server.ts) names them in
// each page's <head> as <link rel="modulepreload">, so a phone fetches an island's whole chain
// at once with the stylesheet, instead of one round trip per level of imports (on slow 4G each
// level costs about 0.6 s: `BENCH_WATERFALL=1 npm run bench:pages` prints the chain).
//
// The imports are read with es-module-lexer, the lexer Vite itself uses for the same job.
// Dynamic imports (the upload widget, loaded only when a slot is used) are left out on purpose.
import { readdir, readFile, writeFile } from 'node:fs/promises';
import { join, posix } from 'node:path';
import { fileURLToPath } from 'node:url';
import { init, parse } from 'es-module-lexer';

export const MODULE_PRELOADS_FILE = 'module-preloads.json';

/**
 * The static imports of each script, as site paths, from the scripts' own text.
 * @param {Record<string, string>} sources site path (e.g. /_astro/a.js) → source
 * @returns {Promise<Record<string, string[]>>}
 * @example await staticImports({ '/_astro/a.js': 'import"./b.js";' }) // { '/_astro/a.js': ['/_astro/b.js'] }
 */
export async function staticImports(sources) {
  await init;
  const out = {};
  for (const [path, source] of Object.entries(sources)) {
    const [imports] = parse(source, path);
    out[path] = [
      ...new Set(
        imports
          // d === -1: a static import or re-export (dynamic ones have d ≥ 0, import.meta -2).
          .filter((i) => i.d === -1 && i.n && (i.n.startsWith('./') || i.n.startsWith('../') || i.n.startsWith('/')))
          .map((i) => (i.n.startsWith('/') ? i.n : posix.join(posix.dirname(path), i.n))),
      ),
    ];
  }
  return out;
}

/**
 * Every script each script needs, followed through the imports (itself excluded), sorted.
 * @param {Record<string, string[]>} direct
 * @returns {Record<string, string[]>}
 * @example closures({ a: ['b'], b: ['c'], c: [] }).a // ['b', 'c']
 */
export function closures(direct) {
  const out = {};
  for (const start of Object.keys(direct)) {
    const seen = new Set();
    const todo = [...(direct[start] ?? [])];
    while (todo.length) {
      const next = todo.pop();
      if (seen.has(next) || next === start) continue;
      seen.add(next);
      todo.push(...(direct[next] ?? []));
    }
    out[start] = [...seen].sort();
  }
  return out;
}

async function* scripts(dir, base = '') {
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    const site = `${base}/${entry.name}`;
    if (entry.isDirectory()) yield* scripts(path, site);
    else if (/\.m?js$/.test(entry.name)) yield [site, path];
  }
}

/** @returns {import('astro').AstroIntegration} */
export default function modulePreloads() {
  /** @type {URL | undefined} */
  let serverDir;
  return {
    name: 'groundwork-module-preloads',
    hooks: {
      'astro:config:done': ({ config }) => {
        serverDir = config.build.server;
      },
      'astro:build:done': async ({ dir, logger }) => {
        if (!serverDir) return;
        // With server output, `dir` is the client folder.
        const client = fileURLToPath(dir);
        const sources = {};
        for await (const [site, path] of scripts(client)) sources[site] = await readFile(path, 'utf8');
        const needs = closures(await staticImports(sources));
        const kept = Object.fromEntries(Object.entries(needs).filter(([, list]) => list.length > 0));
        await writeFile(join(fileURLToPath(serverDir), MODULE_PRELOADS_FILE), `${JSON.stringify(kept)}\n`);
        logger.info(`Import chains of ${Object.keys(kept).length} scripts written for <link rel="modulepreload">.`);
      },
    },
  };
}
