// Seeded random numbers and the input distributions used by Monte Carlo.
// Reproducible: the same seed gives the same draws on every machine.

/** mulberry32: a small 32-bit generator, fast and good enough for simulation. */
export function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export type Distribution =
  | { type: 'fixed'; value: number }
  | { type: 'triangular'; min: number; mode: number; max: number }
  | { type: 'uniform'; min: number; max: number }
  | { type: 'normal'; mean: number; sd: number }
  /** Lognormal given by the mean and standard deviation of the variable itself. */
  | { type: 'lognormal'; mean: number; sd: number };

function standardNormal(u: () => number) {
  // Box–Muller; 1 − u avoids log(0).
  return Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}

export function sample(d: Distribution, u: () => number): number {
  switch (d.type) {
    case 'fixed':
      return d.value;
    case 'uniform':
      return d.min + (d.max - d.min) * u();
    case 'triangular': {
      // Inverse CDF of the triangular distribution.
      const { min: a, mode: c, max: b } = d;
      if (b === a) return a;
      const p = u();
      const fc = (c - a) / (b - a);
      return p < fc ? a + Math.sqrt(p * (b - a) * (c - a)) : b - Math.sqrt((1 - p) * (b - a) * (b - c));
    }
    case 'normal':
      return d.mean + d.sd * standardNormal(u);
    case 'lognormal': {
      const sigma2 = Math.log(1 + (d.sd * d.sd) / (d.mean * d.mean));
      const mu = Math.log(d.mean) - sigma2 / 2;
      return Math.exp(mu + Math.sqrt(sigma2) * standardNormal(u));
    }
  }
}

/** The distribution's own mean, for checks and for the deterministic base case. */
export function distributionMean(d: Distribution): number {
  switch (d.type) {
    case 'fixed':
      return d.value;
    case 'uniform':
      return (d.min + d.max) / 2;
    case 'triangular':
      return (d.min + d.mode + d.max) / 3;
    case 'normal':
    case 'lognormal':
      return d.mean;
  }
}
