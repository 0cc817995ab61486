/**
 * A seeded generator of hostile uploads. Every file is built line by line from rows the generator made VALID
 * (meter, time, interval and volume clean; anything hostile only where the reader ignores it: a note, extra cells)
 * or INVALID (a meaningful cell that must be refused: NaN, 1e308, year 9999, a formula, an unknown meter…), so
 * the rows that must be stored are known without parsing the file again. Whole-file refusals (binary, NUL bytes in
 * the first 64 KB, a header that is no layout) expect nothing stored. Big files are produced in pieces as they are
 * sent, never held whole. Time slots are handed out per site so no two files ever hold the same reading.
 */
import { seededRandom, type Random } from '../quality/seeded-random';

export const METERS = ['HX-01', 'HX-02', 'HX-03', 'HX-04'];
const HEADER = 'Meter #,Interval Start,Interval (min),Usage (Gal),Note';
const BASE_MS = Date.UTC(2021, 0, 1);
const SLOT_MS = 15 * 60_000;
/** Bytes the server sniffs the encoding on: a NUL in here refuses the whole file. */
export const SNIFF_BYTES = 64 * 1024;

export interface ExpectedRow {
  meter: string;
  startMs: number;
  /** Stored volume in gallons as MariaDB's DECIMAL(12,4) prints it. */
  gallons: string;
}

export interface HostileCase {
  id: string;
  kind: string;
  /** Index of the site (of SITES) it is sent to. */
  site: number;
  fileName: string;
  /** The file in pieces; called once per send. */
  bytes: () => Iterable<Buffer>;
  /** Exactly the rows that must be stored (empty: nothing may be). */
  expected: ExpectedRow[];
  abortAfterBytes?: number;
}

export const SITES = 4;

/** Hands out 15-minute slots per site: each file's valid rows get times no other file uses. */
class Slots {
  private readonly next = Array<number>(SITES).fill(0);
  take(site: number, rows: number): number {
    const first = this.next[site]!;
    this.next[site]! += Math.ceil(rows / METERS.length) + 1;
    return first;
  }
}

const wall = (ms: number) => new Date(ms).toISOString().slice(0, 16).replace('T', ' ');

/** Notes that leave a row valid: formulas, quotes inside a cell, a BOM, odd scripts. */
const HARMLESS_NOTES = [
  '',
  'ok',
  "=cmd|' /C calc'!A0",
  '@SUM(1+1)',
  '+1+1',
  '-1',
  '=HYPERLINK(""http://evil.example"")',
  'said "hi" twice',
  '\uFEFFbom inside',
  'Café 28°F',
  '🚿💧',
  '\t tabbed \t',
];
/** Volumes that must be refused, and why (the row stays unstored). */
const BAD_VOLUMES = [
  'NaN',
  'Infinity',
  '-Infinity',
  '1e308',
  '1e3',
  '0x1F',
  '-5',
  '-0.001',
  '12.5.1',
  '',
  'abc',
  '=1+2',
  '+SUM(A1)',
  '@cmd',
  '-2+3',
  '100000000',
  '١٢',
  '1_000',
];
const BAD_TIMES = [
  '0000-01-01 00:00',
  '9999-12-31 23:45',
  '2021-02-30 00:00',
  '2021-13-01 00:00',
  '2021-01-01 25:00',
  '2031-06-01 00:00',
  'yesterday',
  '=NOW()',
  '',
];
const BAD_METERS = ['HX-99', '=HYPERLINK("http://evil.example")', '', 'hx 01 ; DROP TABLE meter'];
const BAD_MINUTES = ['0', '-15', '1441', 'abc', '15.5', 'NaN'];

/** Builds one file: lines in order, and the rows that must be stored. */
class FileBuilder {
  readonly parts: Array<string | Buffer> = [];
  readonly expected: ExpectedRow[] = [];
  private row = 0;

  constructor(
    private readonly rnd: Random,
    private readonly firstSlot: number,
    readonly eol = '\n',
  ) {}

  header(): this {
    return this.raw(HEADER + this.eol);
  }

  raw(part: string | Buffer): this {
    this.parts.push(part);
    return this;
  }

