import { once } from 'node:events';
import type { Readable } from 'node:stream';
import { parse } from 'csv-parse';
import iconv from 'iconv-lite';
import { sniffDelimiter, type Delimiter } from '@shared/ingest/delimiter-sniffing';
import { sniffEncoding } from '@shared/ingest/encoding-sniffing';
import { LineSplitter } from './line-splitter';

/** A whole-file problem a person can fix (empty, zip, binary…); nothing was read. */
export class FileProblem extends Error {}

/** Bytes examined before deciding the encoding and the delimiter. */
const HEAD_BYTES = 64 * 1024;

export interface CsvRows {
  encoding: 'utf-8' | 'windows-1252';
  delimiter: Delimiter;
  /**
   * Rows as arrays of cells, the header first, in batches (one per chunk of input). Blank lines come through as
   * `['']`, so row numbers match the file.
   */
  batches: AsyncIterable<string[][]>;
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
  async function* texts(): AsyncGenerator<string> {
    yield headText;
    if (!ended)
      for (let next = await source.next(); !next.done; next = await source.next()) yield decoder.write(next.value);
    const last = decoder.end();
    if (last) yield last;
  }
  return { encoding: sniffed.kind, delimiter, batches: rowBatches(texts(), delimiter) };
}

/**
 * Splits text into rows without a general CSV parser while it has no quotes (what meter exports almost always
 * are: a fifth of the parse time). From the first line holding a `"` on, csv-parse reads the rest, told the line
 * ending already seen, so every row comes out as csv-parse alone would give it.
 */
export async function* rowBatches(texts: AsyncIterable<string>, delimiter: Delimiter): AsyncGenerator<string[][]> {
  const splitter = new LineSplitter(delimiter);
  const iterator = texts[Symbol.asyncIterator]();
  let handOver: string | null = null;
  let lines = 0;
  for (let next = await iterator.next(); !next.done; next = await iterator.next()) {
    const batch: string[][] = [];
    handOver = splitter.push(next.value, batch);
    lines += batch.length;
    if (batch.length) yield batch;
    if (handOver !== null) break;
  }
  if (handOver === null) {
    const batch: string[][] = [];
    splitter.end(batch);
    if (batch.length) yield batch;
    return;
  }
  const eol = splitter.lineEnding;
  const parser = parse({
    delimiter,
    relax_column_count: true,
    relax_quotes: true,
    skip_empty_lines: false,
    ...(eol ? { record_delimiter: eol } : {}),
  });
  // The lines already split go in again as blank lines (dropped below), so csv-parse's messages give file lines.
  const rest = (eol ?? '').repeat(lines) + handOver;
  let skip = lines;
  // Feeds the parser with backpressure; a source error (client gone, size limit) ends the parser with it.
  const pump = async () => {
    if (!parser.write(rest)) await once(parser, 'drain');
    for (let next = await iterator.next(); !next.done; next = await iterator.next()) {
      if (!parser.write(next.value)) await once(parser, 'drain');
    }
    parser.end();
  };
  pump().catch((err: Error) => parser.destroy(err));
  let batch: string[][] = [];
  for await (const record of parser as AsyncIterable<string[]>) {
    if (skip > 0) {
      skip--;
      continue;
    }
    batch.push(record);
    if (batch.length >= 1000) {
      yield batch;
      batch = [];
    }
  }
  if (batch.length) yield batch;
}
