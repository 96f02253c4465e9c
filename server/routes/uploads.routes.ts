import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { UploadListQuerySchema } from '../../shared/schemas/upload';
import { UPLOAD_MAX_BYTES } from '../../shared/upload-columns';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import type { Db } from '../db/client';
import { HttpError, ValidationError } from '../errors';
import { listUploads, uploadEpisodes } from '../services/uploads.service';
import { uploadTemplateCsv } from '../services/uploads-template';

const DryRunSchema = z.object({
  dryRun: z.enum(['1', '0', 'true', 'false'], { error: 'Say dryRun=1 to check the file, or dryRun=0 to save it' }),
});

/** One file in memory (field `file`), at most 10 MiB; multer's errors become our JSON errors. */
function singleCsv(): RequestHandler {
  const handler = multer({ storage: multer.memoryStorage(), limits: { fileSize: UPLOAD_MAX_BYTES, files: 1, fields: 5 } }).single('file');
  return (req, res, next) => {
    handler(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(new HttpError(413, `The file is larger than ${UPLOAD_MAX_BYTES / 1024 / 1024} MiB; split it, or gzip it (a .csv.gz file is accepted)`));
        }
        if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
          return next(new ValidationError('Send one CSV file in the form field “file”'));
        }
        return next(new ValidationError(`The upload could not be read: ${err.message}`));
      }
      next(err);
    });
  };
}

/** CSV uploads of episodes and assessments by the clinic; the template for anyone preparing one. */
export function uploadRoutes(db: Db): Router {
  const router = Router();
  const clinic = requireRole('lead', 'clinician');

  router.get('/uploads/template.csv', requireRole('lead', 'clinician', 'steward'), (_req, res) => {
    res.type('text/csv; charset=utf-8').attachment('loadline-episodes-template.csv').send(uploadTemplateCsv());
  });
  router.get('/uploads', requireRole('lead', 'clinician', 'steward'), async (req, res) => {
    res.json(await listUploads(db, scopeFromRequest(req), UploadListQuerySchema.parse(req.query)));
  });
  router.post('/uploads/episodes', clinic, singleCsv(), async (req, res) => {
    const { dryRun } = DryRunSchema.parse(req.query);
    if (!req.file) throw new ValidationError('Send the CSV file in the form field “file”');
    const answer = await uploadEpisodes(db, scopeFromRequest(req), req.file, dryRun === '1' || dryRun === 'true');
    res.status(answer.status).json(answer.body);
  });
  return router;
}
