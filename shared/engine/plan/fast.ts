// The fast method (docs/COMPUTATION.md, the budget plan): Lagrangian relaxation of every
// year's budget row and every target row, so that each segment then chooses on its own
// (value − λ·costs + μ·gains, or nothing). The dual is minimised by subgradient steps
// (Polyak step lengths, in rows scaled to their right-hand sides); every value of the dual
// is a proven bound on the optimum. Feasible plans come from the same multipliers, raised
// in the years that overspend and on the targets missed until the choice fits, then
// filled with what money is left. Targets it cannot meet are listed, never hidden.
// Typed arrays only; nothing is allocated per option in the loops.
import { type Compiled, compile, evaluate, solutionOf, TOL } from './compiled';
import type { PackedInstance, PlanSolution } from './instance';
import { sharpen } from './smooth';

type Work = {
  inst: PackedInstance;
  c: Compiled;
  pick: Int32Array;
  spent: Float64Array;
  lhs: Float64Array;
};

/**
 * Each segment's best choice under multipliers lam (value per dollar, by year) and mu (value per unit
 * of target gain, by row). Returns the Lagrangian L(λ, μ) = Σ λ·B − Σ μ·rhs + Σ_i max(0, max_o reduced value),
 * an upper bound on the best total value of any choice that meets every row. Fills w.pick, w.spent, w.lhs.
 */
function pickAt(w: Work, lam: Float64Array, mu: Float64Array): number {
  const { inst, c, pick, spent, lhs } = w;
  const { value, usable, cStart, cYear, cVal, gStart, gRow, gVal } = c;
  const segStart = inst.segStart;
  const must = inst.mustChoose;
  spent.fill(0);
  lhs.fill(0);
  let L = 0;
  for (let y = 0; y < c.Y; y++) if (lam[y] > 0) L += lam[y] * inst.budgets[y];
  for (let r = 0; r < c.R; r++) L -= mu[r] * inst.targets[r].rhs;
  const hasTargets = c.R > 0;
  for (let i = 0; i < inst.nSegments; i++) {
    let best = must[i] ? Number.NEGATIVE_INFINITY : 0;
    let bo = -1;
    const end = segStart[i + 1];
    for (let o = segStart[i]; o < end; o++) {
      if (usable[o] === 0) continue;
      let r = value[o];
      for (let k = cStart[o], ke = cStart[o + 1]; k < ke; k++) r -= lam[cYear[k]] * cVal[k];
      if (hasTargets) for (let k = gStart[o], ke = gStart[o + 1]; k < ke; k++) r += mu[gRow[k]] * gVal[k];
      if (r > best) {
        best = r;
        bo = o;
      }
    }
    pick[i] = bo;
    if (bo < 0) continue;
    L += best;
    for (let k = cStart[bo], ke = cStart[bo + 1]; k < ke; k++) spent[cYear[k]] += cVal[k];
    if (hasTargets) for (let k = gStart[bo], ke = gStart[bo + 1]; k < ke; k++) lhs[gRow[k]] += gVal[k];
  }
  return L;
}

const over = (inst: PackedInstance, spent: Float64Array, y: number) => spent[y] > inst.budgets[y] * (1 + TOL) + 1e-6;
const short = (inst: PackedInstance, lhs: Float64Array, r: number) => {
  const t = inst.targets[r];
  return lhs[r] < t.rhs - Math.abs(t.rhs) * 1e-9 - 1e-9;
};

/** Total value of the current pick (the maximised form: benefit, or −lcc). */
function totalValue(w: Work) {
  let v = 0;
  for (let i = 0; i < w.inst.nSegments; i++) if (w.pick[i] >= 0) v += w.c.value[w.pick[i]];
  return v;
}

function addOption(w: Work, o: number, sign: 1 | -1) {
  const { c } = w;
  for (let k = c.cStart[o]; k < c.cStart[o + 1]; k++) w.spent[c.cYear[k]] += sign * c.cVal[k];
  for (let k = c.gStart[o]; k < c.gStart[o + 1]; k++) w.lhs[c.gRow[k]] += sign * c.gVal[k];
}

/** Money of option o in year y (options list few years; a linear scan is cheapest). */
function costIn(c: Compiled, o: number, y: number) {
  for (let k = c.cStart[o]; k < c.cStart[o + 1]; k++) if (c.cYear[k] === y) return c.cVal[k];
  return 0;
}

/**
 * Until every year fits: per segment the downgrade (another option, or nothing unless work is
 * mandatory) that loses least value per budget-share freed in the overspent years without
 * pushing another year over; applied least loss first, in rounds.
 */
