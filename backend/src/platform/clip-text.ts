/**
 * `text` cut to at most `max` characters (with an ellipsis), as a string of its own. A plain `slice` of a long
 * string can keep the whole original alive in V8 (a sliced string points into its parent), so a message quoting
 * a 50 MB cell would hold on to the 50 MB; copying through a Buffer drops the parent.
 */
export function clipText(text: string, max: number): string {
  if (text.length <= max) return text;
  return Buffer.from(text.slice(0, max - 1) + '…', 'utf8').toString('utf8');
}
