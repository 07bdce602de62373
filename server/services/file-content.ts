// What an uploaded file is, judged by its bytes (never its name) against an allow-list, and the
// plain name it is stored under (its extension follows the bytes).
import { ERROR_CODES } from '../../shared/errors';
import { createHash } from 'node:crypto';
import { AppError, ValidationError } from '../errors';

// file-type 16 is the last CommonJS release; it reads magic numbers, not names.
// eslint-disable-next-line @typescript-eslint/no-require-imports -- its CommonJS export has no ES default the server's module setting imports cleanly.
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

/** The extension a stored file gets for each allowed type; other spellings the type is known by. */
const EXTENSIONS: Record<string, { canonical: string; aliases: string[] }> = {
  'image/jpeg': { canonical: 'jpg', aliases: ['jpg', 'jpeg'] },
  'image/png': { canonical: 'png', aliases: ['png'] },
  'image/webp': { canonical: 'webp', aliases: ['webp'] },
  'application/pdf': { canonical: 'pdf', aliases: ['pdf'] },
};

// C0 and C1 controls, and the Unicode bidirectional controls (marks, embeddings, overrides and
// isolates: U+061C, U+200E, U+200F, U+202A–U+202E, U+2066–U+2069), which can make
// "gnp\u202E.exe" read as "exe.png". Unicode Standard Annex #9, table 4.
// eslint-disable-next-line no-control-regex -- matching control characters is this pattern's purpose.
const INVISIBLE = /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;

const refused = () => new ValidationError('The file name is not acceptable: use a plain name without folders.', { file: ['Plain file names only'] });

/**
 * The name a file is stored and served under: the name sent, cleaned of control and bidirectional
 * characters, with the extension of the type its bytes show (a PNG sent as "evil.html" is kept as
 * "evil.png"). Names that look like paths are refused rather than guessed at.
 */
export function storedFileName(name: string, contentType: string): string {
  const cleaned = name.toWellFormed().normalize('NFC').replace(INVISIBLE, '').trim();
  if (cleaned.length === 0 || cleaned.length > 200 || /[\\/]/.test(cleaned) || cleaned.includes('..') || cleaned.split('.').every((p) => p === ''))
    throw refused();
  const dot = cleaned.lastIndexOf('.');
  const extension = dot >= 0 ? cleaned.slice(dot + 1) : '';
  const { canonical, aliases } = EXTENSIONS[contentType] ?? { canonical: 'bin', aliases: [] };
  if (aliases.includes(extension.toLowerCase())) return cleaned;
  // Trailing dots and spaces are dropped by some file systems and would hide the extension.
  const base = (dot >= 0 ? cleaned.slice(0, dot) : cleaned).replace(/[.\s]+$/, '') || 'file';
  return `${base}.${canonical}`;
}

/** The content type and kind the bytes show; 415 unless it is one of the `accepted` kinds. */
async function detectKind(buffer: Buffer, accepted: readonly FileKind[]): Promise<{ contentType: string; kind: FileKind }> {
  // A truncated file makes the detector throw; it is simply not an allowed type.
  const detected = await fromBuffer(buffer).catch(() => undefined);
  const kind = detected ? ALLOWED_TYPES[detected.mime] : undefined;
  if (!detected || !kind) {
    const allowed = accepted.includes('document') ? 'JPEG, PNG or WebP photos and PDF documents' : 'JPEG, PNG or WebP photos';
    throw new AppError(415, ERROR_CODES.unsupportedFileType, `Only ${allowed} can be uploaded; this file is none of those.`);
  }
  if (!accepted.includes(kind)) throw new AppError(415, ERROR_CODES.unsupportedFileType, 'A photo must be a JPEG, PNG or WebP image.');
  return { contentType: detected.mime, kind };
}

/** Checks the bytes, then names the file after what they are; nothing is stored yet. */
export async function checkUpload(upload: { originalName: string; buffer: Buffer }, accepted: readonly FileKind[]): Promise<CheckedFile> {
  const { contentType, kind } = await detectKind(upload.buffer, accepted);
  const fileName = storedFileName(upload.originalName, contentType);
  return {
    fileName,
    contentType,
    kind,
    sizeBytes: upload.buffer.length,
    sha256: createHash('sha256').update(upload.buffer).digest('hex'),
    buffer: upload.buffer,
  };
}