function downgradeUntilFits(w: Work, cur: Int32Array) {
  const { inst, c } = w;
  const Y = c.Y;
  const { cStart, cYear, cVal } = c;
  const overY = new Uint8Array(Y);
  const key = new Float64Array(inst.nSegments);
  const to = new Int32Array(inst.nSegments);
  const cap = new Float64Array(Y);
  for (let y = 0; y < Y; y++) cap[y] = inst.budgets[y] * (1 + TOL);
  for (let round = 0; round < 8; round++) {
    let any = false;
    for (let y = 0; y < Y; y++) {
      overY[y] = over(inst, w.spent, y) ? 1 : 0;
      if (overY[y]) any = true;
    }
    if (!any) return;
    const cand: number[] = [];
    for (let i = 0; i < inst.nSegments; i++) {
      const o0 = cur[i];
      if (o0 < 0) continue;
      let f0 = 0;
      for (let k = cStart[o0]; k < cStart[o0 + 1]; k++) if (overY[cYear[k]]) f0 += cVal[k] / inst.budgets[cYear[k]];
      if (f0 === 0) continue;
      // Doing nothing frees all of it.
      let best = inst.mustChoose[i] ? Number.POSITIVE_INFINITY : c.value[o0] / f0;
      let bo = inst.mustChoose[i] ? -2 : -1;
      for (let a = inst.segStart[i]; a < inst.segStart[i + 1]; a++) {
        if (a === o0 || !c.usable[a]) continue;
        let freed = f0;
        let ok = true;
        for (let k = cStart[a]; k < cStart[a + 1]; k++) {
          const y = cYear[k];
          if (overY[y]) freed -= cVal[k] / inst.budgets[y];
          else {
            const d = cVal[k] - costIn(c, o0, y);
            if (d > 0 && w.spent[y] + d > cap[y]) {
              ok = false;
              break;
            }
          }
        }
        if (!ok || freed <= 0) continue;
        const r = (c.value[o0] - c.value[a]) / freed;
        if (r < best) {
          best = r;
          bo = a;
        }
      }
      if (bo === -2) continue;
      key[i] = best;
      to[i] = bo;
      cand.push(i);
    }
    if (cand.length === 0) break;
    cand.sort((x, y) => key[x] - key[y]);
    for (const i of cand) {
      let still = false;
      for (let y = 0; y < Y; y++) if (overY[y] && over(inst, w.spent, y)) still = true;
      if (!still) break;
      const o0 = cur[i];
      const a = to[i];
      let helps = false;
      for (let k = cStart[o0]; k < cStart[o0 + 1]; k++)
        if (over(inst, w.spent, cYear[k]) && cVal[k] > (a >= 0 ? costIn(c, a, cYear[k]) : 0)) helps = true;
      if (!helps) continue;
      let ok = true;
      if (a >= 0)
        for (let k = cStart[a]; k < cStart[a + 1]; k++) {
          const d = cVal[k] - costIn(c, o0, cYear[k]);
          if (d > 0 && w.spent[cYear[k]] + d > cap[cYear[k]]) ok = false;
        }
      if (!ok) continue;
      addOption(w, o0, -1);
      if (a >= 0) addOption(w, a, 1);
      cur[i] = a;
    }
  }
  // Last resort: drop whatever still spends in an overspent year.
  for (let i = 0; i < inst.nSegments; i++) {
    const o0 = cur[i];
    if (o0 < 0 || inst.mustChoose[i]) continue;
    let hits = false;
    for (let k = cStart[o0]; k < cStart[o0 + 1]; k++) if (over(inst, w.spent, cYear[k])) hits = true;
    if (!hits) continue;
    addOption(w, o0, -1);
    cur[i] = -1;
  }
}

/** Whether option o fits in place of o0 with the money left, and its price (Σ Δcost·weight). NaN when it does not fit. */
function movePrice(w: Work, o: number, o0: number, weight: Float64Array, cap: Float64Array) {
  const { c } = w;
  let price = 0;
  for (let k = c.cStart[o]; k < c.cStart[o + 1]; k++) {
    const y = c.cYear[k];
    const d = c.cVal[k] - (o0 >= 0 ? costIn(c, o0, y) : 0);
    if (d > 0 && w.spent[y] + d > cap[y]) return Number.NaN;
    price += c.cVal[k] * weight[y];
  }
  if (o0 >= 0) for (let k = c.cStart[o0]; k < c.cStart[o0 + 1]; k++) price -= c.cVal[k] * weight[c.cYear[k]];
  return price;
}

/**
 * Upgrades with the money left: per segment the best move (by gain per weighted dollar) that fits,
 * applied best first; never takes a target row that is met below its right-hand side.
 * mode 'value' gains objective value; mode 'targets' gains on the rows still missed.
 */
