/**
 * `/api/imports`: roster (admin) and measured kicks (staff of the squad). Multipart field
 * `file` (CSV, ≤ 5 MB, in memory), `?dryRun=true` previews and writes nothing.
 */
import type { NextFunction, Request, Response } from 'express';
import { Router } from 'express';
import multer from 'multer';
import { requireRole, requireStaff } from '../auth/passport';
import { HttpError, Invalid } from '../errors';
import { unsafeJsonPath } from '../json-guard';
import { scopeOf } from '../scope/scope.middleware';
import { MAX_UPLOAD_BYTES } from './csv';
import type { ImportRunner } from './import-runner';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 5, fieldSize: 64 * 1024 },
  fileFilter: (_req, file, done) => {
    const byName = /\.(csv|txt)$/i.test(file.originalname);
    const byType = ['text/csv', 'text/plain', 'application/vnd.ms-excel', 'application/csv', 'application/octet-stream'].includes(
      file.mimetype,
    );
    if (byName && byType) done(null, true);
    else done(new HttpError(400, 'file_not_csv', 'Only CSV files (.csv) can be imported', [{ field: 'file', message: 'Not a CSV file' }]));
  },
});

/** Runs multer and turns its errors into clear 400s. */
function receiveFile(req: Request, res: Response, next: NextFunction): void {
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      const message =
        err.code === 'LIMIT_FILE_SIZE'
          ? `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB`
          : `The upload was refused: ${err.message}`;
      return next(
        // 413 Content Too Large (RFC 9110 §15.5.14) for a file over the limit, as for any oversized body.
        new HttpError(
          err.code === 'LIMIT_FILE_SIZE' ? 413 : 400,
          err.code === 'LIMIT_FILE_SIZE' ? 'file_too_large' : 'upload_invalid',
          message,
          [{ field: err.field ?? 'file', message }],
        ),
      );
    }
    next(err);
  });
}

function fileOf(req: Request): { name: string; buffer: Buffer } {
  if (!req.file) throw new Invalid('Attach the CSV file in the multipart field "file"', [{ field: 'file', message: 'Required' }]);
  return { name: req.file.originalname, buffer: req.file.buffer };
}

function dryRunOf(req: Request): boolean {
  const v = req.query['dryRun'];
  if (v === undefined || v === 'false') return false;
  if (v === 'true') return true;
  throw new Invalid('dryRun must be true or false', [{ field: 'dryRun', message: 'must be true or false' }]);
}

/** Builds the imports router (behind authentication and scope); the imports themselves run on `runner`'s worker thread. */
export function importsRouter(runner: ImportRunner): Router {
  const router = Router();
  router.post('/roster', requireRole('admin'), receiveFile, async (req, res) => {
    const result = await runner.roster(scopeOf(req).user, fileOf(req), dryRunOf(req));
    res.status(result.dryRun || result.alreadyImported ? 200 : 201).json(result);
  });
  router.post('/kicks', requireStaff(), receiveFile, async (req, res) => {
    const body = req.body as Record<string, unknown>;
    let mapping: unknown;
    try {
      mapping = JSON.parse(typeof body['mapping'] === 'string' ? body['mapping'] : '');
    } catch {
      throw new Invalid('The mapping field must hold JSON', [{ field: 'mapping', message: 'Not JSON' }]);
    }
    const unsafe = unsafeJsonPath(mapping);
    if (unsafe) throw new Invalid(`The mapping is refused — ${unsafe.field}: ${unsafe.message}`, [unsafe]);
    const result = await runner.kicks(scopeOf(req).user, fileOf(req), mapping, dryRunOf(req));
    res.status(result.dryRun || result.alreadyImported ? 200 : 201).json(result);
  });
  return router;
}
