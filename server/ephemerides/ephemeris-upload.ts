// Receives the multipart upload with multer onto disk, in <dataDir>/uploads/ under a generated name
// (never the client's), within ECLIPTA_UPLOAD_LIMIT_MB. Answers the stored file and the text
// fields, and the list of every name it wrote so the caller can delete them whatever happens.
import { randomUUID } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import type { Writable } from 'node:stream';
import type { Request, Response } from 'express';
import multer, { MulterError } from 'multer';
import type { Config } from '../config';
import { ApiError, badRequest, tooLarge } from '../errors';

export interface ReceivedUpload {
  file: { path: string; originalName: string; size: number } | null;
  fields: Record<string, unknown>;
}

export const uploadsDir = (config: Config): string => path.join(config.dataDir, 'uploads');

/**
 * Removes what a killed process left in uploads/ (a received file, a point spool): a request
 * deletes its own files when it ends, so at start-up any file there belongs to a request that
 * died with the process. One server process owns a data dir. Answers how many were removed.
 */
export function clearLeftoverUploads(config: Config): number {
  const dir = uploadsDir(config);
  if (!existsSync(dir)) return 0;
  const leftovers = readdirSync(dir).filter((name) => /^[0-9a-f-]{36}\.(upload|points)$/.test(name));
  for (const name of leftovers) rmSync(path.join(dir, name), { force: true });
  return leftovers.length;
}

function uploadError(err: unknown, config: Config): ApiError | unknown {
  if (err instanceof MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return tooLarge(`The file is larger than the upload limit of ${config.uploadLimitMb} MB (ECLIPTA_UPLOAD_LIMIT_MB).`);
    }
    if (err.code === 'LIMIT_UNEXPECTED_FILE') {
      return badRequest(`Send one file, in the form field "file" (got a file in ${JSON.stringify(err.field ?? '')}).`, [{ path: err.field ?? 'file', message: 'unexpected file field' }]);
    }
    return badRequest(`The upload form could not be read: ${err.message}.`, err.field ? [{ path: err.field, message: err.message }] : undefined, 'invalid_upload');
  }
  if (err instanceof Error && /aborted|unexpected end|malformed|boundary/i.test(err.message)) {
    return badRequest(`The upload did not arrive whole (${err.message}); nothing was kept.`, undefined, 'invalid_upload');
  }
  return err;
}

/**
 * Runs multer for this request; `written` collects the generated paths as they are created.
 * `onFile` sees the fields that came before the file and may answer a stream to be written with
 * the file's bytes as they arrive, beside the copy on disk (the slower of the two sets the pace).
 */
export function receiveUpload(
  config: Config, req: Request, res: Response, written: string[],
  onFile?: (early: Record<string, unknown>) => Writable | null,
): Promise<ReceivedUpload> {
  const destination = uploadsDir(config);
  mkdirSync(destination, { recursive: true });
  const disk = multer.diskStorage({
    destination,
    filename: (_req, _file, done) => {
      const name = `${randomUUID()}.upload`;
      written.push(path.join(destination, name));
      done(null, name);
    },
  });
  const storage: multer.StorageEngine = {
    _handleFile(request, file, done) {
      disk._handleFile(request, file, done);
      const early: unknown = request.body;
      const tap = onFile?.(early !== null && typeof early === 'object' ? { ...(early as Record<string, unknown>) } : {});
      if (tap) file.stream.pipe(tap);
    },
    _removeFile: (request, file, done) => disk._removeFile(request, file, done),
  };
  const upload = multer({
    storage,
    limits: { fileSize: Math.floor(config.uploadLimitMb * 1024 * 1024), files: 1, fields: 10, fieldSize: 4096, parts: 12 },
  }).single('file');
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (err) {
        reject(uploadError(err, config));
        return;
      }
      const body: unknown = req.body;
      const fields = body !== null && typeof body === 'object' ? { ...(body as Record<string, unknown>) } : {};
      const file = req.file ? { path: req.file.path, originalName: req.file.originalname, size: req.file.size } : null;
      resolve({ file, fields });
    });
  });
}
