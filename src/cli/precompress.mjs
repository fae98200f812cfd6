// Writes a brotli (.br) and a gzip (.gz) copy beside every text file of the client build, once,
// at the highest settings: the server (src/cli/serve.mjs) then sends them without compressing
// anything per request. Photos never pass through here (they are uploads, not build output).
import { readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

const TEXT_FILE = /\.(js|mjs|css|html|svg|json|webmanifest|txt|xml|map)$/i;
/** Below this a compressed copy saves less than its own headers. */
const MIN_BYTES = 1024;

function* walk(dir) {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) yield* walk(path);
    else yield path;
  }
}

/** Returns how many files got compressed copies. */
export function precompressDir(dir) {
  let count = 0;
  for (const path of walk(dir)) {
    if (!TEXT_FILE.test(path) || statSync(path).size < MIN_BYTES) continue;
    const bytes = readFileSync(path);
    const br = brotliCompressSync(bytes, { params: { [constants.BROTLI_PARAM_QUALITY]: 11, [constants.BROTLI_PARAM_SIZE_HINT]: bytes.length } });
    const gz = gzipSync(bytes, { level: 9 });
    // A copy that is not smaller would only cost the client a decode.
    if (br.length < bytes.length) writeFileSync(`${path}.br`, br);
    if (gz.length < bytes.length) writeFileSync(`${path}.gz`, gz);
    count++;
  }
  return count;
}

/** Astro integration: compresses the client build after every `astro build`. */
export function precompress() {
  return {
    name: 'throwline-precompress',
    hooks: {
      'astro:build:done': ({ logger }) => {
        const client = fileURLToPath(new URL('client/', new URL(`${process.env.THROWLINE_BUILD_DIR ?? 'dist'}/`, `file://${process.cwd()}/`)));
        logger.info(`brotli + gzip copies of ${precompressDir(client)} client files`);
      },
    },
  };
}
