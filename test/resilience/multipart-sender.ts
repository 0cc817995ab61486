import { request } from 'node:http';

export interface UploadAnswer {
  /** HTTP status, or 0 when the connection ended without an answer. */
  status: number;
  body: string;
  /** True when this side cut the request off on purpose (an aborted upload). */
  aborted: boolean;
  /** Set when the connection failed before an answer arrived (reset, hang-up). */
  error?: string;
}

export interface MultipartUpload {
  url: string;
  headers: Record<string, string>;
  fields: Record<string, string>;
  fileName: string;
  /** The file's bytes, produced as they are sent (big files are never held whole). */
  file: Iterable<Buffer> | AsyncIterable<Buffer>;
  /** Cut the connection after this many bytes of the body (an upload abandoned mid-way). */
  abortAfterBytes?: number;
}

const BOUNDARY = '----rillmark-hostile-7f3a9c';

/** Sends one multipart upload over its own connection (chunked, with back-pressure) and returns the answer. */
export function sendMultipart(upload: MultipartUpload): Promise<UploadAnswer> {
  return new Promise((done) => {
    let settled = false;
    const settle = (answer: UploadAnswer) => {
      if (!settled) {
        settled = true;
        done(answer);
      }
    };
    const req = request(upload.url, {
      method: 'POST',
      headers: { ...upload.headers, 'content-type': `multipart/form-data; boundary=${BOUNDARY}` },
    });
    req.on('response', (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () =>
        settle({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString(), aborted: false }),
      );
      res.on('error', (err) => settle({ status: 0, body: '', aborted: false, error: err.message }));
    });
    req.on('error', (err) => settle({ status: 0, body: '', aborted: false, error: err.message }));

    let sent = 0;
    /** Writes with back-pressure; false once the request is cut off on purpose (then nothing more is sent). */
    const write = async (chunk: Buffer): Promise<boolean> => {
      if (req.destroyed) return false;
      const limit = upload.abortAfterBytes;
      if (limit !== undefined && sent + chunk.length >= limit) {
        req.write(chunk.subarray(0, Math.max(0, limit - sent)));
        await new Promise((r) => setTimeout(r, 20));
        req.destroy();
        settle({ status: 0, body: '', aborted: true });
        return false;
      }
      sent += chunk.length;
      if (!req.write(chunk)) {
        // Drained, or the server closed the connection (then the next write sees it destroyed).
        await new Promise<void>((r) => {
          const go = () => (req.off('drain', go), req.off('close', go), r());
          req.on('drain', go);
          req.on('close', go);
        });
      }
      return true;
    };
    void (async () => {
      try {
        let head = '';
        for (const [name, value] of Object.entries(upload.fields)) {
          head += `--${BOUNDARY}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
        }
        head +=
          `--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; ` +
          `filename="${browserEscaped(upload.fileName)}"\r\n` +
          'Content-Type: text/csv\r\n\r\n';
        if (!(await write(Buffer.from(head)))) return;
        for await (const chunk of upload.file) if (!(await write(chunk))) return;
        if (!(await write(Buffer.from(`\r\n--${BOUNDARY}--\r\n`)))) return;
        req.end();
      } catch (err) {
        req.destroy();
        settle({ status: 0, body: '', aborted: false, error: (err as Error).message });
      }
    })();
  });
}

/** As browsers write a file name into the part header: quotes and control characters percent-escaped. */
function browserEscaped(name: string): string {
  const hex = (c: string) => c.charCodeAt(0).toString(16).toUpperCase().padStart(2, '0');
  // eslint-disable-next-line no-control-regex
  return name.replace(/["\u0000-\u001f\u007f]/g, (c) => `%${hex(c)}`);
}
