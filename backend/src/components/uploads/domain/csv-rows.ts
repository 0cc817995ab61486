import { once } from 'node:events';
import type { Readable } from 'node:stream';
import { parse, type Parser } from 'csv-parse';
import iconv from 'iconv-lite';
import { sniffDelimiter, type Delimiter } from '@shared/ingest/delimiter-sniffing';
import { sniffEncoding } from '@shared/ingest/encoding-sniffing';

/** A whole-file problem a person can fix (empty, zip, binary…); nothing was read. */
export class FileProblem extends Error {}

/** Bytes examined before deciding the encoding and the delimiter. */
const HEAD_BYTES = 64 * 1024;

export interface CsvRows {
  encoding: 'utf-8' | 'windows-1252';
  delimiter: Delimiter;
  /** Rows as arrays of cells, the header first. Blank lines come through as `['']`, so row numbers match the file. */
  rows: Parser;
}

/**
 * Streams a CSV upload: looks at the first 64 KB to refuse binary files and choose the encoding and delimiter,
 * then decodes and parses the rest as it arrives. Only the head and the parser's buffers are ever in memory.
 */
export async function openCsvRows(bytes: Readable): Promise<CsvRows> {
  const source = bytes[Symbol.asyncIterator]() as AsyncIterator<Buffer>;
  const headChunks: Buffer[] = [];
  let headSize = 0;
  let ended = false;
  while (headSize < HEAD_BYTES) {
    const next = await source.next();
    if (next.done) {
      ended = true;
      break;
    }
    headChunks.push(next.value);
    headSize += next.value.length;
  }
  const head = Buffer.concat(headChunks);
  const sniffed = sniffEncoding(head.subarray(0, HEAD_BYTES));
  if (sniffed.kind === 'refused') throw new FileProblem(sniffed.message);

  const decoder = iconv.getDecoder(sniffed.kind === 'utf-8' ? 'utf8' : 'windows-1252');
  const headText = decoder.write(head);
  const delimiter = sniffDelimiter(headText.slice(0, HEAD_BYTES));
  const rows = parse({ delimiter, relax_column_count: true, relax_quotes: true, skip_empty_lines: false });

  // Feeds the parser with backpressure; a source error (client gone, size limit) ends the parser with it.
  const pump = async () => {
    if (!rows.write(headText)) await once(rows, 'drain');
    if (!ended) {
      for (let next = await source.next(); !next.done; next = await source.next()) {
        if (!rows.write(decoder.write(next.value))) await once(rows, 'drain');
      }
    }
    rows.end(decoder.end() ?? '');
  };
  pump().catch((err: Error) => rows.destroy(err));
  return { encoding: sniffed.kind, delimiter, rows };
}