function fill(w: Work, cur: Int32Array, lam: Float64Array, eps: Float64Array, mode: 'value' | 'targets') {
  const { inst, c } = w;
  const Y = c.Y;
  const deficit = new Float64Array(c.R);
  const moveOpt = new Int32Array(inst.nSegments);
  const score = new Float64Array(inst.nSegments);
  const weight = new Float64Array(Y);
  const cap = new Float64Array(Y);
  for (let y = 0; y < Y; y++) {
    weight[y] = lam[y] + eps[y];
    cap[y] = inst.budgets[y] * (1 + TOL);
  }
  const targetGain = (o: number) => {
    let g = 0;
    for (let k = c.gStart[o]; k < c.gStart[o + 1]; k++) if (deficit[c.gRow[k]] > 0) g += c.gVal[k] / deficit[c.gRow[k]];
    return g;
  };
  for (let round = 0; round < 6; round++) {
    let anyDeficit = false;
    for (let r = 0; r < c.R; r++) {
      deficit[r] = short(inst, w.lhs, r) ? inst.targets[r].rhs - w.lhs[r] : 0;
      if (deficit[r] > 0) anyDeficit = true;
    }
    if (mode === 'targets' && !anyDeficit) return;
    const cands: number[] = [];
    for (let i = 0; i < inst.nSegments; i++) {
      const o0 = cur[i];
      const v0 = o0 >= 0 ? c.value[o0] : 0;
      const t0 = mode === 'targets' && o0 >= 0 ? targetGain(o0) : 0;
      let best = 0;
      let bo = -2;
      for (let o = inst.segStart[i]; o < inst.segStart[i + 1]; o++) {
        if (o === o0 || !c.usable[o]) continue;
        const gain = mode === 'value' ? c.value[o] - v0 : targetGain(o) - t0;
        if (gain <= 1e-12) continue;
        let price = movePrice(w, o, o0, weight, cap);
        if (Number.isNaN(price)) continue;
        // For targets, the value given up counts beside the money (least life-cycle cost per unit of gain).
        if (mode === 'targets') price += v0 - c.value[o];
        const sc = price > 1e-12 ? gain / price : Number.MAX_VALUE / (1 + Math.max(0, -price));
        if (sc > best) {
          best = sc;
          bo = o;
        }
      }
      if (bo >= 0) {
        moveOpt[i] = bo;
        score[i] = best;
        cands.push(i);
      }
    }
    if (cands.length === 0) return;
    cands.sort((a, b) => score[b] - score[a]);
    let moved = 0;
    for (const i of cands) {
      if (mode === 'targets') {
        // Stop as soon as every target that was short is met: more would spend value for nothing.
        let stillShort = false;
        for (let r = 0; r < c.R; r++) if (deficit[r] > 0 && short(inst, w.lhs, r)) stillShort = true;
        if (!stillShort) break;
      }
      const o = moveOpt[i];
      const o0 = cur[i];
      if (Number.isNaN(movePrice(w, o, o0, weight, cap))) continue;
      if (o0 >= 0) addOption(w, o0, -1);
      addOption(w, o, 1);
      if (c.R > 0) {
        // Never break a target row that is met.
        let breaks = false;
        for (let k = c.gStart[o]; k < c.gStart[o + 1]; k++)
          if (deficit[c.gRow[k]] === 0 && short(inst, w.lhs, c.gRow[k])) breaks = true;
        if (o0 >= 0)
          for (let k = c.gStart[o0]; k < c.gStart[o0 + 1]; k++)
            if (deficit[c.gRow[k]] === 0 && short(inst, w.lhs, c.gRow[k])) breaks = true;
        if (breaks) {
          addOption(w, o, -1);
          if (o0 >= 0) addOption(w, o0, 1);
          continue;
        }
      }
      cur[i] = o;
      moved++;
    }
    if (moved === 0) return;
  }
}

/**
 * A feasible (as far as it can be) plan from a starting choice (the rounded average of the
 * Lagrangian choices, or the choice at the multipliers): downgrade where money runs over, then
 * spend what is left on the missed targets and on value, priced by the multipliers.
 */