  /** The next valid row: volume from a few decimals up to a large whole number, "-0" now and then (stored as 0). */
  valid(note?: string | Buffer, lineEnd = this.eol): this {
    const { meter, startMs } = this.nextKey();
    const roll = this.rnd.next();
    const volume =
      roll < 0.03 ? '-0' : roll < 0.06 ? '99999999' : roll < 0.1 ? '0007' : this.rnd.uniform(0, 500).toFixed(3);
    this.expected.push({ meter, startMs, gallons: (Number(volume) + 0).toFixed(4) });
    const line = `${meter},${wall(startMs)},15,${volume},`;
    const text = note ?? this.rnd.pick(HARMLESS_NOTES);
    if (typeof text === 'string') return this.raw(line + text + lineEnd);
    return this.raw(Buffer.concat([Buffer.from(line), text, Buffer.from(lineEnd)]));
  }

  /** The next invalid row: one meaningful cell is one that must be refused. */
  invalid(): this {
    const { meter, startMs } = this.nextKey();
    const cells = [meter, wall(startMs), '15', this.rnd.uniform(0, 50).toFixed(2)];
    const which = this.rnd.int(0, 3);
    cells[which] = this.rnd.pick([BAD_METERS, BAD_TIMES, BAD_MINUTES, BAD_VOLUMES][which]!);
    return this.raw(`${cells.join(',')},bad${this.eol}`);
  }

  private nextKey(): { meter: string; startMs: number } {
    const i = this.row++;
    return {
      meter: METERS[i % METERS.length]!,
      startMs: BASE_MS + (this.firstSlot + Math.floor(i / METERS.length)) * SLOT_MS,
    };
  }

  /** Rows used so far (valid and invalid), for the slot budget. */
  get rows(): number {
    return this.row;
  }

  pieces(): () => Iterable<Buffer> {
    const parts = this.parts;
    return function* () {
      for (const part of parts) yield typeof part === 'string' ? Buffer.from(part, 'utf8') : part;
    };
  }
}

/** Twenty clean rows first, so the layout is recognised from a clean head as in any real export. */
function cleanHead(b: FileBuilder, rows = 20): FileBuilder {
  b.header();
  for (let i = 0; i < rows; i++) b.valid('ok');
  return b;
}

function randomBytes(rnd: Random, n: number): Buffer {
  const buf = Buffer.alloc(n);
  for (let i = 0; i < n; i++) buf[i] = Math.floor(rnd.next() * 256);
  return buf;
}

type Make = (rnd: Random, slot: (rows: number) => number) => Omit<HostileCase, 'id' | 'site' | 'fileName'>;

const nothing = (kind: string, bytes: () => Iterable<Buffer>) => ({ kind, bytes, expected: [] });

