import { readdirSync, readFileSync } from 'node:fs';
import { Readable } from 'node:stream';
import { parse } from 'csv-parse';
import iconv from 'iconv-lite';
import { describe, expect, it } from 'vitest';
import { sniffDelimiter, type Delimiter } from '@shared/ingest/delimiter-sniffing';
import { rowBatches } from './csv-rows';

/** What csv-parse alone gives (the parser the server used for every row before the quote-free fast path). */
async function csvParseRows(text: string, delimiter: Delimiter): Promise<string[][] | string> {
  const parser = parse({ delimiter, relax_column_count: true, relax_quotes: true, skip_empty_lines: false });
  const rows: string[][] = [];
  try {
    Readable.from([text]).pipe(parser);
    for await (const row of parser) rows.push(row);
  } catch (err) {
    return (err as Error).message;
  }
  return rows;
}

let seed = 20261202;
const random = (n: number) => {
  seed = (seed * 1103515245 + 12345) & 0x7fffffff;
  return seed % n;
};

/** The fast path's rows, with the text cut into chunks of random length (as a socket delivers it). */
async function fastRows(text: string, delimiter: Delimiter, maxChunk = 7): Promise<string[][] | string> {
  const chunks: string[] = [];
  for (let i = 0; i < text.length;) {
    const n = 1 + random(maxChunk);
    chunks.push(text.slice(i, i + n));
    i += n;
  }
  const rows: string[][] = [];
  try {
    for await (const batch of rowBatches(Readable.from(chunks), delimiter)) rows.push(...batch);
  } catch (err) {
    return (err as Error).message;
  }
  return rows;
}

describe('rowBatches gives the rows csv-parse gives', () => {
  const samples = new URL('../../../../../samples/', import.meta.url);
  const files = ['meters', 'runtime', 'broken', 'weather'].flatMap((dir) =>
    readdirSync(new URL(`${dir}/`, samples))
      .filter((f) => f.endsWith('.csv'))
      .map((f) => `${dir}/${f}`),
  );

  it.each(files)('%s', async (path) => {
    const text = iconv.decode(readFileSync(new URL(path, samples)), path.includes('1252') ? 'windows-1252' : 'utf8');
    const delimiter = sniffDelimiter(text);
    expect(await fastRows(text, delimiter, 200)).toEqual(await csvParseRows(text, delimiter));
  });

  it.each([
    ['quotes on the first line', '"Meter #","Start"\nM1,2026-01-01 00:00\n'],
    ['a quoted cell later, with a delimiter and a line end inside', 'm,t,v\nM1,a,1\nM2,"b,\nc",2\nM3,d,3\n'],
    ['CRLF lines with a quoted CRLF', 'm,v\r\nM1,1\r\nM2,"x\r\ny"\r\nM3,3'],
    ['a bare LF inside CRLF lines is a character', 'm,v\r\nM1,1\nM2,2\r\n'],
    ['a CR inside LF lines is a character', 'm,v\nM1,1\r\nM2,2\n'],
    ['old Mac line ends', 'm,v\rM1,1\rM2,2\r'],
    ['a CR ending the input', 'm,v\r'],
    ['blank lines and a trailing delimiter', 'm,v\n\nM1,1,\n\n'],
    ['no final line end', 'm,v\nM1,1'],
    ['a quote inside an unquoted cell', 'm,v\nM1,5" pipe\n'],
    ['an unclosed quote', 'm,v\nM1,"1\n'],
  ])('%s', async (_name, text) => {
    expect(await fastRows(text, ',')).toEqual(await csvParseRows(text, ','));
  });

  it('random short texts over a small alphabet, cut at random', async () => {
    const alphabet = ['a', 'b', ',', ';', '\t', '\n', '\r', '\r\n', '"', ' ', '1', '""', 'é'];
    for (let k = 0; k < 1500; k++) {
      const quotes = random(3) === 0;
      let text = '';
      for (let j = random(60); j > 0; j--) {
        const c = alphabet[random(alphabet.length)]!;
        if (quotes || !c.includes('"')) text += c;
      }
      const delimiter = ([',', ';', '\t'] as const)[random(3)]!;
      const expected = await csvParseRows(text, delimiter);
      const got = await fastRows(text, delimiter);
      // On a parse error the upload fails either way (a 500, the message only logged), so only the error has to
      // match, not the rows before it; csv-parse counts stray CRs inside cells as lines, which the skipped
      // quote-free lines do not reproduce, so the line number may differ in such texts.
      const withoutLine = (r: string[][] | string) => (typeof r === 'string' ? r.replace(/ at line \d+/, '') : r);
      if (typeof expected === 'string' || typeof got === 'string')
        expect({ text, got: withoutLine(got) }).toEqual({ text, got: withoutLine(expected) });
      else if (JSON.stringify(got) !== JSON.stringify(expected)) expect({ text, got }).toEqual({ text, got: expected });
    }
  }, 60_000);
});