function primal(w: Work, start: Int32Array | null, lam: Float64Array, mu: Float64Array, lamBase: Float64Array) {
  const { inst, c } = w;
  pickAt(w, lam, mu);
  if (start) {
    w.pick.set(start);
    w.spent.fill(0);
    w.lhs.fill(0);
    for (let i = 0; i < inst.nSegments; i++) if (start[i] >= 0) addOption(w, start[i], 1);
  }
  const cur = w.pick.slice();
  downgradeUntilFits(w, cur);
  w.pick.set(cur);
  const eps = new Float64Array(c.Y);
  for (let y = 0; y < c.Y; y++) eps[y] = lamBase[y] * 1e-3;
  if (c.R > 0) fill(w, cur, lam, eps, 'targets');
  fill(w, cur, lam, eps, 'value');
  w.pick.set(cur);
  let missed = 0;
  for (let r = 0; r < c.R; r++) if (short(inst, w.lhs, r)) missed++;
  for (let i = 0; i < inst.nSegments; i++) if (inst.mustChoose[i] && cur[i] < 0) missed++;
  let overspent = false;
  for (let y = 0; y < c.Y; y++) if (over(inst, w.spent, y)) overspent = true;
  return { pick: cur, value: totalValue(w), missed, overspent };
}

/**
 * Subgradient descent on the Lagrangian dual, with feasible plans built along the way.
 * `bound` is in the maximised form (benefit, or −lcc).
 */
