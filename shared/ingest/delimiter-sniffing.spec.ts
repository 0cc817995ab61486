import { describe, expect, it } from 'vitest';
import { sniffDelimiter, stripBom } from './delimiter-sniffing';

describe('sniffDelimiter', () => {
  it('when commas separate the fields, then comma', () => {
    expect(sniffDelimiter('Meter #,Interval Start,Usage (Gal)\nA,2026-11-01 00:00,1.5\n')).toBe(',');
  });

  it('when semicolons separate fields that hold decimal commas, then semicolon', () => {
    const sample = 'Meter;Date;00:15;00:30\nSCHOOL-01;2026-11-02;1,25;0,75\nSCHOOL-01;2026-11-03;1,5;2,25\n';
    expect(sniffDelimiter(sample)).toBe(';');
  });

  it('when tabs separate the fields, then tab', () => {
    expect(sniffDelimiter('Meter ID\tRead Date\tUsage (Gal)\nA\t2026-11-07 00:00\t1,234.5\n')).toBe('\t');
  });

  it('when a quoted field holds the other delimiter, then it is not counted', () => {
    const sample = 'Meter;Note;Usage\nA;"a, b, c";1\nB;"d, e";2\n';
    expect(sniffDelimiter(sample)).toBe(';');
  });

  it('when the file has one column, then comma by default', () => {
    expect(sniffDelimiter('Usage\n1\n2\n')).toBe(',');
  });
});

describe('stripBom', () => {
  it('removes a leading byte-order mark and nothing else', () => {
    expect(stripBom('\uFEFFMeter,Usage')).toBe('Meter,Usage');
    expect(stripBom('Meter,Usage')).toBe('Meter,Usage');
  });
});
