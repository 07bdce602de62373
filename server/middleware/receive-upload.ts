// Receives one multipart file (form field "file") into memory, with the configured size limit.
// Item files and booking photos both come through here, so limits and messages are the same.
import { ERROR_CODES } from '../../shared/errors';
import type { Request } from 'express';
import multer from 'multer';
import { AppError, ValidationError } from '../errors';

export interface ReceivedFile {
  originalName: string;
  buffer: Buffer;
}

/** Returns a reader that parses a request's multipart body (fields land in req.body). */
export function uploadReader(maxBytes: number): (req: Request) => Promise<void> {
  // File names arrive as UTF-8 (multer's default reads them as latin1).
  const upload = multer({
    storage: multer.memoryStorage(),
    preservePath: true,
    defParamCharset: 'utf8',
    limits: { fileSize: maxBytes, files: 1, fields: 4, fieldSize: 1024 },
  }).single('file');
  return (req) =>
    new Promise<void>((resolve, reject) =>
      upload(req, req.res!, (error: unknown) => {
        if (!error) return resolve();
        const code = (error as { code?: string }).code;
        if (code === 'LIMIT_FILE_SIZE')
          return reject(new AppError(413, ERROR_CODES.fileTooLarge, `Files can be at most ${Math.round(maxBytes / 1024 / 1024)} MB.`));
        if (typeof code === 'string' && code.startsWith('LIMIT_')) return reject(new ValidationError('Send one file in the form field "file".'));
        reject(new ValidationError('The upload could not be read as multipart form data.'));
      }),
    );
}

/** The file the reader received; a request without one is a 400. */
export function receivedFile(req: Request): ReceivedFile {
  if (!req.file) throw new ValidationError('Attach the file in the form field "file".', { file: ['Required'] });
  return { originalName: req.file.originalname, buffer: req.file.buffer };
}