/** Each kind, and how many files of it a run sends. */
const KINDS: Array<[kind: string, count: number, make: Make]> = [
  [
    'clean control file',
    25,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(40)));
      for (let i = 0; i < 20; i++) b.valid();
      return { kind: 'clean', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'random bytes',
    60,
    (rnd) => {
      const data = randomBytes(rnd, rnd.int(1, 48 * 1024));
      return nothing('random bytes', () => [data]);
    },
  ],
  [
    'NUL bytes in the first 64 KB',
    25,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(60)));
      b.valid(Buffer.from([0x4e, 0x00, 0x55, 0x4c]));
      for (let i = 0; i < 20; i++) b.valid();
      // Refused as binary before any row is read.
      return nothing('NUL bytes (head)', b.pieces());
    },
  ],
  [
    'NUL bytes after 64 KB',
    15,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(2_100)));
      while (b.parts.reduce((n, p) => n + p.length, 0) < SNIFF_BYTES + 1_000) b.valid('padding padding padding');
      for (let i = 0; i < 30; i++) {
        if (rnd.chance(0.5)) b.valid(Buffer.from([0x6e, 0x00, 0x6f, 0x00, 0x74, 0x65]));
        else b.invalid();
      }
      return { kind: 'NUL bytes (rows)', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'broken UTF-8',
    35,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(60)));
      const broken = [
        Buffer.from([0xc3, 0x28]),
        Buffer.from([0xff, 0xfe, 0xfd]),
        Buffer.from([0xe2, 0x82]),
        Buffer.from([0xed, 0xa0, 0x80]),
      ];
      for (let i = 0; i < 30; i++) {
        if (rnd.chance(0.7)) b.valid(Buffer.concat([Buffer.from('x'), rnd.pick(broken), Buffer.from('y')]));
        else b.invalid();
      }
      return { kind: 'broken UTF-8', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'a BOM in the middle',
    30,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(60)));
      for (let i = 0; i < 30; i++) {
        if (rnd.chance(0.2)) b.raw('\uFEFF\n');
        if (rnd.chance(0.7)) b.valid(rnd.chance(0.5) ? '\uFEFF' : 'a\uFEFFb');
        else b.invalid();
      }
      return { kind: 'BOM mid-file', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'mixed line endings',
    35,
    (rnd, slot) => {
      // The first line end decides (\n here); a CRLF leaves a \r on the note; a lone \r is an ordinary character,
      // so its line and the next one are one row: the first row's cells stay valid, the next row is swallowed.
      const b = cleanHead(new FileBuilder(rnd, slot(80)));
      for (let i = 0; i < 30; i++) {
        const roll = rnd.next();
        if (roll < 0.3) b.valid('crlf', '\r\n');
        else if (roll < 0.45) {
          b.valid('lone-cr', '\r');
          b.raw('HX-01,2021-01-01 00:00,15,1.0,swallowed\n');
        } else if (roll < 0.55) b.raw(rnd.pick(['\n', '\r\n', '   \n', ',,,,\n']));
        else if (roll < 0.85) b.valid();
        else b.invalid();
      }
      return { kind: 'mixed line endings', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'unclosed quote',
    30,
    (rnd, slot) => {
      // A cell that opens a quote and never closes it: the file is not well-formed CSV and is refused as a
      // whole, naming the line.
      const b = cleanHead(new FileBuilder(rnd, slot(80)));
      for (let i = rnd.int(0, 20); i > 0; i--) b.valid();
      b.raw(
        rnd.pick([
          'HX-02,2021-01-01 00:00,15,"12.5,open quote\n',
          'HX-02,2021-01-01 00:00,15,1.5,"note never closed\n',
        ]),
      );
      // (No quote after it: a later one would close it, and the rows between would be one cell.)
      for (let i = 0; i < 20; i++) b.valid('plain');
      return nothing('unclosed quote', b.pieces());
    },
  ],
  [
    'hostile numbers',
    50,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(80)));
      for (let i = 0; i < 40; i++) {
        if (rnd.chance(0.5)) b.valid();
        else {
          const start = wall(BASE_MS + slot(1) * SLOT_MS);
          b.raw(`${rnd.pick(METERS)},${start},15,${rnd.pick(BAD_VOLUMES)},number\n`);
        }
      }
      return { kind: 'numbers (1e308, NaN, Infinity, -0, 0x1F…)', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'hostile dates',
    40,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(60)));
      for (let i = 0; i < 30; i++) {
        if (rnd.chance(0.5)) b.valid();
        else b.raw(`${rnd.pick(METERS)},${rnd.pick(BAD_TIMES)},15,1.5,date\n`);
      }
      return { kind: 'dates (year 0, 9999…)', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'formula-looking cells',
    35,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(60)));
      for (let i = 0; i < 30; i++) {
        if (rnd.chance(0.5))
          b.valid(rnd.pick(['=1+2', '@SUM(A1:A9)', '+cmd', '-1+1', '=IMPORTXML("http://x.example")']));
        else b.invalid();
      }
      return { kind: 'formula-looking cells', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'cells of 1 MB',
    10,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(40)));
      const big = 'Z'.repeat(1024 * 1024);
      b.valid(big);
      b.raw(`HX-01,2021-01-01 00:00,15,${'9'.repeat(1024 * 1024)},huge volume\n`);
      b.raw(`${'M'.repeat(1024 * 1024)},2021-01-01 00:00,15,1.0,huge meter\n`);
      for (let i = 0; i < 5; i++) b.valid();
      return { kind: 'cells of 1 MB', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'a million columns',
    8,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(40)));
      b.valid('wide' + ','.repeat(1_000_000));
      for (let i = 0; i < 5; i++) b.valid();
      return { kind: 'a million columns (in a row)', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'a header of a million columns',
    6,
    (rnd) => {
      const text = 'a,'.repeat(1_000_000) + (rnd.chance(0.5) ? '\n' : '\n1,2\n'.repeat(1000));
      return nothing('a million columns (header)', () => [Buffer.from(text)]);
    },
  ],
  [
    'empty and header-only files',
    20,
    (rnd) => {
      const text = rnd.pick(['', HEADER + '\n', '\n\n\n', '   ', '\uFEFF', `${HEADER}\n,,,,\n`]);
      return nothing('empty or header only', () => [Buffer.from(text)]);
    },
  ],
  [
    'long or odd file names',
    10,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(30)), 5);
      return { kind: 'odd file name', bytes: b.pieces(), expected: b.expected };
    },
  ],
  [
    'aborted mid-body',
    70,
    (rnd, slot) => {
      const b = cleanHead(new FileBuilder(rnd, slot(rnd.chance(0.2) ? 20_000 : 100)));
      const many = rnd.chance(0.2) ? 15_000 : 60;
      for (let i = 0; i < many; i++) b.valid();
      const size = b.parts.reduce((n, p) => n + p.length, 0);
      // Nothing of an upload that never arrived whole may be stored.
      return {
        kind: 'aborted mid-body',
        bytes: b.pieces(),
        expected: [],
        abortAfterBytes: rnd.int(200, Math.max(300, size - 10)),
      };
    },
  ],
];

