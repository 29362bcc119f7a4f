// The plan solver on one packed instance of 20,000 segments × 10 years with about 20 treatment
// strategies per segment (bench/synthetic-strategies.ts): the fast method's time and value beside
// native HiGHS's LP relaxation of the same instance (scipy.optimize.linprog, method 'highs', run in
// python3 when it is there), the ratio of the times (goal ≥ 20×) and the fast plan's gap to the LP
// bound (goal ≤ 0.1 %). Then WebAssembly HiGHS (the exact method) on small instances, and the
// candidate generation of today's plan on the older benchmark network.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import loadHighs from 'highs';
import { optionCount, type PackedInstance } from '../shared/engine/plan/instance';
import { solvePlan } from '../shared/engine/plan/solve';
import { syntheticStrategies } from './synthetic-strategies';

const N = Number(process.env.BENCH_SEGMENTS ?? 20_000);
const H = 10;
const PER = Number(process.env.BENCH_STRATEGIES ?? 20);
const pct = (x: number) => `${(x * 100).toFixed(4)} %`;
const ms = (t: number) => `${t.toFixed(0)} ms`;

// ---- 1. Fast method against native HiGHS's LP relaxation ------------------------------------

let t = performance.now();
const inst = syntheticStrategies({ segments: N, years: H, perSegment: PER, budgetShare: 0.25, seed: 99 });
console.log(
  `${N.toLocaleString('en-US')} segments × ${H} years: ${optionCount(inst).toLocaleString('en-US')} strategies (synthetic) built in ${ms(performance.now() - t)}; budget $${(inst.budgets[0] / 1e6).toFixed(1)}M a year`,
);

// Three runs (the machine is shared; the median is the figure compared), same answer each time.
const fastTimes: number[] = [];
let fast = solvePlan(inst, 'fast', null);
for (let k = 0; k < 3; k++) {
  t = performance.now();
  fast = solvePlan(inst, 'fast', null);
  fastTimes.push(performance.now() - t);
}
const fastMs = [...fastTimes].sort((a, b) => a - b)[1];
console.log(
  `fast (Lagrangian): median ${ms(fastMs)} of ${fastTimes.map(ms).join(', ')} (after one warm-up run), benefit ${fast.objective.toFixed(0)}, its own bound ${fast.bound.toFixed(0)}, its gap ${pct(fast.gap)}`,
);
t = performance.now();
const rank = solvePlan(inst, 'ranking', null);
console.log(
  `worst-first: ${ms(performance.now() - t)}, benefit ${rank.objective.toFixed(0)} (${((1 - rank.objective / fast.objective) * 100).toFixed(1)} % below fast)`,
);

/** The LP relaxation as COO arrays in a temporary folder, solved by scipy's HiGHS in python3. */
function scipyLp(p: PackedInstance) {
  const probe = spawnSync('python3', ['-c', 'import scipy, numpy; print(scipy.__version__)'], { encoding: 'utf8' });
  if (probe.status !== 0)
    return { missing: probe.error?.message ?? probe.stderr.trim().split('\n').at(-1) ?? 'no python3' };
  const Y = p.years;
  const n = optionCount(p);
  const rows: number[] = [];
  const cols: number[] = [];
  const vals: number[] = [];
  const eqRows: number[] = [];
  const eqCols: number[] = [];
  const bUb: number[] = [...p.budgets];
  const bEq: number[] = [];
  // Options that cannot fit a year's budget on their own are out (as in the solvers): upper bound 0.
  const upper = new Float64Array(n).fill(1);
  for (let o = 0; o < n; o++)
    for (let y = 0; y < Y; y++) {
      const c = p.cost[o * Y + y];
      if (c === 0) continue;
      if (c > p.budgets[y]) upper[o] = 0;
      rows.push(y);
      cols.push(o);
      vals.push(c);
    }
  p.targets.forEach((tr) => {
    const r = bUb.length;
    bUb.push(-tr.rhs);
    for (let k = 0; k < tr.idx.length; k++) {
      rows.push(r);
      cols.push(tr.idx[k]);
      vals.push(-tr.gain[k]);
    }
  });
  for (let i = 0; i < p.nSegments; i++) {
    if (p.segStart[i + 1] === p.segStart[i]) continue;
    if (p.mustChoose[i]) {
      const r = bEq.length;
      bEq.push(1);
      for (let o = p.segStart[i]; o < p.segStart[i + 1]; o++) {
        eqRows.push(r);
        eqCols.push(o);
      }
    } else {
      const r = bUb.length;
      bUb.push(1);
      for (let o = p.segStart[i]; o < p.segStart[i + 1]; o++) {
        rows.push(r);
        cols.push(o);
        vals.push(1);
      }
    }
  }
  const c = new Float64Array(n);
  for (let o = 0; o < n; o++) c[o] = p.objective === 'cost' ? p.lcc[o] : -p.benefit[o];
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'plan-lp-'));
  const put = (name: string, a: Float64Array | Int32Array) => fs.writeFileSync(path.join(dir, name), a);
  put('c.f64', c);
  put('upper.f64', upper);
  put('rows.i32', Int32Array.from(rows));
  put('cols.i32', Int32Array.from(cols));
  put('vals.f64', Float64Array.from(vals));
  put('bub.f64', Float64Array.from(bUb));
  put('eqrows.i32', Int32Array.from(eqRows));
  put('eqcols.i32', Int32Array.from(eqCols));
  put('beq.f64', Float64Array.from(bEq));
  const script = `
import json, sys, time, numpy as np, scipy
from scipy.optimize import linprog
from scipy.sparse import coo_matrix
d = sys.argv[1]
f = lambda n, t: np.fromfile(d + '/' + n, dtype=t)
c = f('c.f64', np.float64); upper = f('upper.f64', np.float64)
bub = f('bub.f64', np.float64); beq = f('beq.f64', np.float64)
n = len(c)
A = coo_matrix((f('vals.f64', np.float64), (f('rows.i32', np.int32), f('cols.i32', np.int32))), shape=(len(bub), n)).tocsr()
Aeq = None
if len(beq):
    er = f('eqrows.i32', np.int32)
    Aeq = coo_matrix((np.ones(len(er)), (er, f('eqcols.i32', np.int32))), shape=(len(beq), n)).tocsr()
t = time.perf_counter()
r = linprog(c, A_ub=A, b_ub=bub, A_eq=Aeq, b_eq=beq if len(beq) else None, bounds=np.column_stack([np.zeros(n), upper]), method='highs')
secs = time.perf_counter() - t
print(json.dumps({'status': int(r.status), 'message': r.message, 'fun': float(r.fun) if r.fun is not None else None, 'seconds': secs, 'scipy': scipy.__version__}))
`;
  fs.writeFileSync(path.join(dir, 'lp.py'), script);
  const t0 = performance.now();
  const run = spawnSync('python3', [path.join(dir, 'lp.py'), dir], { encoding: 'utf8', maxBuffer: 1 << 24 });
  const wallMs = performance.now() - t0;
  fs.rmSync(dir, { recursive: true, force: true });
  if (run.status !== 0) return { missing: `python3 failed: ${run.stderr.trim().split('\n').at(-1)}` };
  const out = JSON.parse(run.stdout.trim().split('\n').at(-1)!) as {
    status: number;
    message: string;
    fun: number | null;
    seconds: number;
    scipy: string;
  };
  return { ...out, wallMs };
}

