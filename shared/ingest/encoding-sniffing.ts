/**
 * Decide from the first bytes of an upload whether it is text we can read (UTF-8 or Windows-1252) or something
 * else renamed `.csv` (a zip/xlsx, an old .xls, a PDF, UTF-16), so the server can refuse it with a clear message.
 */

export type SniffedEncoding =
  | { kind: 'utf-8'; bom: boolean }
  | { kind: 'windows-1252' }
  | { kind: 'refused'; reason: 'zip' | 'binary' | 'utf-16' | 'empty'; message: string };

const refusedMessages = {
  zip: 'This is a zip file (an .xlsx workbook is one) renamed .csv. Open it in a spreadsheet and save as CSV.',
  binary: 'This file is not text (it contains binary data). Upload a CSV export.',
  'utf-16': 'This file is UTF-16 text. Save it as "CSV UTF-8" or plain CSV and upload again.',
  empty: 'The file is empty.',
} as const;

function refused(reason: keyof typeof refusedMessages): SniffedEncoding {
  return { kind: 'refused', reason, message: refusedMessages[reason] };
}

function startsWith(bytes: Uint8Array, magic: number[]): boolean {
  return magic.every((b, i) => bytes[i] === b);
}

/**
 * True when `bytes` is well-formed UTF-8. A multi-byte sequence cut off by the end of the sample is allowed,
 * because the sample is usually the first few kilobytes of a bigger file.
 */
export function isWellFormedUtf8(bytes: Uint8Array): boolean {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i]!;
    if (b < 0x80) {
      i++;
      continue;
    }
    let need: number;
    let min: number;
    if (b >= 0xc2 && b <= 0xdf) [need, min] = [1, 0x80];
    else if (b >= 0xe0 && b <= 0xef) [need, min] = [2, 0x800];
    else if (b >= 0xf0 && b <= 0xf4) [need, min] = [3, 0x10000];
    else return false;
    let cp = b & (0x3f >> need);
    for (let k = 1; k <= need; k++) {
      if (i + k >= bytes.length) return true; // truncated at the sample's end
      const c = bytes[i + k]!;
      if ((c & 0xc0) !== 0x80) return false;
      cp = (cp << 6) | (c & 0x3f);
    }
    // Overlong forms, UTF-16 surrogates and code points past U+10FFFF are not valid UTF-8.
    if (cp < min || (cp >= 0xd800 && cp <= 0xdfff) || cp > 0x10ffff) return false;
    i += need + 1;
  }
  return true;
}

/** Classifies a byte sample (the first few KB of an upload is enough). */
export function sniffEncoding(bytes: Uint8Array): SniffedEncoding {
  if (bytes.length === 0) return refused('empty');
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04]) || startsWith(bytes, [0x50, 0x4b, 0x05, 0x06])) return refused('zip');
  if (startsWith(bytes, [0xff, 0xfe]) || startsWith(bytes, [0xfe, 0xff])) return refused('utf-16');
  const bom = startsWith(bytes, [0xef, 0xbb, 0xbf]);
  let controls = 0;
  for (const b of bytes) {
    if (b === 0) return refused('binary');
    // Tab, LF, CR and form feed turn up in text exports; other C0 controls do not.
    if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d && b !== 0x0c) controls++;
  }
  if (controls > Math.max(2, bytes.length / 200)) return refused('binary');
  if (isWellFormedUtf8(bytes)) return { kind: 'utf-8', bom };
  return { kind: 'windows-1252' };
}

export type DecodedText =
  { ok: true; text: string; encoding: 'utf-8' | 'windows-1252' } | { ok: false; message: string };

/**
 * Decodes a whole (small) upload with the WHATWG `TextDecoder`, which browsers and Node both provide, and drops
 * the BOM. The server decodes large files as a stream instead, using `sniffEncoding` on the first chunk.
 */
export function decodeText(bytes: Uint8Array): DecodedText {
  const sniffed = sniffEncoding(bytes);
  if (sniffed.kind === 'refused') return { ok: false, message: sniffed.message };
  // TextDecoder strips a UTF-8 BOM by default.
  const text = new TextDecoder(sniffed.kind).decode(bytes);
  return { ok: true, text, encoding: sniffed.kind };
}