/** 100,000 rows with every 7th broken, generated as it is sent (about 4 MB). */
function everySeventhBroken(
  rnd: Random,
  slot: (rows: number) => number,
): Omit<HostileCase, 'id' | 'site' | 'fileName'> {
  const rows = 100_000;
  const seed = rnd.int(1, 1_000_000);
  const first = slot(rows);
  // The rows are made twice from one seed: once for the expected list, once while sending.
  const build = (emit: (part: string) => void) => {
    const b = new FileBuilder(seededRandom(seed), first);
    b.header();
    for (let i = 1; i <= rows; i++) {
      if (i % 7 === 0) b.invalid();
      else b.valid('');
      if (b.parts.length >= 2_000) emit(b.parts.splice(0).join(''));
    }
    emit(b.parts.splice(0).join(''));
    return b.expected;
  };
  const expected = build(() => undefined);
  return {
    kind: '100,000 rows, every 7th broken',
    expected,
    bytes: function* () {
      const out: string[] = [];
      build((part) => out.push(part));
      for (const part of out) yield Buffer.from(part);
    },
  };
}

/** One line of 50 MB (a note of a valid row), sent in 1 MB pieces, between clean rows. */
function fiftyMegabyteLine(rnd: Random, slot: (rows: number) => number): Omit<HostileCase, 'id' | 'site' | 'fileName'> {
  const b = cleanHead(new FileBuilder(rnd, slot(60)));
  const before = [...b.parts];
  b.parts.length = 0;
  b.valid('LONG');
  const longRow = String(b.parts[0]).replace(/LONG\n$/, '');
  b.parts.length = 0;
  for (let i = 0; i < 20; i++) b.valid();
  const after = [...b.parts];
  return {
    kind: 'one 50 MB line',
    expected: b.expected,
    bytes: function* () {
      for (const part of before) yield Buffer.from(part);
      yield Buffer.from(longRow);
      const piece = Buffer.alloc(1024 * 1024, 'L');
      for (let i = 0; i < 50; i++) yield piece;
      yield Buffer.from('\n');
      for (const part of after) yield Buffer.from(part);
    },
  };
}

const ODD_NAMES = [
  'x'.repeat(600) + '.csv',
  'readings\u0000\u0007.csv',
  '../../etc/passwd',
  '=cmd|calc.csv',
  'données été.csv',
  'a"b;c.csv',
];

/** The whole run: the same files, in the same order, from the same seed. */
export function hostileCases(seed = 20261205): HostileCase[] {
  const rnd = seededRandom(seed);
  const slots = new Slots();
  const cases: HostileCase[] = [];
  const add = (make: Make, kindName: string, i: number) => {
    const site = cases.length % SITES;
    const made = make(rnd, (rows) => slots.take(site, rows));
    const fileName =
      kindName === 'long or odd file names' ? ODD_NAMES[i % ODD_NAMES.length]! : `hostile-${cases.length}.csv`;
    cases.push({ ...made, id: `h${seed}-${cases.length}`, site, fileName });
  };
  for (const [kindName, count, make] of KINDS) for (let i = 0; i < count; i++) add(make, kindName, i);
  add(everySeventhBroken, '100k', 0);
  add(everySeventhBroken, '100k', 1);
  add(fiftyMegabyteLine, '50 MB', 0);
  // Shuffle (seeded) so kinds interleave as a real stream of bad uploads would.
  for (let i = cases.length - 1; i > 0; i--) {
    const j = rnd.int(0, i);
    [cases[i], cases[j]] = [cases[j]!, cases[i]!];
  }
  return cases;
}
