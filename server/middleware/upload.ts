// One uploaded file per request (multipart field `file`), kept in memory: multer's limits
// give 413 when it is too large; the extension, the declared type and the bytes (UTF-8
// text, no NUL) must all fit, else 415.
import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import { extname } from 'node:path';
import { HttpError } from '../http-error.js';

export interface UploadRule {
  maxBytes: number;
  /** Lower-case, with the dot. */
  extensions: string[];
  mimeTypes: string[];
}

export const STUDY_UPLOAD: UploadRule = {
  maxBytes: 256 * 1024,
  extensions: ['.yaml', '.yml'],
  // Browsers send any of these (or nothing specific) for a YAML file.
  mimeTypes: ['application/yaml', 'application/x-yaml', 'text/yaml', 'text/x-yaml', 'text/plain', 'application/octet-stream'],
};

export const CSV_UPLOAD: UploadRule = {
  maxBytes: 2 * 1024 * 1024,
  extensions: ['.csv'],
  mimeTypes: ['text/csv', 'application/csv', 'text/plain', 'application/vnd.ms-excel', 'application/octet-stream'],
};

export interface UploadedText {
  name: string;
  text: string;
}

export function singleTextFile(rule: UploadRule) {
  const m = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: rule.maxBytes, files: 1, fields: 8, fieldSize: 64 * 1024, parts: 10 },
  }).single('file');
  return (req: Request, res: Response, next: NextFunction) => {
    if (!req.is('multipart/form-data')) return next(new HttpError(415, 'expected multipart/form-data with a file field named "file"'));
    m(req, res, (err?: unknown) => {
      if (err) return next(err);
      try {
        checkFile(req, rule);
        next();
      } catch (e) {
        next(e);
      }
    });
  };
}

function checkFile(req: Request, rule: UploadRule) {
  const file = req.file;
  if (!file) throw new HttpError(400, 'no file: send it in the multipart field "file"');
  const ext = extname(file.originalname).toLowerCase();
  if (!rule.extensions.includes(ext)) throw new HttpError(415, `'${file.originalname}': expected a ${rule.extensions.join(' or ')} file`);
  const mime = file.mimetype.split(';')[0].trim().toLowerCase();
  if (!rule.mimeTypes.includes(mime)) throw new HttpError(415, `'${file.originalname}': type ${mime} is not accepted`);
  if (file.buffer.includes(0)) throw new HttpError(415, `'${file.originalname}' is not a text file`);
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
  } catch {
    throw new HttpError(415, `'${file.originalname}' is not UTF-8 text`);
  }
}

export function uploadedText(req: Request): UploadedText {
  const file = req.file!;
  const text = new TextDecoder('utf-8').decode(file.buffer).replace(/^\uFEFF/, '');
  // Keep only the base name, with anything unusual replaced: it shows in messages and diagnostics.
  const name = file.originalname.split(/[\\/]/).pop()!.replace(/[^A-Za-z0-9._-]/g, '_').slice(0, 120) || 'upload';
  return { name, text };
}
