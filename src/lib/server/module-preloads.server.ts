// Server-only: names, in each page's <head>, every script its islands and page scripts will
// import, as <link rel="modulepreload">. Without them a phone learns of an island's imports only
// after the island's own file has arrived and been parsed (and that file only after the
// stylesheet), one round trip per level: about 0.6 s each on slow 4G. The import chains are
// worked out at build time (scripts/lib/module-preloads.mjs) into module-preloads.json beside
// the built server's entry.mjs; under `astro dev` there is no such file and pages go out as drawn.
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export type PreloadMap = Record<string, string[]>;

// The name scripts/lib/module-preloads.mjs writes (MODULE_PRELOADS_FILE there).
const FILE = 'module-preloads.json';
let loaded: PreloadMap | null = null;

/** The built app's import chains, read once; empty when there is no build beside this code. */
export function preloadMap(): PreloadMap {
  if (loaded) return loaded;
  loaded = {};
  // This module is bundled somewhere under the server folder: the nearest folder up with entry.mjs.
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 5; i++, dir = dirname(dir)) {
    if (!existsSync(join(dir, 'entry.mjs'))) continue;
    if (existsSync(join(dir, FILE))) loaded = JSON.parse(readFileSync(join(dir, FILE), 'utf8')) as PreloadMap;
    break;
  }
  return loaded;
}

const ISLAND_URL = /\b(?:component-url|renderer-url|before-hydration-url)="([^"]+)"/g;
const MODULE_SCRIPT = /<script\b[^>]*\btype="module"[^>]*\bsrc="([^"]+)"|<script\b[^>]*\bsrc="([^"]+)"[^>]*\btype="module"/g;
const ALREADY_PRELOADED = /<link\b[^>]*\brel="modulepreload"[^>]*\bhref="([^"]+)"/g;
const escapeAttr = (s: string) => s.replace(/&/g, '&amp;').replace(/"/g, '&quot;');

/**
 * The page with a <link rel="modulepreload"> before </head> for every script it will load and has
 * not named yet: each island's component and renderer, and everything those and the page's own
 * module scripts import. Unchanged when there is nothing to add or no </head>.
 * @example withModulePreloads('<head></head><astro-island component-url="/_astro/a.js">', { '/_astro/a.js': ['/_astro/b.js'] })
 *   // '<head><link rel="modulepreload" href="/_astro/a.js"><link rel="modulepreload" href="/_astro/b.js"></head>…'
 */
export function withModulePreloads(html: string, map: PreloadMap): string {
  const head = html.indexOf('</head>');
  if (head < 0) return html;
  const pageScripts = [...html.matchAll(MODULE_SCRIPT)].map((m) => (m[1] ?? m[2])!);
  const named = new Set<string>(pageScripts);
  for (const m of html.matchAll(ALREADY_PRELOADED)) named.add(m[1]!);
  const wanted: string[] = [];
  const want = (url: string) => {
    if (!named.has(url)) wanted.push(url);
    named.add(url);
  };
  for (const m of html.matchAll(ISLAND_URL)) {
    want(m[1]!);
    for (const dep of map[m[1]!] ?? []) want(dep);
  }
  for (const script of pageScripts) for (const dep of map[script] ?? []) want(dep);
  if (wanted.length === 0) return html;
  const links = wanted.map((url) => `<link rel="modulepreload" href="${escapeAttr(url)}">`).join('');
  return html.slice(0, head) + links + html.slice(head);
}

/** A page answer with its module preloads added; anything that is not HTML passes untouched. */
export async function withPagePreloads(res: Response): Promise<Response> {
  if (!(res.headers.get('content-type') ?? '').startsWith('text/html') || !res.body) return res;
  const map = preloadMap();
  if (Object.keys(map).length === 0) return res;
  const html = await res.text();
  const headers = new Headers(res.headers);
  headers.delete('content-length');
  return new Response(withModulePreloads(html, map), { status: res.status, statusText: res.statusText, headers });
}
