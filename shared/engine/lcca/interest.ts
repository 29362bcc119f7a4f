// Compound-interest factors with the standard engineering-economy names
// (end-of-period convention). r is a real rate per year, n a number of years
// (a fraction of a year is allowed: P/F at n = 11.5 is (1 + r)^−11.5).
//
// Written through ln(1 + r) = log1p(r) and e^x − 1 = expm1(x) so that they keep
// full precision at tiny rates: (1 + r)^n − 1 computed directly loses the
// digits of r·n below about 1e−16 (at r = 1e−12, A/P came out 9e−5 off in
// relative terms); expm1(n·log1p(r)) does not.

/** n·ln(1 + r), the exponent every factor shares. */
const growth = (r: number, n: number) => n * Math.log1p(r);

/** P/F: present worth of a single amount n years out. */
export function pf(r: number, n: number): number {
  return Math.exp(-growth(r, n));
}

/** F/P: future worth of a present amount. */
export function fp(r: number, n: number): number {
  return Math.exp(growth(r, n));
}

/** P/A: present worth of a uniform annual series of n payments: (1 − (1 + r)^−n) / r. */
export function pa(r: number, n: number): number {
  if (r === 0) return n;
  return -Math.expm1(-growth(r, n)) / r;
}

/** A/P: capital recovery, the annual amount equivalent to a present amount: r / (1 − (1 + r)^−n). */
export function ap(r: number, n: number): number {
  if (r === 0) return 1 / n;
  return r / -Math.expm1(-growth(r, n));
}

/** A/F: sinking fund: r / ((1 + r)^n − 1). */
export function af(r: number, n: number): number {
  if (r === 0) return 1 / n;
  return r / Math.expm1(growth(r, n));
}