const lp = scipyLp(inst);
if ('missing' in lp) {
  console.log(`scipy LP relaxation: not run — python3 with scipy is not available here (${lp.missing})`);
} else if (lp.status !== 0 || lp.fun === null) {
  console.log(`scipy LP relaxation: ${lp.message}`);
} else {
  const lpBound = inst.objective === 'cost' ? lp.fun : -lp.fun;
  const lpMs = lp.seconds * 1000;
  const ratio = lpMs / fastMs;
  const gap = (lpBound - fast.objective) / Math.abs(lpBound);
  console.log(
    `native HiGHS LP relaxation (scipy ${lp.scipy} linprog method 'highs'): ${ms(lpMs)} in linprog (${ms(lp.wallMs)} with python start and reading), bound ${lpBound.toFixed(0)}`,
  );
  console.log(
    `ratio: the fast method is ${ratio.toFixed(1)}× quicker than the LP relaxation (goal ≥ 20×: ${ratio >= 20 ? 'met' : 'NOT met'})`,
  );
  console.log(
    `gap of the fast plan to the LP bound: ${pct(gap)} (goal ≤ 0.1 %: ${gap <= 0.001 ? 'met' : 'NOT met'}); the fast method's own bound is ${pct((fast.bound - lpBound) / lpBound)} above the LP bound`,
  );
}

// ---- 2. The exact method (HiGHS in WebAssembly) on small instances --------------------------

const highs = await loadHighs();
const EXACT_SECONDS = Number(process.env.BENCH_HIGHS_SECONDS ?? 20);
for (const [segments, per] of [
  [200, 10],
  [2_000, 20],
] as const) {
  const small = syntheticStrategies({
    segments,
    years: H,
    perSegment: per,
    budgetShare: 0.25,
    seed: 7,
    targetYears: [4, 9],
    targetShare: 0.3,
  });
  t = performance.now();
  const exact = solvePlan(small, 'exact', highs, { timeLimitSeconds: EXACT_SECONDS, mipRelGap: 1e-4 });
  const exactMs = performance.now() - t;
  t = performance.now();
  const f = solvePlan(small, 'fast', null);
  const fMs = performance.now() - t;
  console.log(
    `exact (WASM HiGHS) on ${segments.toLocaleString('en-US')} segments × ${per} strategies, 2 condition targets: ${ms(exactMs)}, ${exact.status}, benefit ${exact.objective.toFixed(0)}, HiGHS bound ${exact.bound.toFixed(0)}; fast ${ms(fMs)}, benefit ${f.objective.toFixed(0)} (${pct(1 - f.objective / exact.objective)} below exact), targets missed by fast: ${f.targetsMissed.length}`,
  );
}

// Strategy generation on the demo catalog (20,000 segments × 10 years) is timed in bench/plan-candidates.bench.ts.
const mem = process.memoryUsage();
console.log(`memory: RSS ${(mem.rss / 1024 / 1024).toFixed(0)} MB, heap ${(mem.heapUsed / 1024 / 1024).toFixed(0)} MB`);
process.exit(0);
