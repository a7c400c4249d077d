import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import type { Plugin } from 'vite';

const TEXT = /\.(js|mjs|css|html|svg|json|txt|map)$/;
/** Smaller files gain too little from compression to be worth an extra request header. */
export const MIN_COMPRESS_BYTES = 1024;

/** Writes a brotli (.br) and a gzip (.gz) copy beside every text file of `dir`, at the strongest settings, once per build. */
export function precompressDir(dir: string): void {
  for (const name of readdirSync(dir, { recursive: true, encoding: 'utf8' })) {
    const file = join(dir, name);
    if (!TEXT.test(name) || !statSync(file).isFile()) continue;
    const content = readFileSync(file);
    if (content.length < MIN_COMPRESS_BYTES) continue;
    writeFileSync(`${file}.br`, brotliCompressSync(content, { params: { [constants.BROTLI_PARAM_QUALITY]: 11, [constants.BROTLI_PARAM_SIZE_HINT]: content.length } }));
    writeFileSync(`${file}.gz`, gzipSync(content, { level: 9 }));
  }
}

/** Vite plugin: precompresses the built app, so the server sends ready-made .br/.gz files. */
export function precompress(): Plugin {
  let outDir = '';
  return {
    name: 'busbar-precompress',
    apply: 'build',
    configResolved(config) {
      outDir = config.build.outDir;
    },
    closeBundle() {
      precompressDir(outDir);
    },
  };
}
