// An Astro integration: after `astro build`, writes a brotli (.br) and a gzip (.gz) copy beside
// every compressible browser file, so scripts/server.mjs (sirv) serves them without compressing
// on each request. Brotli at its highest quality takes seconds at build but nothing per request.
import { readdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import zlib from 'node:zlib';

const brotli = promisify(zlib.brotliCompress);
const gzip = promisify(zlib.gzip);
const COMPRESSIBLE = /\.(js|mjs|css|html|svg|json|txt|xml|webmanifest|ttf|otf)$/;

async function* files(dir) {
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) yield* files(path);
    else if (COMPRESSIBLE.test(entry.name)) yield path;
  }
}

/** @returns {import('astro').AstroIntegration} */
export default function precompress() {
  return {
    name: 'groundwork-precompress',
    hooks: {
      'astro:build:done': async ({ dir, logger }) => {
        // With server output, `dir` is the client folder: only browser files are touched.
        const client = fileURLToPath(dir);
        let count = 0;
        for await (const path of files(client)) {
          const body = await readFile(path);
          if (body.length < 1024) continue;
          const [br, gz] = await Promise.all([
            brotli(body, { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: body.length } }),
            gzip(body, { level: 9 }),
          ]);
          if (br.length < body.length) await writeFile(`${path}.br`, br);
          if (gz.length < body.length) await writeFile(`${path}.gz`, gz);
          count++;
        }
        logger.info(`precompressed ${count} files (brotli + gzip)`);
      },
    },
  };
}
