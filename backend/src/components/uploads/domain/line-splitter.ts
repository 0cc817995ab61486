/**
 * Rows of quote-free CSV text, split on the delimiter and on the record delimiter csv-parse would discover (the
 * first `\r\n`, `\n` or `\r`; later line ends of another kind are then ordinary characters, as in csv-parse).
 * Stops at the first line holding a quote and hands the text from that line on to a real CSV parser.
 */
export class LineSplitter {
  private rest = '';
  private eol: string | null = null;

  constructor(private readonly delimiter: string) {}

  /** The record delimiter, once one has been seen. */
  get lineEnding(): string | null {
    return this.eol;
  }

  /**
   * Appends the complete rows of what was left plus `text` to `out`. Returns null, or (once a quote is seen) the
   * text from the start of that quote's line: the caller parses it and everything after it.
   */
  push(text: string, out: string[][]): string | null {
    const buf = this.rest + text;
    this.rest = '';
    const quote = buf.indexOf('"');
    if (this.eol === null) {
      const cr = buf.indexOf('\r');
      const nl = buf.indexOf('\n');
      const first = cr === -1 ? nl : nl === -1 ? cr : Math.min(cr, nl);
      if (quote !== -1 && (first === -1 || quote < first)) return buf;
      if (first === -1 || (first === cr && first + 1 === buf.length)) {
        // No line end yet, or a `\r` whose next character (`\n` or not) has not arrived.
        this.rest = buf;
        return null;
      }
      this.eol = first === nl ? '\n' : buf.charCodeAt(first + 1) === 10 ? '\r\n' : '\r';
    }
    const eol = this.eol;
    const { delimiter } = this;
    let pos = 0;
    for (let at = buf.indexOf(eol); at !== -1 && (quote === -1 || at < quote); at = buf.indexOf(eol, pos)) {
      out.push(buf.slice(pos, at).split(delimiter));
      pos = at + eol.length;
    }
    if (quote !== -1) return buf.slice(pos);
    this.rest = buf.slice(pos);
    return null;
  }

  /** At the end of the input: the last line, when it had no line end. */
  end(out: string[][]): void {
    let rest = this.rest;
    // A `\r` that ends the input before any other line end is csv-parse's record delimiter.
    if (this.eol === null && rest.endsWith('\r')) {
      this.eol = '\r';
      rest = rest.slice(0, -1);
      out.push(rest.split(this.delimiter));
    } else if (rest !== '') out.push(rest.split(this.delimiter));
    this.rest = '';
  }
}
