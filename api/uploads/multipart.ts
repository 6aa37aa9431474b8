/**
 * Receiving the file: multer with a storage engine that streams the part to a temp file
 * while hashing it (sha256) and counting bytes — never the whole file in memory — and
 * stops at the configured size with 413. The temp file is removed when the response ends.
 */
import { createHash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from '../http/errors';
import type { ReceivedFile } from './service';

export const UPLOAD_FIELD = 'file';

interface StoredFile {
  path: string;
  size: number;
  checksum: string;
}

class HashingDiskStorage implements multer.StorageEngine {
  constructor(private readonly dir: string) {}

  _handleFile(
    _req: Request,
    file: Express.Multer.File,
    cb: (error?: unknown, info?: Partial<Express.Multer.File> & StoredFile) => void,
  ): void {
    fs.mkdirSync(this.dir, { recursive: true });
    const target = path.join(this.dir, `${Date.now()}-${randomBytes(8).toString('hex')}.csv`);
    const hash = createHash('sha256');
    let size = 0;
    const tap = new Transform({
      transform(chunk: Buffer, _enc, next) {
        hash.update(chunk);
        size += chunk.length;
        next(null, chunk);
      },
    });
    pipeline(file.stream, tap, fs.createWriteStream(target)).then(
      () => cb(null, { path: target, size, checksum: hash.digest('hex') }),
      (err) => fs.rm(target, { force: true }, () => cb(err)),
    );
  }

  _removeFile(_req: Request, file: Express.Multer.File, cb: (error: Error | null) => void): void {
    fs.rm(file.path, { force: true }, () => cb(null));
  }
}

function megabytes(n: number): string {
  return `${(n / (1024 * 1024)).toLocaleString('en', { maximumFractionDigits: 1 })} MB`;
}

/** How refusals name the file and the setting that caps its size (a CSV by default). */
export interface FileWords {
  /** "the CSV", "the GeoJSON file" */
  kind: string;
  /** the environment variable of the size cap */
  setting: string;
}

const CSV_WORDS: FileWords = { kind: 'the CSV', setting: 'UPLOAD_MAX_BYTES' };

/** The multipart step of POST /api/uploads (and /api/boundaries): puts the received file on req.file. */
export function receiveFile(
  maxBytes: number,
  dir = path.join(os.tmpdir(), 'crestwatch-uploads'),
  words: FileWords = CSV_WORDS,
): RequestHandler {
  const single = multer({
    storage: new HashingDiskStorage(dir),
    limits: { fileSize: maxBytes, files: 1, fields: 20, parts: 25 },
  }).single(UPLOAD_FIELD);
  return (req, res, next) => {
    const t0 = performance.now();
    res.on('close', () => {
      const p = (req.file as (Express.Multer.File & Partial<StoredFile>) | undefined)?.path;
      if (p) fs.rm(p, { force: true }, () => {});
    });
    single(req, res, (err?: unknown) => {
      res.locals.receiveMs = Math.round(performance.now() - t0);
      if (!err) {
        if (!req.file) {
          return next(
            new AppError(
              400,
              'no_file',
              `Send ${words.kind} as multipart/form-data in a field named "${UPLOAD_FIELD}".`,
            ),
          );
        }
        return next();
      }
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(
            new AppError(
              413,
              'payload_too_large',
              `The file is larger than the upload limit of ${megabytes(maxBytes)} (set by ${words.setting}); nothing was loaded.`,
              {
                maxBytes,
              },
            ),
          );
        }
        if (err.code === 'LIMIT_UNEXPECTED_FILE') {
          return next(
            new AppError(
              400,
              'unexpected_field',
              `Send the file in the multipart field "${UPLOAD_FIELD}" (got "${err.field}").`,
            ),
          );
        }
        return next(
          new AppError(400, 'bad_multipart', `The multipart request was refused: ${err.message}.`, {
            reason: err.code,
          }),
        );
      }
      // busboy's complaints about a malformed body carry no status.
      const message = err instanceof Error ? err.message : String(err);
      return next(new AppError(400, 'bad_multipart', `The multipart request could not be read: ${message}.`));
    });
  };
}

export function receivedFile(req: Request): ReceivedFile {
  const f = req.file as Express.Multer.File & StoredFile;
  return { path: f.path, originalName: f.originalname, size: f.size, checksum: f.checksum };
}
