/** Bits of `meter_reading.flags`: how a stored volume came to be, so screens can say so. */
export const READING_FLAGS = {
  /** The file marked the read estimated (or it is worked out from an estimated register read). */
  estimated: 1,
  /** Spread from a billing period over its days in proportion to daily ETo. */
  spreadByEto: 2,
  /** Spread from a billing period evenly (the site's weather did not cover the period). */
  spreadEvenly: 4,
} as const;

export const SPREAD_FLAGS = READING_FLAGS.spreadByEto | READING_FLAGS.spreadEvenly;
