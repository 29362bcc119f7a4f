// From the chosen strategies back to the network year by year: work lists, spending, network PCI,
// bands, failed lane-miles, tons of mix, and the backlog (docs/COMPUTATION.md, The budget plan: results).
import { CONDITION_BANDS, conditionBand } from '../../condition';
import {
  type CurveTable,
  inPciRange,
  type PlanSegment,
  type PlanSettings,
  type PlanTreatment,
  surfaceAfter,
} from './condition';
import type { StructuralCheck } from '../structural';
import type { PackedInstance } from './instance';
import { SegmentWalker, type StrategyMeta, surfaceSetsOf } from './strategies';

export type WorkItem = {
  year: number;
  calendarYear: number;
  ref: number;
  segmentId: string;
  roadName: string;
  fromDesc: string | null;
  toDesc: string | null;
  functionalClass: string;
  treatment: string;
  mix: string | null;
  thicknessIn: number | null;
  tons: number;
  areaSy: number;
  laneMiles: number;
  cost: number;
  pciBefore: number;
  pciAfter: number;
  /** The whole strategy of the segment in plain words: "crack seal 2027, thin overlay 2031". */
  strategy: string;
  /** Plain-words caution from the AASHTO 1993 structural check, or null. */
  structuralFlag: string | null;
};

export type YearResult = {
  year: number;
  calendarYear: number;
  budget: number;
  spent: number;
  /** Lane-mile-weighted mean PCI after the year's work. */
  networkPci: number;
  networkPciDoNothing: number;
  laneMilesByBand: Record<string, number>;
  /** Cost of the cheapest fitting treatment of every road under the needs-work PCI after the year's work. */
  backlog: number;
  /** Roads under the needs-work PCI that no treatment of the plan fits (counted, never priced at $0). */
  backlogNoFit: { segments: number; laneMiles: number };
  /** Lane-miles in the lowest band (Broken up, PCI 25 or less). */
  failedLaneMiles: number;
  /** Tons of mix placed in the year, by mix name. */
  tonsByMix: Record<string, number>;
};

const FAILED_BAND = CONDITION_BANDS[CONDITION_BANDS.length - 1].id;
const lower = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);

export function structuralWords(c: StructuralCheck, t: PlanTreatment) {
  if (!c.caution) return null;
  return (
    `Structural caution (AASHTO 1993 check): a ${t.thicknessIn} in lift gives a structural number of about ` +
    `${c.snWithOverlay.toFixed(2)} where its traffic asks for ${c.requiredSn.toFixed(2)}; confirm the base before letting the work. ` +
    `Agency specifications and a licensed engineer's judgement govern.`
  );
}

export function simulate(
  segments: PlanSegment[],
  treatments: PlanTreatment[],
  ct: CurveTable,
  settings: PlanSettings,
  inst: PackedInstance,
  meta: StrategyMeta,
  pick: Int32Array,
) {
  const H = settings.budgets.length;
  const surfaceSets = surfaceSetsOf(treatments);
  const years: YearResult[] = Array.from({ length: H }, (_, y) => ({
    year: y,
    calendarYear: settings.startYear + y,
    budget: settings.budgets[y],
    spent: 0,
    networkPci: 0,
    networkPciDoNothing: 0,
    laneMilesByBand: Object.fromEntries(CONDITION_BANDS.map((b) => [b.id, 0])),
    backlog: 0,
    backlogNoFit: { segments: 0, laneMiles: 0 },
    failedLaneMiles: 0,
    tonsByMix: {},
  }));
  const work: WorkItem[] = [];
  let lmSum = 0;
  let lifeCycleCost = 0;
  const path = new Float64Array(meta.W + 1);
  for (let i = 0; i < segments.length; i++) {
    const s = segments[i];
    const wk = new SegmentWalker(ct, s, treatments, surfaceSets, settings, meta.W);
    const o = pick[i];
    const works: { treatment: number; year: number }[] = [];
    if (o >= 0) {
      lifeCycleCost += inst.lcc[o];
      for (let k = meta.actStart[o]; k < meta.actStart[o + 1]; k++)
        works.push({ treatment: meta.actTreatment[k], year: meta.actYear[k] });
    }
    const acts = new Int32Array(works.length * 2 + 2);
    const flags = new Uint8Array(works.length + 1);
    const pcis = new Float64Array(works.length * 2 + 2);
    wk.trace(null, works, path, 0, acts, flags, pcis);
    const strategy = works
      .map((w) => `${lower(treatments[w.treatment].name)} ${settings.startYear + w.year}`)
      .join(', ');
    works.forEach((w, k) => {
      const t = treatments[w.treatment];
      const cost = wk.cost[w.treatment];
      const tons = t.tonsPerSy * s.areaSy;
      const yr = years[w.year];
      yr.spent += cost;
      if (t.mixName && tons > 0) yr.tonsByMix[t.mixName] = (yr.tonsByMix[t.mixName] ?? 0) + tons;
      work.push({
        year: w.year,
        calendarYear: settings.startYear + w.year,
        ref: s.ref,
        segmentId: s.segmentId,
        roadName: s.roadName,
        fromDesc: s.fromDesc ?? null,
        toDesc: s.toDesc ?? null,
        functionalClass: s.functionalClass,
        treatment: t.name,
        mix: t.mixName,
        thicknessIn: t.thicknessIn,
        tons,
        areaSy: s.areaSy,
        laneMiles: s.laneMiles,
        cost,
        pciBefore: pcis[k * 2],
        pciAfter: pcis[k * 2 + 1],
        strategy,
        structuralFlag:
          t.thicknessIn !== null && meta.actFlag[meta.actStart[o] + k]
            ? structuralWords(wk.structuralCheck(w.treatment, pcis[k * 2]), t)
            : null,
      });
    });
    lmSum += s.laneMiles;
    // The surface the road has in each year, for the backlog's fitting treatments.
    let surface = s.surface;
    let k = 0;
    for (let y = 0; y < H; y++) {
      while (k < works.length && works[k].year === y) {
        surface = surfaceAfter(treatments[works[k].treatment], surface);
        k++;
      }
      const v = path[y];
      const yr = years[y];
      yr.networkPci += v * s.laneMiles;
      yr.networkPciDoNothing += wk.none[y] * s.laneMiles;
      const band = conditionBand(v);
      if (band) {
        yr.laneMilesByBand[band.id] += s.laneMiles;
        if (band.id === FAILED_BAND) yr.failedLaneMiles += s.laneMiles;
      }
      if (v < settings.needsWorkBelow) {
        let best = Number.POSITIVE_INFINITY;
        for (let ti = 0; ti < treatments.length; ti++) {
          const t = treatments[ti];
          if (!t.applicability.classes.includes(s.functionalClass) || !surfaceSets[ti].has(surface)) continue;
          if (!inPciRange(t, v)) continue;
          if (wk.cost[ti] < best) best = wk.cost[ti];
        }
        if (Number.isFinite(best)) yr.backlog += best;
        else {
          yr.backlogNoFit.segments++;
          yr.backlogNoFit.laneMiles += s.laneMiles;
        }
      }
    }
  }
  for (const y of years) {
    y.networkPci = lmSum > 0 ? y.networkPci / lmSum : 0;
    y.networkPciDoNothing = lmSum > 0 ? y.networkPciDoNothing / lmSum : 0;
  }
  work.sort((a, b) => a.year - b.year || b.cost - a.cost);
  return { years, work, lifeCycleCost, laneMiles: lmSum };
}
