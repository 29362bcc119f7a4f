// Compound-interest factors with the standard engineering-economy names
// (end-of-period convention). r is a real rate per year, n a number of years.

/** P/F: present worth of a single amount n years out. */
export function pf(r: number, n: number): number {
  return (1 + r) ** -n;
}

/** F/P: future worth of a present amount. */
export function fp(r: number, n: number): number {
  return (1 + r) ** n;
}

/** P/A: present worth of a uniform annual series of n payments. */
export function pa(r: number, n: number): number {
  if (r === 0) return n;
  const g = (1 + r) ** n;
  return (g - 1) / (r * g);
}

/** A/P: capital recovery, the annual amount equivalent to a present amount. */
export function ap(r: number, n: number): number {
  if (r === 0) return 1 / n;
  const g = (1 + r) ** n;
  return (r * g) / (g - 1);
}

/** A/F: sinking fund. */
export function af(r: number, n: number): number {
  if (r === 0) return 1 / n;
  return r / ((1 + r) ** n - 1);
}
