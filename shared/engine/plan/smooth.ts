// Sharpening the fast method's multipliers (docs/COMPUTATION.md, the budget plan). The
// Lagrangian dual is piecewise linear, so subgradient steps circle its minimum without settling,
// and the choice at their multipliers can overspend a year by a tenth. Here the max in each
// segment's choice is replaced by τ·log Σ exp(reduced value / τ) (a smooth upper bound of the
// dual), minimised by projected Newton steps over the few multipliers, for a falling τ. Its
// soft choice spends exactly the budgets at its minimum, so the hard choice at those multipliers
// is close to the LP relaxation's. Every point visited is also evaluated on the true dual, whose
// least value is returned as the bound.
import type { Compiled } from './compiled';
import type { PackedInstance } from './instance';

export function sharpen(
  inst: PackedInstance,
  c: Compiled,
  lam: Float64Array,
  mu: Float64Array,
  opts: { stages?: number[]; maxNewton?: number } = {},
) {
  const Y = c.Y;
  const R = c.R;
  // Rows with a multiplier: finite positive budgets, then every target.
  const dimOfYear = new Int32Array(Y).fill(-1);
  let D = 0;
  for (let y = 0; y < Y; y++) if (Number.isFinite(inst.budgets[y]) && inst.budgets[y] > 0) dimOfYear[y] = D++;
  const firstTarget = D;
  D += R;
  if (D === 0) return null;
  const b = new Float64Array(D);
  const scale = new Float64Array(D);
  for (let y = 0; y < Y; y++)
    if (dimOfYear[y] >= 0) {
      b[dimOfYear[y]] = 1;
      scale[dimOfYear[y]] = inst.budgets[y];
    }
  for (let r = 0; r < R; r++) {
    const s = Math.max(Math.abs(inst.targets[r].rhs), 1e-9);
    scale[firstTarget + r] = s;
    b[firstTarget + r] = -inst.targets[r].rhs / s;
  }
  // Scaled rows per option: Σ a·x ≤ b.
  const aStart = new Int32Array(c.nOpt + 1);
  for (let o = 0; o < c.nOpt; o++) {
    let n = 0;
    for (let k = c.cStart[o]; k < c.cStart[o + 1]; k++) if (dimOfYear[c.cYear[k]] >= 0) n++;
    aStart[o + 1] = aStart[o] + n + (c.gStart[o + 1] - c.gStart[o]);
  }
  const aDim = new Int32Array(aStart[c.nOpt]);
  const aVal = new Float64Array(aStart[c.nOpt]);
  for (let o = 0; o < c.nOpt; o++) {
    let at = aStart[o];
    for (let k = c.cStart[o]; k < c.cStart[o + 1]; k++) {
      const d = dimOfYear[c.cYear[k]];
      if (d < 0) continue;
      aDim[at] = d;
      aVal[at++] = c.cVal[k] / scale[d];
    }
    for (let k = c.gStart[o]; k < c.gStart[o + 1]; k++) {
      const d = firstTarget + c.gRow[k];
      aDim[at] = d;
      aVal[at++] = -c.gVal[k] / scale[d];
    }
  }
  let maxK = 1;
  for (let i = 0; i < inst.nSegments; i++) maxK = Math.max(maxK, inst.segStart[i + 1] - inst.segStart[i]);
  const rr = new Float64Array(maxK);
  const ea = new Float64Array(D);
  const touched = new Uint8Array(D);
  const touchedList = new Int32Array(D);
  const grad = new Float64Array(D);
  const H = new Float64Array(D * D);

  const pi = new Float64Array(D);
  for (let y = 0; y < Y; y++) if (dimOfYear[y] >= 0) pi[dimOfYear[y]] = lam[y] * scale[dimOfYear[y]];
  for (let r = 0; r < R; r++) pi[firstTarget + r] = mu[r] * scale[firstTarget + r];

  let bestTrue = Number.POSITIVE_INFINITY;
  const bestPi = pi.slice();

  /** Smoothed dual at p (and, when wanted, its gradient and Hessian); tracks the true dual's least value. */
  const evaluate = (p: Float64Array, tau: number, wantDerivatives: boolean) => {
    let Ls = 0;
    let Lt = 0;
    for (let d = 0; d < D; d++) {
      Ls += p[d] * b[d];
      Lt += p[d] * b[d];
    }
    if (wantDerivatives) {
      grad.set(b);
      H.fill(0);
    }
    const inv = 1 / tau;
    for (let i = 0; i < inst.nSegments; i++) {
      const s0 = inst.segStart[i];
      const s1 = inst.segStart[i + 1];
      const must = inst.mustChoose[i] === 1;
      let m = must ? Number.NEGATIVE_INFINITY : 0;
      let any = false;
      for (let o = s0; o < s1; o++) {
        if (!c.usable[o]) {
          rr[o - s0] = Number.NEGATIVE_INFINITY;
          continue;
        }
        let r = c.value[o];
        for (let k = aStart[o]; k < aStart[o + 1]; k++) r -= p[aDim[k]] * aVal[k];
        rr[o - s0] = r;
        any = true;
        if (r > m) m = r;
      }
      if (!any) continue;
      Lt += m;
      // Choices more than 36 τ below the best weigh under 1e-15: left out of the sums.
      const cut = m - 36 * tau;
      let Z = must || m > 36 * tau ? 0 : Math.exp(-m * inv);
      for (let o = s0; o < s1; o++) if (rr[o - s0] > cut) Z += Math.exp((rr[o - s0] - m) * inv);
      Ls += m + tau * Math.log(Z);
      if (!wantDerivatives) continue;
      let nt = 0;
      for (let o = s0; o < s1; o++) {
        const r = rr[o - s0];
        if (!(r > cut)) continue;
        const q = Math.exp((r - m) * inv) / Z;
        if (q < 1e-12) continue;
        for (let k = aStart[o]; k < aStart[o + 1]; k++) {
          const d = aDim[k];
          if (!touched[d]) {
            touched[d] = 1;
            touchedList[nt++] = d;
            ea[d] = 0;
          }
          ea[d] += q * aVal[k];
          const qa = q * aVal[k] * inv;
          for (let k2 = aStart[o]; k2 < aStart[o + 1]; k2++) H[d * D + aDim[k2]] += qa * aVal[k2];
        }
      }
      for (let u = 0; u < nt; u++) {
        const d1 = touchedList[u];
        grad[d1] -= ea[d1];
        for (let v = 0; v < nt; v++) {
          const d2 = touchedList[v];
          H[d1 * D + d2] -= ea[d1] * ea[d2] * inv;
        }
      }
      for (let u = 0; u < nt; u++) touched[touchedList[u]] = 0;
    }
    if (Lt < bestTrue) {
      bestTrue = Lt;
      bestPi.set(p);
    }
    return Ls;
  };

  // Typical value at stake per segment sets the temperatures.
  let V = 0;
  let nV = 0;
  for (let i = 0; i < inst.nSegments; i++) {
    let m = 0;
    for (let o = inst.segStart[i]; o < inst.segStart[i + 1]; o++)
      if (c.usable[o]) m = Math.max(m, Math.abs(c.value[o]));
    if (m > 0) {
      V += m;
      nV++;
    }
  }
  V = nV ? V / nV : 1;
  const stages = opts.stages ?? [0.02, 0.004, 0.0008, 0.00016];
  const maxNewton = opts.maxNewton ?? 5;
  const free = new Int32Array(D);
  const M = new Float64Array(D * D);
  const rhs = new Float64Array(D);
  const step = new Float64Array(D);
  const trial = new Float64Array(D);
  let evaluations = 0;
  for (const st of stages) {
    const tau = st * V;
    for (let it = 0; it < maxNewton; it++) {
      const f0 = evaluate(pi, tau, true);
      evaluations++;
      // Free coordinates: positive, or pushed up by the gradient (an overspent year, a missed target).
      let nf = 0;
      let gnorm = 0;
      for (let d = 0; d < D; d++)
        if (pi[d] > 0 || grad[d] < 0) {
          free[nf++] = d;
          gnorm += grad[d] * grad[d];
        }
      if (nf === 0 || gnorm < 1e-14) break;
      // (H_FF + δI) s = −g_F by Cholesky.
      let trace = 0;
      for (let u = 0; u < nf; u++) trace += H[free[u] * D + free[u]];
      const delta = Math.max(1e-12, (1e-8 * trace) / nf);
      for (let u = 0; u < nf; u++) {
        for (let v = 0; v < nf; v++) M[u * nf + v] = H[free[u] * D + free[v]] + (u === v ? delta : 0);
        rhs[u] = -grad[free[u]];
      }
      if (!cholSolve(M, rhs, nf)) for (let u = 0; u < nf; u++) rhs[u] = -grad[free[u]] / Math.max(delta, 1e-9);
      step.fill(0);
      let slope = 0;
      for (let u = 0; u < nf; u++) {
        step[free[u]] = rhs[u];
        slope += grad[free[u]] * rhs[u];
      }
      if (slope >= 0) break;
      let s = 1;
      let accepted = false;
      for (let ls = 0; ls < 12; ls++) {
        for (let d = 0; d < D; d++) trial[d] = Math.max(0, pi[d] + s * step[d]);
        const f1 = evaluate(trial, tau, false);
        evaluations++;
        if (f1 <= f0 + 1e-4 * s * slope) {
          accepted = true;
          break;
        }
        s *= 0.5;
      }
      if (!accepted) break;
      let moved = 0;
      for (let d = 0; d < D; d++) {
        moved = Math.max(moved, Math.abs(trial[d] - pi[d]) / Math.max(Math.abs(pi[d]), 1e-12));
        pi[d] = trial[d];
      }
      if (moved < 1e-7) break;
    }
  }
  // The final multipliers (raw units) and the least true dual value seen.
  const outLam = new Float64Array(Y);
  const outMu = new Float64Array(R);
  for (let y = 0; y < Y; y++) if (dimOfYear[y] >= 0) outLam[y] = pi[dimOfYear[y]] / scale[dimOfYear[y]];
  for (let r = 0; r < R; r++) outMu[r] = pi[firstTarget + r] / scale[firstTarget + r];
  const bLam = new Float64Array(Y);
  const bMu = new Float64Array(R);
  for (let y = 0; y < Y; y++) if (dimOfYear[y] >= 0) bLam[y] = bestPi[dimOfYear[y]] / scale[dimOfYear[y]];
  for (let r = 0; r < R; r++) bMu[r] = bestPi[firstTarget + r] / scale[firstTarget + r];
  // The soft choice at the last temperature: a start for rounding that respects the budgets.
  const tauEnd = stages[stages.length - 1] * V;
  const softOrder = softRounding(inst, c, pi, aStart, aDim, aVal, tauEnd, rr);
  return { lam: outLam, mu: outMu, bestTrue, bestLam: bLam, bestMu: bMu, evaluations, softOrder };
}

