import type { RequestHandler, Response } from 'express';
import { brotliCompress, brotliCompressSync, constants, gzip, gzipSync } from 'node:zlib';
import { acceptedEncoding, type Encoding } from './encoding.ts';

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
 * busy machine. Larger ones (a page of 200 builds) go to the pool; the background thread's answers
 * (roll-ups, reliability) come compressed already (encodedJson).
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
      if (text.length <= INLINE_MAX_BYTES) done(null, compressedSync(text, encoding));
      else if (encoding === 'br') brotliCompress(text, brotliOptions(text), done);
      else gzip(text, done);
      return res;
    };
    next();
  };
}

const brotliOptions = (bytes: Uint8Array) => ({ params: { ...BROTLI_PARAMS, [constants.BROTLI_PARAM_SIZE_HINT]: bytes.byteLength } });
const compressedSync = (bytes: Uint8Array, encoding: Encoding) => (encoding === 'br' ? brotliCompressSync(bytes, brotliOptions(bytes)) : gzipSync(bytes));

/** A JSON answer's bytes, compressed (`encoding`) or not (null). */
export interface EncodedJson {
  body: Uint8Array;
  encoding: Encoding | null;
}

/**
 * JSON bytes compressed as the middleware would (`encoding` from acceptedEncoding), on the calling
 * thread, in memory of their own (see utf8Of): the background thread's answers. A page of the
 * roll-ups of 25 shops (450 KB) takes 1.3 ms there; on zlib's pool, from the request's thread and
 * back, it took 4 ms on 200 shops (a larger output buffer for fewer hand-overs did not help).
 */
export function encodedJson(bytes: Uint8Array, encoding: Encoding | null): EncodedJson {
  if (!encoding || bytes.byteLength < MIN_COMPRESS_BYTES) return { body: bytes, encoding: null };
  return { body: new Uint8Array(compressedSync(bytes, encoding)), encoding };
}

/**
 * Sends what encodedJson made, as a Buffer over the same bytes (a plain Uint8Array `res.send`
 * would turn into JSON); the middleware leaves a body with its encoding set as it is.
 */
export function sendEncodedJson(res: Response, { body, encoding }: EncodedJson): void {
  if (encoding) res.setHeader('Content-Encoding', encoding);
  res.type('json').send(Buffer.from(body.buffer, body.byteOffset, body.byteLength));
}
