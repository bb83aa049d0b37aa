import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Router, type Request, type RequestHandler } from 'express';
import multer from 'multer';
import { commitRequest, previewChange, uploadFields } from '@shared/contracts/imports';
import { AppError } from '../http/app-error';
import { allow, studioOf } from '../http/auth-middleware';
import { idParam, parseBody } from '../http/validate';
import type { ImportService } from './import-service';

export interface UploadSettings {
  /** Largest accepted file, in megabytes (UPLOAD_LIMIT_MB). */
  limitMb: number;
  /** Where uploads wait between preview and commit. */
  directory?: string;
}

export function defaultUploadDirectory(): string {
  return path.join(os.tmpdir(), 'kerfcast-uploads');
}

// Multer's own errors become the standard error shape; the size limit is a 413 that names it.
function receiveFile(settings: UploadSettings): RequestHandler {
  const directory = settings.directory ?? defaultUploadDirectory();
  fs.mkdirSync(directory, { recursive: true });
  const upload = multer({
    dest: directory,
    limits: { fileSize: Math.round(settings.limitMb * 1024 * 1024), files: 1, fields: 10, fieldSize: 100_000 },
  }).single('file');
  return (req, res, next) => {
    upload(req, res, (error: unknown) => {
      if (!error) return next();
      const code = (error as { code?: string }).code;
      if (code === 'LIMIT_FILE_SIZE') {
        const message = `The file is larger than the ${settings.limitMb} MB upload limit`;
        return next(new AppError('too_large', 413, message, [{ path: ['file'], message }]));
      }
      if (code === 'LIMIT_UNEXPECTED_FILE') {
        const message = 'Send the CSV file in the multipart field "file" (one file per request)';
        return next(new AppError('invalid_input', 400, message, [{ path: ['file'], message }]));
      }
      next(error);
    });
  };
}

function uploadFieldsOf(req: Request) {
  const body = (req.body ?? {}) as Record<string, unknown>;
  let mapping: unknown;
  if (typeof body['mapping'] === 'string' && body['mapping'].trim() !== '') {
    try {
      mapping = JSON.parse(body['mapping']);
    } catch {
      const message = 'mapping must be JSON text such as {"date":"Week","terms":["lantern panel"]}';
      throw new AppError('invalid_input', 400, message, [{ path: ['mapping'], message }]);
    }
  }
  const kind = body['kind'] === '' ? undefined : body['kind'];
  const dateOrder = body['dateOrder'] === '' ? undefined : body['dateOrder'];
  return uploadFields.parse({ kind, dateOrder, mapping });
}

// Mounted at /api/studios/:studioId/imports after loadStudio. Owner and partner import; crew read.
export function importsRouter(imports: ImportService, settings: UploadSettings): Router {
  const router = Router({ mergeParams: true });
  const mayImport = allow('owner', 'partner');

  router.get('/', async (req, res) => {
    res.json(await imports.list(studioOf(req)));
  });

  router.post('/', mayImport, receiveFile(settings), async (req, res) => {
    if (!req.file) {
      const message = 'Attach the CSV file in the multipart field "file"';
      throw new AppError('invalid_input', 400, message, [{ path: ['file'], message }]);
    }
    const file = { path: req.file.path, originalName: req.file.originalname, size: req.file.size };
    let fields;
    try {
      fields = uploadFieldsOf(req);
    } catch (error) {
      await fs.promises.rm(file.path, { force: true });
      throw error;
    }
    res.status(201).json(await imports.upload(studioOf(req), req.user!, file, fields));
  });

  router.get('/:importId', async (req, res) => {
    res.json(await imports.detail(studioOf(req), idParam(req, 'importId')));
  });

  router.patch('/:importId', mayImport, async (req, res) => {
    res.json(await imports.changePreview(studioOf(req), idParam(req, 'importId'), parseBody(previewChange, req)));
  });

  router.post('/:importId/commit', mayImport, async (req, res) => {
    res.json(await imports.commit(studioOf(req), idParam(req, 'importId'), parseBody(commitRequest, req)));
  });

  router.delete('/:importId', mayImport, async (req, res) => {
    await imports.remove(studioOf(req), idParam(req, 'importId'));
    res.status(204).end();
  });

  return router;
}
