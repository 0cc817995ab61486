const LINE_END_OR_QUOTE = /[\r\n"]/;

/**
 * Rows of quote-free CSV text, split on the delimiter and on the record delimiter csv-parse would discover (the
 * first `\r\n`, `\n` or `\r`; later line ends of another kind are then ordinary characters, as in csv-parse).
 * Stops at the first line holding a quote and hands the text from that line on to a real CSV parser.
 */
export class LineSplitter {
  private rest = '';
  /** Pieces of one long line that held no line end and no quote, joined once the line ends (see push). */
  private pending: string[] = [];
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
    // A piece with no line end and no quote cannot end the current line: set it aside without looking at what came
    // before. Searching the whole growing line again for every 64 KB piece made a 50 MB line cost minutes of CPU.
    // (Not after a first-line `\r` still waiting to learn whether `\n` follows: the next piece decides the line end.)
    const waitingCr = this.eol === null && this.pending.length === 0 && this.rest.endsWith('\r');
    if (!waitingCr && !LINE_END_OR_QUOTE.test(text)) {
      this.pending.push(text);
      return null;
    }
    const buf = this.takeRest() + text;
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
    let rest = this.takeRest();
    // A `\r` that ends the input before any other line end is csv-parse's record delimiter.
    if (this.eol === null && rest.endsWith('\r')) {
      this.eol = '\r';
      rest = rest.slice(0, -1);
      out.push(rest.split(this.delimiter));
    } else if (rest !== '') out.push(rest.split(this.delimiter));
  }

  private takeRest(): string {
    const rest = this.pending.length ? this.rest + this.pending.join('') : this.rest;
    this.rest = '';
    this.pending = [];
    return rest;
  }
}
