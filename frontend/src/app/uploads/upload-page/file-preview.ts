import Papa from 'papaparse';
import { sniffDelimiter, type Delimiter } from '@shared/ingest/delimiter-sniffing';
import { decodeText } from '@shared/ingest/encoding-sniffing';

/** How much of a chosen file the browser reads for the preview; the server reads the whole file itself. */
const HEAD_BYTES = 64 * 1024;
const PREVIEW_ROWS = 21;

export type FilePreview =
  { ok: true; rows: string[][]; delimiter: Delimiter; encoding: string } | { ok: false; message: string };

/** Reads the start of a file as the server will (same encoding and delimiter sniffing) and splits it with papaparse. */
export async function previewFile(file: File): Promise<FilePreview> {
  const bytes = new Uint8Array(await file.slice(0, HEAD_BYTES).arrayBuffer());
  const decoded = decodeText(bytes);
  if (!decoded.ok) return { ok: false, message: `"${file.name}": ${decoded.message}` };
  const delimiter = sniffDelimiter(decoded.text);
  const parsed = Papa.parse<string[]>(decoded.text, { delimiter, preview: PREVIEW_ROWS, skipEmptyLines: false });
  const rows = parsed.data.filter((r, i) => i === 0 || r.length > 1 || (r[0] ?? '') !== '');
  return { ok: true, rows, delimiter, encoding: decoded.encoding };
}

/** A random tag sent with the file, so the page can find its upload while the server is still reading it. */
export function newClientRef(): string {
  return Array.from(crypto.getRandomValues(new Uint8Array(12)), (b) => b.toString(16).padStart(2, '0')).join('');
}
