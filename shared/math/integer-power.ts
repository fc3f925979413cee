/**
 * x^n for a whole exponent n by repeated squaring, so small powers cost a few multiplications and stay exact
 * where x*x is. The column compiler (term-compiler.ts), the point compiler (point-compiler.ts) and the
 * exported code take the same steps, so all of them give the same numbers.
 */
export function integerPower(exponent: number): (x: number) => number {
  const magnitude = Math.abs(exponent);
  if (magnitude === 2) return exponent > 0 ? (x) => x * x : (x) => 1 / (x * x);
  return (x) => {
    let result = 1;
    let base = x;
    for (let n = magnitude; n > 0; n >>= 1) {
      if (n & 1) result *= base;
      base *= base;
    }
    return exponent < 0 ? 1 / result : result;
  };
}
