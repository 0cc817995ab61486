import type { Readable } from 'node:stream';
import busboy from 'busboy';
import type { Request } from 'express';
import { AppError } from '../../../platform/app-error';
import { limitMessage } from '../domain/upload-errors';

/** Multipart overhead allowed on top of the file-size limit before a Content-Length is refused outright. */
const OVERHEAD = 256 * 1024;

/** The file's name as sent, without control characters and short enough to store (upload.file_name holds 255). */
function fileNameOf(sent: string | undefined): string {
  // eslint-disable-next-line no-control-regex
  const name = (sent ?? '').replace(/[\u0000-\u001f\u007f]/g, '').trim();
  if (!name) return 'upload.csv';
  return name.length <= 200 ? name : `${name.slice(0, 150)}…${name.slice(-40)}`;
}

/** Reads and throws away what is left of a request (up to `cap` bytes), so the client can read our answer. */
function drain(req: Request, cap: number): Promise<void> {
  return new Promise((resolve) => {
    let seen = 0;
    req.on('data', (chunk: Buffer) => {
      seen += chunk.length;
      if (seen > cap) req.destroy();
    });
    req.once('end', resolve);
    req.once('close', resolve);
    req.resume();
  });
}

/**
 * Streams a multipart upload: form fields sent before the `file` part are collected, then `handle` gets the file
 * as a stream while it arrives. Resolves with `handle`'s result once the whole request has been read, so the
 * answer never races the client still sending.
 */
export async function receiveUpload<T>(
  req: Request,
  maxBytes: number,
  handle: (fields: Record<string, string>, file: Readable, fileName: string) => Promise<T>,
): Promise<T> {
  if (!req.is('multipart/form-data')) {
    throw AppError.invalid(
      'file',
      'send the file as multipart/form-data with a part named "file" (curl -F file=@export.csv)',
    );
  }
  const length = Number(req.headers['content-length']);
  if (Number.isFinite(length) && length > maxBytes + OVERHEAD) {
    await drain(req, 4 * maxBytes);
    throw new AppError('payload_too_large', limitMessage('The file', maxBytes), [
      { field: 'file', message: 'is over the size limit' },
    ]);
  }
  return new Promise<T>((resolve, reject) => {
    const parser = busboy({
      headers: req.headers,
      limits: { fileSize: maxBytes + 1, files: 1, fields: 20, fieldSize: 512 * 1024 },
    });
    const fields: Record<string, string> = {};
    let work: Promise<T> | null = null;
    parser.on('field', (name, value) => {
      fields[name] = value;
    });
    let active: Readable | null = null;
    parser.on('file', (name, file, info) => {
      // Owned here from the first moment: an error (client gone, parser failure) may come before `handle` reads it.
      file.on('error', () => undefined);
      if (name !== 'file' || work) {
        file.resume();
        return;
      }
      active = file;
      work = Promise.resolve().then(() => handle(fields, file, fileNameOf(info.filename)));
      work.catch(() => file.resume());
    });
    // A client that goes away mid-file leaves the parser waiting for an end that never comes: fail the file instead.
    req.once('close', () => {
      if (req.complete) return;
      const err = Object.assign(new Error('aborted'), { code: 'ECONNRESET' });
      req.unpipe(parser);
      (active as Readable | null)?.destroy(err);
      parser.destroy();
      if (work) work.then(resolve, reject);
      else reject(AppError.invalid('file', 'the upload was interrupted before the file arrived'));
    });
    parser.on('close', () => {
      if (work) work.then(resolve, reject);
      else
        reject(
          AppError.invalid(
            'file',
            'the form has no part named "file"; send the CSV as that part, after the other fields',
          ),
        );
    });
    parser.on('error', (err: Error) => {
      req.unpipe(parser);
      // The file part will get no more bytes and no end: fail it, so whoever reads it stops.
      (active as Readable | null)?.destroy(err);
      drain(req, 4 * maxBytes).finally(() => {
        if (work) work.then(resolve, reject);
        else reject(AppError.invalid('file', `the multipart body could not be read (${err.message})`));
      });
    });
    req.pipe(parser);
  });
}
