// The build's import chains (scripts/lib/module-preloads.mjs) and the page step that names them
// (src/lib/server/module-preloads.server.ts), on small worked examples written out by hand. The
// lexer is es-module-lexer, the one Vite uses; the browser test tests/e2e/preloads.test.ts checks
// the result against what Chromium really fetches.
import { describe, expect, it } from 'vitest';
import { closures, staticImports } from '../../scripts/lib/module-preloads.mjs';
import { withModulePreloads } from '@/lib/server/module-preloads.server';

describe('staticImports', () => {
  it('finds static imports and re-exports, resolved to site paths, and leaves dynamic ones out', async () => {
    const found = await staticImports({
      '/_astro/app.js': 'import{a as b}from"./shared.js";import"./styles.js";export{c}from"./more.js";const w=()=>import("./widget.js");',
      '/_astro/shared.js': 'export const a=1;',
    });
    expect(found['/_astro/app.js']).toEqual(['/_astro/shared.js', '/_astro/styles.js', '/_astro/more.js']);
    expect(found['/_astro/shared.js']).toEqual([]);
  });
});

describe('closures', () => {
  it('follows imports to the end, once each, through a cycle', () => {
    const out = closures({ a: ['b'], b: ['c', 'a'], c: ['d'], d: [] });
    expect(out).toEqual({ a: ['b', 'c', 'd'], b: ['a', 'c', 'd'], c: ['d'], d: [] });
  });
});

describe('withModulePreloads', () => {
  const map = { '/_astro/queue.js': ['/_astro/preact.js', '/_astro/zod.js'], '/_astro/client.js': ['/_astro/preact.js'], '/_astro/page.js': ['/_astro/small.js'] };
  const page = (body: string, head = '') => `<!DOCTYPE html><html><head><title>Cases</title>${head}</head><body>${body}</body></html>`;

  it('names the island, its renderer and all they import before </head>, each once', () => {
    const html = page('<astro-island uid="1" component-url="/_astro/queue.js" renderer-url="/_astro/client.js" ssr></astro-island>');
    const out = withModulePreloads(html, map);
    expect(out).toBe(
      page(
        '<astro-island uid="1" component-url="/_astro/queue.js" renderer-url="/_astro/client.js" ssr></astro-island>',
        '<link rel="modulepreload" href="/_astro/queue.js"><link rel="modulepreload" href="/_astro/preact.js"><link rel="modulepreload" href="/_astro/zod.js"><link rel="modulepreload" href="/_astro/client.js">',
      ),
    );
  });

  it("names a page script's imports but not the script itself, which the page already names", () => {
    const html = page('', '<script type="module" src="/_astro/page.js"></script>');
    expect(withModulePreloads(html, map)).toBe(page('', '<script type="module" src="/_astro/page.js"></script><link rel="modulepreload" href="/_astro/small.js">'));
  });

  it('leaves a page with no scripts, or no </head>, as it was', () => {
    expect(withModulePreloads(page('<p>Signed out.</p>'), map)).toBe(page('<p>Signed out.</p>'));
    const fragment = '<astro-island component-url="/_astro/queue.js"></astro-island>';
    expect(withModulePreloads(fragment, map)).toBe(fragment);
  });
});
