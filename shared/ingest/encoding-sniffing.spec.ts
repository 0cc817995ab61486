import { describe, expect, it } from 'vitest';
import { decodeText, isWellFormedUtf8, sniffEncoding } from './encoding-sniffing';

const bytes = (...b: number[]) => new Uint8Array(b);
const utf8 = (s: string) => new TextEncoder().encode(s);

describe('sniffEncoding', () => {
  it('when the bytes start with the zip magic PK\\x03\\x04, then refused as zip with a clear message', () => {
    const result = sniffEncoding(bytes(0x50, 0x4b, 0x03, 0x04, 0x14, 0x00));
    expect(result).toMatchObject({ kind: 'refused', reason: 'zip' });
    expect(result.kind === 'refused' && result.message).toMatch(/zip file .* renamed \.csv/);
  });

  it('when the bytes contain NUL, then refused as binary', () => {
    expect(sniffEncoding(bytes(0x4d, 0x65, 0x00, 0x74))).toMatchObject({ kind: 'refused', reason: 'binary' });
  });

  it('when the bytes start with a UTF-16 BOM, then refused as UTF-16', () => {
    expect(sniffEncoding(bytes(0xff, 0xfe, 0x4d, 0x00))).toMatchObject({ kind: 'refused', reason: 'utf-16' });
  });

  it('when there are no bytes, then refused as empty', () => {
    expect(sniffEncoding(bytes())).toMatchObject({ kind: 'refused', reason: 'empty' });
  });

  it('when the text is UTF-8 with a BOM, then utf-8 and the BOM is noticed', () => {
    expect(sniffEncoding(bytes(0xef, 0xbb, 0xbf, ...utf8('Meter,Usage\n')))).toEqual({ kind: 'utf-8', bom: true });
  });

  it('when a byte like 0xB0 (° in Windows-1252) stands alone, then windows-1252', () => {
    expect(sniffEncoding(bytes(...utf8('Frost 28'), 0xb0, ...utf8('F\n')))).toEqual({ kind: 'windows-1252' });
  });

  it('when a UTF-8 sequence is cut off by the end of the sample, then still utf-8', () => {
    const e = utf8('Café');
    expect(sniffEncoding(e.slice(0, e.length - 1))).toEqual({ kind: 'utf-8', bom: false });
  });

  it('when many control bytes appear, then refused as binary', () => {
    expect(sniffEncoding(bytes(1, 2, 3, 4, 5, 6, 65, 66))).toMatchObject({ kind: 'refused', reason: 'binary' });
  });
});

describe('isWellFormedUtf8', () => {
  it('rejects overlong forms and surrogates', () => {
    expect(isWellFormedUtf8(bytes(0xc0, 0xaf))).toBe(false);
    expect(isWellFormedUtf8(bytes(0xed, 0xa0, 0x80))).toBe(false);
    expect(isWellFormedUtf8(utf8('° é ✓ 𝄞'))).toBe(true);
  });
});

describe('decodeText', () => {
  it('decodes Windows-1252 ° and é', () => {
    const result = decodeText(bytes(...utf8('28'), 0xb0, 0x20, 0x43, 0x61, 0x66, 0xe9));
    expect(result).toEqual({ ok: true, text: '28° Café', encoding: 'windows-1252' });
  });

  it('drops the UTF-8 BOM', () => {
    expect(decodeText(bytes(0xef, 0xbb, 0xbf, ...utf8('Meter')))).toEqual({
      ok: true,
      text: 'Meter',
      encoding: 'utf-8',
    });
  });

  it('refuses a zip', () => {
    expect(decodeText(bytes(0x50, 0x4b, 0x03, 0x04)).ok).toBe(false);
  });
});
