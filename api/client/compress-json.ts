/**
 * Brotli or gzip for JSON answers (a sync page is mostly repeated keys: about a tenth of its size
 * compressed). `res.json` is wrapped so the body is compressed as one buffer on libuv's thread pool,
 * off the event loop, and sent with its length; no stream stays open on the socket, so a server that
 * is asked to stop closes its kept-alive connections at once.
 */
import type { NextFunction, Request, Response } from 'express';
import { brotliCompress, constants, gzip } from 'node:zlib';

/** Below this a compressed body saves less than the headers cost (the threshold most servers use). */
const MIN_BYTES = 1024;
/** Brotli quality 4: about gzip's speed with a smaller result (quality 11 is for files compressed once). */
const BROTLI_QUALITY = 4;

/** The encoding to use for a request's `Accept-Encoding`: brotli, then gzip, else none. */
export function pickEncoding(header: string | undefined): 'br' | 'gzip' | null {
  const offered = new Map<string, number>();
  for (const part of (header ?? '').split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    const q = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
    if (name) offered.set(name, q ? Number(q.slice(2)) : 1);
  }
  const ok = (name: string): boolean => (offered.get(name) ?? offered.get('*') ?? 0) > 0;
  if (ok('br')) return 'br';
  if (ok('gzip')) return 'gzip';
  return null;
}

/** Middleware: compresses what `res.json` sends when the client accepts it. */
export function compressJson() {
  return (req: Request, res: Response, next: NextFunction): void => {
    const send = res.json.bind(res);
    res.json = (body: unknown): Response => {
      const encoding = pickEncoding(req.headers['accept-encoding']);
      const text = JSON.stringify(body);
      res.vary('Accept-Encoding');
      if (encoding === null || text === undefined || Buffer.byteLength(text) < MIN_BYTES || req.method === 'HEAD') return send(body);
      const raw = Buffer.from(text);
      const done = (error: Error | null, packed: Buffer): void => {
        if (error) {
          send(body);
          return;
        }
        res.setHeader('Content-Type', 'application/json; charset=utf-8');
        res.setHeader('Content-Encoding', encoding);
        res.send(packed);
      };
      if (encoding === 'br') {
        brotliCompress(
          raw,
          { params: { [constants.BROTLI_PARAM_QUALITY]: BROTLI_QUALITY, [constants.BROTLI_PARAM_SIZE_HINT]: raw.length } },
          done,
        );
      } else {
        gzip(raw, done);
      }
      return res;
    };
    next();
  };
}
