import { describe, expect, it } from 'vitest';
import { LineSplitter } from './line-splitter';

function split(pieces: string[]): { rows: string[][]; handOver: string | null } {
  const splitter = new LineSplitter(',');
  const rows: string[][] = [];
  for (const piece of pieces) {
    const handOver = splitter.push(piece, rows);
    if (handOver !== null) return { rows, handOver };
  }
  splitter.end(rows);
  return { rows, handOver: null };
}

describe('LineSplitter on very long lines', () => {
  it('when one line arrives in thousands of pieces without a line end, then it comes out whole, once', () => {
    const piece = 'x'.repeat(64 * 1024);
    const { rows } = split(['a,b\n', ...Array<string>(200).fill(piece), ',tail\n', 'c,d\n']);
    expect(rows.map((r) => r.length)).toEqual([2, 2, 2]);
    expect(rows[1]![0]!.length).toBe(200 * 64 * 1024);
    expect(rows[1]![1]).toBe('tail');
    expect(rows[2]).toEqual(['c', 'd']);
  });

  it('when a CRLF is split across two pieces after a long line, then the line end is still found', () => {
    const { rows } = split(['a,b\r\n', 'x'.repeat(100), 'y'.repeat(100), '\r', '\nc,d\r\n']);
    expect(rows).toEqual([['a', 'b'], ['x'.repeat(100) + 'y'.repeat(100)], ['c', 'd']]);
  });

  it('when a quote comes after a long line held aside, then the hand-over starts at that line', () => {
    const { rows, handOver } = split(['a,b\n', 'x'.repeat(50), 'y'.repeat(50), ',"q"\nc,d\n']);
    expect(rows).toEqual([['a', 'b']]);
    expect(handOver).toBe('x'.repeat(50) + 'y'.repeat(50) + ',"q"\nc,d\n');
  });

  it('when the first line never ends, then it is the only row', () => {
    const { rows } = split(Array<string>(10).fill('a,'));
    expect(rows).toEqual([[...Array<string>(10).fill('a'), '']]);
  });
});
