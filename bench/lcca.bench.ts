// 50,000 segments × 6 alternatives × 40-year period: Wearcourse's vectorised
// evaluation in one call, beside a loop that calls the `financial` package's
// npv per segment, and beside numpy on the same arrays where python3 has numpy.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { npv as fnpv } from 'financial';
import { evaluateNetwork } from '../shared/engine/lcca/network';
import { activityCost, expandSchedule, type Schedule } from '../shared/engine/lcca/schedule';

const N_SEG = 50_000;
const YEARS = 40;
const RATE = 0.03;
const r = (perSy: number, perJob = 3500) => ({ perSy, perLaneMile: 0, perJob, addOnFraction: 0.18 });
const seal = { template: { label: 'crack seal', serviceLifeYears: 3, rates: r(0.4, 0) }, everyYears: 4 };
// Six alternatives of the kind an engineer compares (rates are the demo scenario's, invented).
const plans: Schedule[] = [
  {
    initial: { label: 'mill and overlay 2 in', serviceLifeYears: 12, rates: r(15.9) },
    rehabilitation: [],
    maintenance: [seal],
    repeatAtEndOfLife: true,
  },
  {
    initial: { label: 'polymer 2 in', serviceLifeYears: 15, rates: r(17.1) },
    rehabilitation: [],
    maintenance: [seal],
    repeatAtEndOfLife: true,
  },
  {
    initial: { label: 'rubber-modified 1.5 in', serviceLifeYears: 14, rates: r(9.2) },
    rehabilitation: [],
    maintenance: [seal],
    repeatAtEndOfLife: true,
  },
  {
    initial: { label: 'thin overlay 1 in', serviceLifeYears: 8, rates: r(4.6) },
    rehabilitation: [],
    maintenance: [],
    repeatAtEndOfLife: true,
  },
  {
    initial: { label: 'chip seal', serviceLifeYears: 6, rates: r(3.1) },
    rehabilitation: [],
    maintenance: [],
    repeatAtEndOfLife: true,
  },
  {
    initial: { label: 'reconstruction', serviceLifeYears: 25, rates: r(46) },
    rehabilitation: [{ label: 'overlay', serviceLifeYears: 12, rates: r(15.9) }],
    maintenance: [seal],
    repeatAtEndOfLife: true,
  },
];
const areaSy = new Float64Array(N_SEG);
const laneMiles = new Float64Array(N_SEG);
for (let i = 0; i < N_SEG; i++) {
  const len = 0.05 + ((i * 7919) % 1000) / 1000;
  areaSy[i] = (len * 5280 * (22 + (i % 5) * 4)) / 9;
  laneMiles[i] = len * 2;
}

const t0 = performance.now();
const res = evaluateNetwork(plans, { areaSy, laneMiles }, RATE, YEARS);
const vecMs = performance.now() - t0;
console.log(
  `Wearcourse evaluateNetwork, ${N_SEG.toLocaleString('en-US')} segments × ${plans.length} alternatives × ${YEARS} years, one call: ${vecMs.toFixed(1)} ms`,
);

// The same costs as yearly cash flows per segment, through financial.npv (no remaining-life credit here,
// so compare against the cost PV: evaluate with salvage off for the check).
const totalSy = areaSy.reduce((s, v) => s + v, 0);
const yearly = plans.map((p) => {
  const perSy = new Float64Array(YEARS + 1);
  const perJob = new Float64Array(YEARS + 1);
  for (const a of expandSchedule(p, YEARS)) {
    perSy[a.year] += activityCost(a.template.rates, { areaSy: 1, laneMiles: 0, jobs: 0 });
    perJob[a.year] += activityCost(a.template.rates, { areaSy: 0, laneMiles: 0, jobs: 1 });
  }
  return { perSy, perJob };
});
const t1 = performance.now();
let loopTotal = 0;
const flows = new Array(YEARS + 1).fill(0);
for (const y of yearly) {
  for (let i = 0; i < N_SEG; i++) {
    const share = areaSy[i] / totalSy;
    for (let k = 0; k <= YEARS; k++) flows[k] = y.perSy[k] * areaSy[i] + y.perJob[k] * share;
    loopTotal += fnpv(RATE, flows);
  }
}
const loopMs = performance.now() - t1;
console.log(
  `loop of financial.npv per segment (${(N_SEG * plans.length).toLocaleString('en-US')} calls): ${loopMs.toFixed(0)} ms — ${(loopMs / vecMs).toFixed(0)}× the vectorised call`,
);
const noSalvage = evaluateNetwork(
  plans.map((p) => ({
    ...p,
    initial: { ...p.initial, salvage: false },
    rehabilitation: p.rehabilitation.map((x) => ({ ...x, salvage: false })),
  })),
  { areaSy, laneMiles },
  RATE,
  YEARS,
);
const vecTotal = noSalvage.reduce((s, x) => s + x.totalNpv, 0);
console.log(
  `check: cost PV summed over all segments and alternatives — vectorised ${vecTotal.toFixed(0)}, financial loop ${loopTotal.toFixed(0)} (relative difference ${(Math.abs(vecTotal - loopTotal) / loopTotal).toExponential(1)})`,
);
console.log(
  `with remaining-life credit the six network totals are: ${res.map((x) => `$${(x.totalNpv / 1e6).toFixed(1)}M`).join(', ')}`,
);

const py = spawnSync('python3', ['-c', 'import numpy; print(numpy.__version__)'], { encoding: 'utf8' });
if (py.status !== 0) {
  console.log('numpy: not installed here (apt-get install python3-numpy), skipped');
} else {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wc-np-'));
  fs.writeFileSync(path.join(dir, 'area.bin'), Buffer.from(areaSy.buffer));
  fs.writeFileSync(
    path.join(dir, 'coef.bin'),
    Buffer.from(Float64Array.from(yearly.flatMap((y) => [...y.perSy, ...y.perJob])).buffer),
  );
  const script = `
import numpy as np, time, sys
d = sys.argv[1]
area = np.fromfile(d + '/area.bin'); coef = np.fromfile(d + '/coef.bin').reshape(${plans.length}, 2, ${YEARS + 1})
disc = (1 + ${RATE}) ** -np.arange(${YEARS + 1})
t = time.perf_counter()
share = area / area.sum()
pv_sy = coef[:, 0, :] @ disc; pv_job = coef[:, 1, :] @ disc
npv = np.outer(pv_sy, area) + np.outer(pv_job, share)
total = npv.sum()
ms = (time.perf_counter() - t) * 1000
print(f"numpy {np.__version__} on the same arrays: {ms:.1f} ms, total {total:.0f}")
`;
  const out = spawnSync('python3', ['-c', script, dir], { encoding: 'utf8' });
  console.log(out.stdout.trim() || out.stderr.trim());
  fs.rmSync(dir, { recursive: true, force: true });
}
process.exit(0);
