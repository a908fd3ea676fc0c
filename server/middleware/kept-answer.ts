// Sending an answer kept per data version (server/db/change-log.ts): its JSON and its compressed
// forms are made once, kept with the value, and sent as they are to every request that gets the
// same answer, instead of stringifying and compressing it again each time. The compression
// middleware leaves an answer alone once it carries a Content-Encoding.

import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import type { Request, Response } from 'express';
import type { KeptAnswer } from '@server/db/change-log';

/** Answers smaller than this are not worth compressing (here and in the app's compression middleware). */
export const COMPRESS_THRESHOLD = 1024;

function encode(kept: KeptAnswer<unknown>, encoding: 'identity' | 'br' | 'gzip'): Buffer {
  let body = kept.encoded.get(encoding);
  if (!body) {
    const json = kept.encoded.get('identity') ?? Buffer.from(JSON.stringify(kept.value));
    kept.encoded.set('identity', json);
    // Made once per data version, so a better ratio than per-request compression is affordable.
    body = encoding === 'br' ? brotliCompressSync(json, { params: { [constants.BROTLI_PARAM_QUALITY]: 6, [constants.BROTLI_PARAM_SIZE_HINT]: json.length } })
      : encoding === 'gzip' ? gzipSync(json, { level: 6 }) : json;
    kept.encoded.set(encoding, body);
  }
  return body;
}

/** Answers 200 with the kept value as JSON, compressed as the client accepts (brotli first). */
export function sendKept(req: Request, res: Response, kept: KeptAnswer<unknown>): void {
  const identity = encode(kept, 'identity');
  // Brotli whenever it is taken at all, whatever the header's order (as the compression middleware does).
  const encoding = identity.length < COMPRESS_THRESHOLD ? 'identity' : req.acceptsEncodings('br') ? 'br' : req.acceptsEncodings('gzip') ? 'gzip' : 'identity';
  const body = encode(kept, encoding);
  res.vary('Accept-Encoding');
  res.status(200).type('application/json; charset=utf-8');
  if (encoding !== 'identity') res.set('Content-Encoding', encoding);
  res.set('Content-Length', String(body.length));
  res.end(req.method === 'HEAD' ? undefined : body);
}
