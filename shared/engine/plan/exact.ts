// The exact method (docs/COMPUTATION.md, the budget plan): a mixed-integer programme solved by
// HiGHS, passed as typed arrays (no LP text). One binary per option that fits its years'
// budgets; rows: each year's budget (≤), each target (≥), each segment's choice (≤ 1, or = 1
// where it must take work). The bound and gap reported are HiGHS's own (info mip_dual_bound,
// mip_gap), not the objective restated.
import { compile, solutionOf } from './compiled';
import { solveFast } from './fast';
import type { PackedInstance, PlanSolution } from './instance';

/** The part of the `highs` package (1.15+) the engine uses; the caller loads it (server/plans/highs.ts). */
export type Highs = Pick<import('highs').Highs, 'withModel' | 'constants' | 'infinity'>;

export function solveExact(
  inst: PackedInstance,
  highs: Highs,
  opts: { timeLimitSeconds?: number; mipRelGap?: number } = {},
): PlanSolution {
  const c = compile(inst);
  const Y = c.Y;
  const R = c.R;
  // Columns: usable options.
  const col = new Int32Array(c.nOpt).fill(-1);
  let n = 0;
  for (let o = 0; o < c.nOpt; o++) if (c.usable[o]) col[o] = n++;
  const opt = new Int32Array(n);
  for (let o = 0; o < c.nOpt; o++) if (col[o] >= 0) opt[col[o]] = o;
  // Segment rows, for segments with an option or a duty to take one.
  const segRow = new Int32Array(inst.nSegments).fill(-1);
  let rows = Y + R;
  for (let i = 0; i < inst.nSegments; i++) {
    let has = false;
    for (let o = inst.segStart[i]; o < inst.segStart[i + 1]; o++) if (c.usable[o]) has = true;
    if (!has && inst.mustChoose[i])
      throw new Error(
        `segment ${i + 1} must take work but no option fits its years’ budgets; raise the budgets or relax the rule that requires work there`,
      );
    if (has) segRow[i] = rows++;
  }
  const segOf = new Int32Array(c.nOpt);
  for (let i = 0; i < inst.nSegments; i++) for (let o = inst.segStart[i]; o < inst.segStart[i + 1]; o++) segOf[o] = i;
  const most = new Float64Array(inst.nSegments);
  for (let r = 0; r < R; r++) {
    // Most a row can reach: each segment's largest gain on it (one option per segment).
    const t = inst.targets[r];
    most.fill(0);
    for (let k = 0; k < t.idx.length; k++)
      if (c.usable[t.idx[k]]) most[segOf[t.idx[k]]] = Math.max(most[segOf[t.idx[k]]], t.gain[k]);
    let reach = 0;
    for (let i = 0; i < inst.nSegments; i++) reach += most[i];
    if (reach < t.rhs - 1e-9)
      throw new Error(`the target “${t.label}” cannot be met even if every affordable option were done; lower it`);
  }
  const colCost = new Float64Array(n);
  const starts = new Int32Array(n + 1);
  let nnz = 0;
  for (let j = 0; j < n; j++) {
    const o = opt[j];
    colCost[j] = inst.objective === 'cost' ? inst.lcc[o] : inst.benefit[o];
    nnz += c.cStart[o + 1] - c.cStart[o] + (c.gStart[o + 1] - c.gStart[o]) + 1;
    starts[j + 1] = nnz;
  }
  const indices = new Int32Array(nnz);
  const values = new Float64Array(nnz);
  const seg = segOf;
  for (let j = 0, k = 0; j < n; j++) {
    const o = opt[j];
    // Row indices ascending within a column: budgets (< Y), targets (< Y + R), then the segment row.
    for (let q = c.cStart[o]; q < c.cStart[o + 1]; q++) {
      indices[k] = c.cYear[q];
      values[k++] = c.cVal[q];
    }
    for (let q = c.gStart[o]; q < c.gStart[o + 1]; q++) {
      indices[k] = Y + c.gRow[q];
      values[k++] = c.gVal[q];
    }
    // (Target rows of one option arrive in row order: compile fills them row by row.)
    indices[k] = segRow[seg[o]];
    values[k++] = 1;
  }
  const inf = highs.infinity;
  const rowLower = new Float64Array(rows);
  const rowUpper = new Float64Array(rows);
  for (let y = 0; y < Y; y++) {
    rowLower[y] = -inf;
    rowUpper[y] = Number.isFinite(inst.budgets[y]) ? inst.budgets[y] : inf;
  }
  for (let r = 0; r < R; r++) {
    rowLower[Y + r] = inst.targets[r].rhs;
    rowUpper[Y + r] = inf;
  }
  for (let i = 0; i < inst.nSegments; i++) {
    if (segRow[i] < 0) continue;
    rowLower[segRow[i]] = inst.mustChoose[i] ? 1 : 0;
    rowUpper[segRow[i]] = 1;
  }
  const pick = new Int32Array(inst.nSegments).fill(-1);
  if (n === 0) return solutionOf(inst, c, 'exact', pick, 0, 'optimal (nothing affordable)');
  // A start for HiGHS from the fast method (it only helps HiGHS find incumbents sooner).
  const warm = solveFast(inst, { iterations: 60 });
  const warmOk = warm.targetsMissed.length === 0 && !warm.status.startsWith('no choice');
  const out = highs.withModel(
    {
      numCols: n,
      numRows: rows,
      sense:
        inst.objective === 'cost' ? highs.constants.objectiveSense.minimize : highs.constants.objectiveSense.maximize,
      colCost,
      colLower: new Float64Array(n),
      colUpper: new Float64Array(n).fill(1),
      rowLower,
      rowUpper,
      matrix: { format: 'csc', numRows: rows, numCols: n, starts, indices, values },
      integrality: new Int32Array(n).fill(highs.constants.variableType.integer),
    },
    (m) => {
      m.options.set({
        output_flag: false,
        time_limit: opts.timeLimitSeconds ?? 60,
        mip_rel_gap: opts.mipRelGap ?? 1e-6,
        presolve: 'on',
      });
      if (warmOk) {
        const idx: number[] = [];
        for (let i = 0; i < inst.nSegments; i++) if (warm.pick[i] >= 0) idx.push(col[warm.pick[i]]);
        if (idx.length) m.setSolution({ indices: Int32Array.from(idx), values: new Float64Array(idx.length).fill(1) });
      }
      const run = m.run();
      const info = (name: string) => {
        try {
          return Number(m.info.get(name));
        } catch {
          return Number.NaN;
        }
      };
      const hasPrimal = info('primal_solution_status') === highs.constants.solutionStatus.feasible;
      return {
        status: run.modelStatus,
        colValue: hasPrimal ? m.getSolution().colValue : null,
        dualBound: info('mip_dual_bound'),
        mipGap: info('mip_gap'),
      };
    },
  );
  const S = highs.constants.modelStatus;
  if (out.status === S.infeasible)
    throw new Error(
      `no choice of work meets every year’s budget${R ? ` and every target (${inst.targets.map((t) => t.label).join('; ')})` : ''}; raise the budgets or lower the targets (Find the budget helps)`,
    );
  if (out.status !== S.optimal && out.status !== S.timeLimit && out.status !== S.interrupted)
    throw new Error(`HiGHS ended with model status ${out.status}`);
  const optimal = out.status === S.optimal;
  if (!out.colValue) {
    // Time ran out before HiGHS found a plan: the fast method's plan, with the better of the two bounds.
    const better = inst.objective === 'cost' ? Math.max : Math.min;
    const b = Number.isFinite(out.dualBound) ? better(out.dualBound, warm.bound) : warm.bound;
    return solutionOf(
      inst,
      c,
      'exact',
      warm.pick,
      b,
      'time limit reached before HiGHS found a plan: the fast method’s plan, with the tighter of HiGHS’s and the Lagrangian bound',
    );
  }
  for (let j = 0; j < n; j++) if (out.colValue[j] > 0.5) pick[seg[opt[j]]] = opt[j];
  const pct = Number.isFinite(out.mipGap) ? `${(out.mipGap * 100).toPrecision(3)} %` : 'unknown';
  const s = solutionOf(
    inst,
    c,
    'exact',
    pick,
    Number.isFinite(out.dualBound) ? out.dualBound : warm.bound,
    optimal
      ? `optimal within HiGHS’s gap of ${pct} (HiGHS)`
      : `time limit reached (HiGHS); HiGHS’s dual bound, gap ${pct}`,
  );
  return s;
}