function run(
  inst: PackedInstance,
  c: Compiled,
  iterations: number,
  withPrimal: boolean,
  onProgress?: (f: number) => void,
) {
  const Y = c.Y;
  const R = c.R;
  const w: Work = {
    inst,
    c,
    pick: new Int32Array(inst.nSegments),
    spent: new Float64Array(Y),
    lhs: new Float64Array(R),
  };
  // Starting prices: half the value a dollar buys on average across options worth doing.
  let vPos = 0;
  let cPos = 0;
  for (let o = 0; o < c.nOpt; o++) {
    if (!c.usable[o] || c.value[o] <= 0) continue;
    vPos += c.value[o];
    for (let k = c.cStart[o]; k < c.cStart[o + 1]; k++) cPos += c.cVal[k];
  }
  const ratio = cPos > 0 ? vPos / cPos : 0;
  const finite = new Uint8Array(Y);
  const lam = new Float64Array(Y);
  const lamBase = new Float64Array(Y);
  for (let y = 0; y < Y; y++) {
    finite[y] = Number.isFinite(inst.budgets[y]) && inst.budgets[y] > 0 ? 1 : 0;
    lamBase[y] = finite[y] ? Math.max(ratio, 1e-12) : 0;
    lam[y] = finite[y] ? 0.5 * ratio : 0;
  }
  // Target rows: a price per unit of gain of the same order as the value per unit of gain.
  const mu = new Float64Array(R);
  const muBase = new Float64Array(R);
  const rScale = new Float64Array(R);
  let vAbs = 0;
  for (let o = 0; o < c.nOpt; o++) vAbs += Math.abs(c.value[o]);
  for (let r = 0; r < R; r++) {
    const t = inst.targets[r];
    let g = 0;
    for (let k = 0; k < t.gain.length; k++) g += Math.abs(t.gain[k]);
    muBase[r] = g > 0 ? Math.max(vAbs, 1) / g : 1;
    rScale[r] = Math.max(Math.abs(t.rhs), 1e-9);
  }
  let bestBound = Number.POSITIVE_INFINITY;
  const bestLam = lam.slice();
  const bestMu = mu.slice();
  type Best = { pick: Int32Array; value: number; missed: number; overspent: boolean };
  const held: { best: Best | null } = { best: null };
  const better = (p: Best, b: Best | null) =>
    !b ||
    (!p.overspent && b.overspent) ||
    (p.overspent === b.overspent && (p.missed < b.missed || (p.missed === b.missed && p.value > b.value)));
  const tryPrimal = (start: Int32Array | null, l: Float64Array, m: Float64Array) => {
    const p = primal(w, start, l, m, lamBase);
    if (better(p, held.best)) held.best = p;
    if (R === 0 || p.missed === 0) return;
    // Targets missed: raise their prices (penalty multipliers) until a repaired plan meets them, or give up and say so.
    const mm = m.slice();
    const lo = m.slice();
    let alpha = 0.05;
    const ok = (q: Best) => q.missed === 0 && !q.overspent;
    for (let step = 0; step < 16; step++) {
      lo.set(mm);
      for (let r = 0; r < R; r++) mm[r] = mm[r] * (1 + alpha) + muBase[r] * alpha;
      alpha *= 1.8;
      const q = primal(w, null, l, mm, lamBase);
      if (better(q, held.best)) held.best = q;
      if (!ok(q)) continue;
      // Met: the least prices between the last failing and these that still meet every target.
      const hi = mm.slice();
      const mid = new Float64Array(R);
      for (let b = 0; b < 6; b++) {
        for (let r = 0; r < R; r++) mid[r] = (lo[r] + hi[r]) / 2;
        const q2 = primal(w, null, l, mid, lamBase);
        if (better(q2, held.best)) held.best = q2;
        if (ok(q2)) hi.set(mid);
        else lo.set(mid);
      }
      break;
    }
  };
  let theta = 1;
  let stall = 0;
  const feasibleValue = () => {
    const b = held.best;
    return b && !b.overspent && b.missed === 0 ? b.value : null;
  };
  for (let it = 0; it < iterations; it++) {
    const L = pickAt(w, lam, mu);
    if (it === 0 || L < bestBound - 1e-12 * Math.abs(bestBound)) {
      bestBound = L;
      bestLam.set(lam);
      bestMu.set(mu);
      stall = 0;
    } else if (++stall >= 6) {
      theta *= 0.5;
      stall = 0;
    }
    const fv = feasibleValue();
    if (fv !== null && bestBound - fv <= 2e-5 * Math.max(Math.abs(bestBound), 1e-9)) break;
    if (theta < 1e-5) break;
    // Subgradient in scaled rows: budget rows as fractions of the budget, target rows of their rhs.
    let norm = 0;
    for (let y = 0; y < Y; y++) {
      if (!finite[y]) continue;
      const g = 1 - w.spent[y] / inst.budgets[y];
      if (lam[y] > 0 || g < 0) norm += g * g;
    }
    for (let r = 0; r < R; r++) {
      const g = (w.lhs[r] - inst.targets[r].rhs) / rScale[r];
      if (mu[r] > 0 || g < 0) norm += g * g;
    }
    if (norm < 1e-18) break; // the multipliers are optimal
    const target = fv !== null ? fv : L - 0.05 * Math.max(Math.abs(L), 1e-9);
    const t = (theta * Math.max(L - target, 1e-12 * Math.abs(L))) / norm;
    for (let y = 0; y < Y; y++) {
      if (!finite[y]) continue;
      const g = 1 - w.spent[y] / inst.budgets[y];
      lam[y] = Math.max(0, lam[y] - (t * g) / inst.budgets[y]);
    }
    for (let r = 0; r < R; r++) {
      const g = (w.lhs[r] - inst.targets[r].rhs) / rScale[r];
      mu[r] = Math.max(0, mu[r] - (t * g) / rScale[r]);
    }
    onProgress?.((it + 1) / iterations);
  }
  if (withPrimal) {
    const sh = sharpen(inst, c, bestLam, bestMu);
    if (sh && sh.bestTrue < bestBound) {
      bestBound = sh.bestTrue;
      bestLam.set(sh.bestLam);
      bestMu.set(sh.bestMu);
    }
    if (sh) {
      tryPrimal(sh.softOrder, sh.lam, sh.mu);
      tryPrimal(null, sh.lam, sh.mu);
      // Small networks: the repair is cheap, and lumpy choices make a slightly dearer or cheaper
      // price worth trying (a few per cent either way).
      if (c.nOpt <= 100_000) {
        const l2 = new Float64Array(Y);
        for (const f of [0.97, 0.99, 1.01, 1.03, 1.06]) {
          for (let y = 0; y < Y; y++) l2[y] = sh.lam[y] * f;
          tryPrimal(null, l2, sh.mu);
        }
      }
    } else tryPrimal(null, bestLam, bestMu);
  }
  return { bound: bestBound, lam: bestLam, mu: bestMu, best: held.best };
}

/** The Lagrangian bound only (for the worst-first method and as a fallback beside HiGHS), in the objective's own terms. */
export function lagrangianBound(inst: PackedInstance, iterations = 60, c = compile(inst)) {
  const r = run(inst, c, iterations, false);
  return inst.objective === 'cost' ? -r.bound : r.bound;
}

export function solveFast(
  inst: PackedInstance,
  opts: { iterations?: number; onProgress?: (f: number) => void } = {},
): PlanSolution {
  const c = compile(inst);
  const r = run(inst, c, opts.iterations ?? 30, true, opts.onProgress);
  const pick = r.best?.pick ?? new Int32Array(inst.nSegments).fill(-1);
  const bound = inst.objective === 'cost' ? -r.bound : r.bound;
  const s = solutionOf(inst, c, 'fast', pick, bound, '');
  const e = evaluate(inst, c, pick);
  s.status =
    e.overspent.length > 0
      ? 'no choice found within every year’s budget (work that must be done costs more than the budget)'
      : s.targetsMissed.length > 0
        ? `near-optimal (Lagrangian bound); missed: ${s.targetsMissed.join('; ')}`
        : 'near-optimal (Lagrangian bound)';
  return s;
}
