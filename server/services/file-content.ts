// What an uploaded file is, judged by its bytes (never its name) against an allow-list, and
// whether its name is a plain file name.
import { createHash } from 'node:crypto';
import { AppError, ValidationError } from '../errors';

// file-type 16 is the last CommonJS release; it reads magic numbers, not names.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { fromBuffer } = require('file-type') as { fromBuffer(buffer: Buffer): Promise<{ ext: string; mime: string } | undefined> };

export type FileKind = 'photo' | 'document';

export const ALLOWED_TYPES: Record<string, FileKind> = {
  'image/jpeg': 'photo',
  'image/png': 'photo',
  'image/webp': 'photo',
  'application/pdf': 'document',
};

/** An upload whose name and content passed the checks, ready to be stored. */
export interface CheckedFile {
  fileName: string;
  contentType: string;
  kind: FileKind;
  sizeBytes: number;
  sha256: string;
  buffer: Buffer;
}

/** Refuses names that look like paths or carry control characters, instead of guessing. */
export function checkFileName(name: string): string {
  const trimmed = name.toWellFormed().normalize('NFC').trim();
  // eslint-disable-next-line no-control-regex
  if (trimmed.length === 0 || trimmed.length > 200 || /[\\/\u0000-\u001f\u007f]/.test(trimmed) || trimmed.split('.').every((p) => p === '')) {
    throw new ValidationError('The file name is not acceptable: use a plain name without folders.', { file: ['Plain file names only'] });
  }
  if (trimmed.includes('..')) throw new ValidationError('The file name is not acceptable: use a plain name without folders.', { file: ['Plain file names only'] });
  return trimmed;
}

/** The content type and kind the bytes show; 415 unless it is one of the `accepted` kinds. */
async function detectKind(buffer: Buffer, accepted: readonly FileKind[]): Promise<{ contentType: string; kind: FileKind }> {
  // A truncated file makes the detector throw; it is simply not an allowed type.
  const detected = await fromBuffer(buffer).catch(() => undefined);
  const kind = detected ? ALLOWED_TYPES[detected.mime] : undefined;
  if (!detected || !kind) {
    const allowed = accepted.includes('document') ? 'JPEG, PNG or WebP photos and PDF documents' : 'JPEG, PNG or WebP photos';
    throw new AppError(415, 'UNSUPPORTED_FILE_TYPE', `Only ${allowed} can be uploaded; this file is none of those.`);
  }
  if (!accepted.includes(kind)) throw new AppError(415, 'UNSUPPORTED_FILE_TYPE', 'A photo must be a JPEG, PNG or WebP image.');
  return { contentType: detected.mime, kind };
}

/** Checks the name, then the bytes; nothing is stored yet. */
export async function checkUpload(upload: { originalName: string; buffer: Buffer }, accepted: readonly FileKind[]): Promise<CheckedFile> {
  const fileName = checkFileName(upload.originalName);
  const { contentType, kind } = await detectKind(upload.buffer, accepted);
  return {
    fileName,
    contentType,
    kind,
    sizeBytes: upload.buffer.length,
    sha256: createHash('sha256').update(upload.buffer).digest('hex'),
    buffer: upload.buffer,
  };
}
