/**
 * Golden-section search for the maximum of a unimodal f on [a, b] (Kiefer 1953, common
 * practice): an independent maximiser for tests, written apart from core's own searches.
 */
export function goldenMax(
  f: (x: number) => number,
  a: number,
  b: number,
  tolerance = 1e-13,
): number {
  const r = (Math.sqrt(5) - 1) / 2;
  let x1 = b - r * (b - a);
  let x2 = a + r * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let i = 0; i < 200 && b - a > tolerance; i++) {
    if (f1 < f2) {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + r * (b - a);
      f2 = f(x2);
    } else {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - r * (b - a);
      f1 = f(x1);
    }
  }
  return (a + b) / 2;
}