/**
 * Rounds the soft choice: segments most sure of their choice first; each takes, in order of its
 * soft weight, the first option that still fits every year's money (or nothing when doing nothing
 * weighs most and no work is required). Returns the pick.
 */
function softRounding(
  inst: PackedInstance,
  c: Compiled,
  pi: Float64Array,
  aStart: Int32Array,
  aDim: Int32Array,
  aVal: Float64Array,
  tau: number,
  rr: Float64Array,
) {
  const n = inst.nSegments;
  const sure = new Float64Array(n);
  const pNone = new Float64Array(n);
  const prob = new Float64Array(c.nOpt);
  const inv = 1 / tau;
  for (let i = 0; i < n; i++) {
    const s0 = inst.segStart[i];
    const s1 = inst.segStart[i + 1];
    const must = inst.mustChoose[i] === 1;
    let m = must ? Number.NEGATIVE_INFINITY : 0;
    for (let o = s0; o < s1; o++) {
      let r = Number.NEGATIVE_INFINITY;
      if (c.usable[o]) {
        r = c.value[o];
        for (let k = aStart[o]; k < aStart[o + 1]; k++) r -= pi[aDim[k]] * aVal[k];
      }
      rr[o - s0] = r;
      if (r > m) m = r;
    }
    if (m === Number.NEGATIVE_INFINITY) continue;
    const cut = m - 36 * tau;
    let Z = must || -m < -36 * tau ? 0 : Math.exp(-m * inv);
    const z0 = Z;
    for (let o = s0; o < s1; o++) if (rr[o - s0] > cut) Z += Math.exp((rr[o - s0] - m) * inv);
    pNone[i] = z0 / Z;
    let top = pNone[i];
    for (let o = s0; o < s1; o++) {
      prob[o] = rr[o - s0] > cut ? Math.exp((rr[o - s0] - m) * inv) / Z : 0;
      if (prob[o] > top) top = prob[o];
    }
    sure[i] = top;
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => sure[b] - sure[a]);
  const spent = new Float64Array(c.Y);
  const pick = new Int32Array(n).fill(-1);
  const cap = new Float64Array(c.Y);
  for (let y = 0; y < c.Y; y++) cap[y] = inst.budgets[y] * (1 + 1e-9);
  for (const i of order) {
    const s0 = inst.segStart[i];
    const s1 = inst.segStart[i + 1];
    // Options in order of weight, while they weigh more than doing nothing.
    for (;;) {
      let bo = -1;
      let bp = inst.mustChoose[i] ? 0 : pNone[i];
      for (let o = s0; o < s1; o++)
        if (prob[o] > bp) {
          bp = prob[o];
          bo = o;
        }
      if (bo < 0) break;
      let fits = true;
      for (let k = c.cStart[bo]; k < c.cStart[bo + 1]; k++)
        if (spent[c.cYear[k]] + c.cVal[k] > cap[c.cYear[k]]) fits = false;
      if (fits) {
        pick[i] = bo;
        for (let k = c.cStart[bo]; k < c.cStart[bo + 1]; k++) spent[c.cYear[k]] += c.cVal[k];
        break;
      }
      prob[bo] = 0;
    }
  }
  return pick;
}

/** Solves M x = rhs in place (rhs becomes x) for symmetric positive definite M (n × n, row-major). */
function cholSolve(M: Float64Array, rhs: Float64Array, n: number) {
  for (let j = 0; j < n; j++) {
    let d = M[j * n + j];
    for (let k = 0; k < j; k++) d -= M[j * n + k] * M[j * n + k];
    if (!(d > 0)) return false;
    const l = Math.sqrt(d);
    M[j * n + j] = l;
    for (let i = j + 1; i < n; i++) {
      let s = M[i * n + j];
      for (let k = 0; k < j; k++) s -= M[i * n + k] * M[j * n + k];
      M[i * n + j] = s / l;
    }
  }
  for (let i = 0; i < n; i++) {
    let s = rhs[i];
    for (let k = 0; k < i; k++) s -= M[i * n + k] * rhs[k];
    rhs[i] = s / M[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = rhs[i];
    for (let k = i + 1; k < n; k++) s -= M[k * n + i] * rhs[k];
    rhs[i] = s / M[i * n + i];
  }
  return true;
}
