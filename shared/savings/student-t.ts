/**
 * Student's t distribution: the CDF through the regularised incomplete beta function, and its quantile by
 * bisection. Only needed for the savings uncertainty (t at 68 % or 90 % confidence with n − p degrees of freedom),
 * so robustness matters more than speed.
 */

// Lanczos approximation (g = 7, 9 terms), accurate to ~1e-15 for positive arguments.
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

function logGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - logGamma(1 - x);
  const z = x - 1;
  let sum = LANCZOS[0]!;
  for (let i = 1; i < LANCZOS.length; i++) sum += LANCZOS[i]! / (z + i);
  const t = z + 7.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(sum);
}

/** Continued fraction for the incomplete beta function, evaluated by the modified Lentz method. */
function betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let result = d;
  for (let m = 1; m <= 10_000; m++) {
    const m2 = 2 * m;
    // Even step.
    let term = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + term * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + term / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    result *= d * c;
    // Odd step.
    term = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + term * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + term / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    result *= delta;
    if (Math.abs(delta - 1) < 1e-15) return result;
  }
  throw new RangeError('Incomplete beta continued fraction did not converge');
}

/** Regularised incomplete beta Iₓ(a, b). */
export function regularisedIncompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  // The fraction converges fast only on this side; use the symmetry I_x(a,b) = 1 − I_{1−x}(b,a) on the other.
  return x < (a + 1) / (a + b + 2)
    ? (front * betaContinuedFraction(x, a, b)) / a
    : 1 - (front * betaContinuedFraction(1 - x, b, a)) / b;
}

export function studentTCdf(t: number, degreesOfFreedom: number): number {
  if (!(degreesOfFreedom > 0)) throw new RangeError('Degrees of freedom must be positive');
  const tail =
    0.5 * regularisedIncompleteBeta(degreesOfFreedom / (degreesOfFreedom + t * t), degreesOfFreedom / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/** The t value with `probability` of the distribution below it. */
export function studentTQuantile(probability: number, degreesOfFreedom: number): number {
  if (!(probability > 0 && probability < 1)) throw new RangeError('Probability must be strictly between 0 and 1');
  if (!(degreesOfFreedom > 0)) throw new RangeError('Degrees of freedom must be positive');
  if (probability < 0.5) return -studentTQuantile(1 - probability, degreesOfFreedom);
  let low = 0;
  let high = 1;
  while (studentTCdf(high, degreesOfFreedom) < probability) high *= 2;
  // Bisection: 200 halvings reach the limit of double precision whatever the bracket.
  for (let i = 0; i < 200 && high - low > 1e-14 * Math.max(1, high); i++) {
    const mid = (low + high) / 2;
    if (studentTCdf(mid, degreesOfFreedom) < probability) low = mid;
    else high = mid;
  }
  return (low + high) / 2;
}

/** Two-sided critical t for a confidence level (0.68 → the 84th percentile). */
export function twoSidedT(confidence: number, degreesOfFreedom: number): number {
  if (!(confidence > 0 && confidence < 1)) throw new RangeError('Confidence must be strictly between 0 and 1');
  return studentTQuantile(0.5 + confidence / 2, degreesOfFreedom);
}
