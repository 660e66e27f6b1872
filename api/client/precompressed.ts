/**
 * Precompressed copies of the built client: brotli (`.br`, quality 11) and gzip (`.gz`, level 9)
 * beside every text file, written once after the production build, so a phone on a weak signal gets
 * the smallest bytes without the server spending CPU on each request. The service worker is not
 * affected: the browser decodes `Content-Encoding` before the worker sees the body, so the hashes
 * in `ngsw.json` (of the uncompressed files) still match.
 */
import type { NextFunction, Request, Response } from 'express';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { extname, join, normalize, sep } from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

/** Content types of the files worth compressing (fonts and images are compressed already). */
export const COMPRESSIBLE_TYPES: Readonly<Record<string, string>> = {
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.html': 'text/html; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.webmanifest': 'application/manifest+json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.txt': 'text/plain; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
};

/** Below this a compressed copy saves less than the headers cost (the threshold most servers use). */
const MIN_BYTES = 1024;

function* filesUnder(dir: string): Generator<string> {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) yield* filesUnder(path);
    else if (entry.isFile()) yield path;
  }
}

/** Writes `.br` and `.gz` beside each compressible file in `dir`; returns the raw and brotli byte totals. */
export function precompressDir(dir: string): { files: number; rawBytes: number; brotliBytes: number } {
  let files = 0;
  let rawBytes = 0;
  let brotliBytes = 0;
  for (const path of filesUnder(dir)) {
    if (!(extname(path) in COMPRESSIBLE_TYPES)) continue;
    const raw = readFileSync(path);
    if (raw.length < MIN_BYTES) continue;
    const br = brotliCompressSync(raw, {
      params: {
        [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY,
        [constants.BROTLI_PARAM_MODE]: constants.BROTLI_MODE_TEXT,
        [constants.BROTLI_PARAM_SIZE_HINT]: raw.length,
      },
    });
    writeFileSync(path + '.br', br);
    writeFileSync(path + '.gz', gzipSync(raw, { level: 9 }));
    files++;
    rawBytes += raw.length;
    brotliBytes += br.length;
  }
  return { files, rawBytes, brotliBytes };
}

/** The encodings a request accepts, from `Accept-Encoding` (q=0 means refused). */
function accepted(header: string | undefined): Set<string> {
  const out = new Set<string>();
  for (const part of (header ?? '').split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    const q = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
    if (name && !(q && Number(q.slice(2)) === 0)) out.add(name);
  }
  return out;
}

/** Whether `copy` exists and is not older than `file` (a copy left from an earlier build is never served). */
function freshCopy(file: string, copy: string): boolean {
  if (!existsSync(copy)) return false;
  try {
    return statSync(copy).mtimeMs >= statSync(file).mtimeMs;
  } catch {
    return false;
  }
}

/**
 * Serves `x.js.br` (or `.gz`) for `x.js` when the client accepts it and the copy is there, by
 * rewriting the URL for the static middleware that follows; sets the original's content type, the
 * encoding and `Vary`. Files without a copy fall through to on-the-fly compression.
 */
export function servePrecompressed(clientDir: string) {
  const root = normalize(clientDir + sep);
  return (req: Request, res: Response, next: NextFunction): void => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const type = COMPRESSIBLE_TYPES[extname(req.path)];
    if (!type) return next();
    let file: string;
    try {
      file = normalize(join(clientDir, decodeURIComponent(req.path)));
    } catch {
      return next();
    }
    if (!file.startsWith(root)) return next();
    res.vary('Accept-Encoding');
    const encodings = accepted(req.headers['accept-encoding']);
    for (const [encoding, suffix] of [
      ['br', '.br'],
      ['gzip', '.gz'],
    ] as const) {
      if (!encodings.has(encoding) || !freshCopy(file, file + suffix)) continue;
      res.setHeader('Content-Type', type);
      res.setHeader('Content-Encoding', encoding);
      const query = req.url.indexOf('?');
      req.url = req.path + suffix + (query >= 0 ? req.url.slice(query) : '');
      return next();
    }
    next();
  };
}
