import type { RequestHandler } from 'express';
import { brotliCompress, brotliCompressSync, constants, gzip, gzipSync } from 'node:zlib';
import { acceptedEncoding } from './encoding.ts';

/** Smaller bodies gain too little to be worth compressing. */
const MIN_COMPRESS_BYTES = 1024;
/**
 * Brotli at quality 1 with a 256 KiB window (lgwin 18, plenty for one answer): a page of 50 builds
 * (30 KB of JSON) goes as 1.3 KB instead of quality 4's 0.9 KB, in a sixth of the time, which on a
 * 2-core machine decided how many requests a second the app answered (lists 180 → 310 a second).
 */
const BROTLI_PARAMS = { [constants.BROTLI_PARAM_QUALITY]: 1, [constants.BROTLI_PARAM_LGWIN]: 18 };
/**
 * Bodies up to this size are compressed on the request's own thread: a page of 50 builds (30 KB)
 * takes about 0.07 ms, less than handing it to zlib's thread pool and back costs in waiting on a
 * busy machine. Larger ones (a year of roll-ups, 450 KB: 1.7 ms) go to the pool.
 */
export const INLINE_MAX_BYTES = 64 * 1024;

/**
 * Compresses what the API sends (JSON through `res.send`) with brotli or gzip, as the client
 * accepts: up to INLINE_MAX_BYTES at once, larger bodies on zlib's thread pool. Small bodies go as
 * they are; the built app's files are compressed ahead of time instead (serve-web.ts).
 */
export function compressResponses(): RequestHandler {
  return (req, res, next) => {
    const encoding = acceptedEncoding(req);
    const send = res.send.bind(res);
    res.send = (body?: unknown) => {
      res.vary('Accept-Encoding');
      const text = typeof body === 'string' ? Buffer.from(body) : Buffer.isBuffer(body) ? body : null;
      if (!encoding || !text || text.length < MIN_COMPRESS_BYTES || req.method === 'HEAD' || res.getHeader('Content-Encoding')) return send(body);
      if (typeof body === 'string' && !res.getHeader('Content-Type')) res.type('html');
      const done = (error: Error | null, compressed: Buffer) => {
        if (error) return next(error);
        res.setHeader('Content-Encoding', encoding);
        send(compressed);
      };
      const brotli = { params: { ...BROTLI_PARAMS, [constants.BROTLI_PARAM_SIZE_HINT]: text.length } };
      if (text.length <= INLINE_MAX_BYTES) done(null, encoding === 'br' ? brotliCompressSync(text, brotli) : gzipSync(text));
      else if (encoding === 'br') brotliCompress(text, brotli, done);
      else gzip(text, done);
      return res;
    };
    next();
  };
}
