// Numbers for memo tables (Markdown, LaTeX): rounded to a number of significant figures,
// trailing zeros dropped, positional notation for 1e-3 <= |x| < 1e6 and a mantissa with a
// power of ten outside that.

export interface RoundedNumber {
  /** `-12.35`, or the mantissa `1.585` when `exponent` is set. */
  digits: string;
  /** Power of ten, when the number is shown in scientific form. */
  exponent?: number;
}

function stripZeros(s: string): string {
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

export function roundSignificant(x: number, figures = 4): RoundedNumber {
  if (!Number.isFinite(x)) return { digits: String(x) };
  if (x === 0) return { digits: '0' };
  // Round first, so 999 960 becomes 1.000e6 and picks the exponent 6, not 5.
  const rounded = Number(x.toPrecision(figures));
  const exponent = Math.floor(Math.log10(Math.abs(rounded)) + 1e-12);
  if (exponent >= -3 && exponent < 6) {
    return { digits: stripZeros(rounded.toFixed(Math.max(0, figures - 1 - exponent))) };
  }
  const mantissa = rounded / 10 ** exponent;
  return { digits: stripZeros(mantissa.toFixed(figures - 1)), exponent };
}
