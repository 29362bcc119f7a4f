// From catalog items (a treatment, its mix and lift) to cost rates per SY,
// per lane-mile and per job, with every line kept so a user can see where a
// number comes from (docs/COMPUTATION.md, Cost of one application).
import type { Economics, Mix, Treatment } from '../../schemas/catalog';
import { LB_PER_TON } from '../quantities';
import type { CostRates } from './schedule';

export type RateLine = {
  label: string;
  basis: 'per_sy' | 'per_lane_mile' | 'per_job' | 'percent';
  rate: number;
  note?: string;
};

export type ResolvedTreatment = {
  label: string;
  rates: CostRates;
  lines: RateLine[];
  tonsPerSy: number;
  thicknessIn: number | null;
  /** Depth milled before the lift, in inches (0 when the treatment mills nothing; null without a lift). */
  millDepthIn: number | null;
  serviceLifeYears: number;
  /** How the life was set: from the treatment, from the mix and lift, or typed in. */
  lifeSource: 'treatment' | 'mix-and-lift' | 'entered';
  mix: Mix | null;
};

/**
 * Life of a lift of a mix at a thickness other than its reference: taken as
 * proportional to thickness around the reference, within ±50 % of the
 * reference life. A planning assumption, shown as such; agencies override it.
 */
export function lifeAtThickness(mix: Mix, thicknessIn: number) {
  const raw = mix.refLifeYears * (thicknessIn / mix.refLiftIn);
  return Math.min(mix.refLifeYears * 1.5, Math.max(mix.refLifeYears * 0.5, raw));
}

const fmtIn = (v: number) => String(Number(v.toFixed(2)));

/**
 * Milling depth follows the lift: a treatment that mills keeps the grade change
 * its catalog entry describes (lift − milling), so a lift ½ in thinner mills
 * ½ in less. Mill-and-overlay inlays (2 in milled, 2 in laid) therefore mill
 * exactly the lift. A planning rule; the agency's plans set the real depth.
 */
export function millDepthFor(t: Treatment, thicknessIn: number) {
  if (t.millDepthIn <= 0) return 0;
  const ref = t.defaultThicknessIn ?? thicknessIn;
  return Math.max(0, t.millDepthIn + (thicknessIn - ref));
}

/** The cost item that prices the milling: a per-SY item of a milling treatment whose label says so. */
const isMillingItem = (t: Treatment, item: Treatment['costItems'][number]) =>
  t.millDepthIn > 0 && item.basis === 'per_sy' && /\bmill/i.test(item.label);

/** "Mill and overlay — Rubber-modified, 1.5 in lift, 1.5 in milled": the catalog name loses a thickness that no longer holds. */
function overlayLabel(t: Treatment, mix: Mix, thicknessIn: number, millDepthIn: number) {
  const changed = t.defaultThicknessIn !== null && thicknessIn !== t.defaultThicknessIn;
  const name = changed ? t.name.replace(/\s*\(\d+(\.\d+)?\s*in\)/, '') : t.name;
  const mill = t.millDepthIn > 0 ? `, ${fmtIn(millDepthIn)} in milled` : '';
  return `${name} — ${mix.name}, ${fmtIn(thicknessIn)} in${mill}`;
}

export type PriceOverrides = { mixPricePerTon?: Record<string, number>; treatmentFactor?: Record<string, number> };

export function resolveTreatment(
  t: Treatment,
  mix: Mix | null,
  step: { thicknessIn?: number | null; serviceLifeYears?: number | null },
  econ: Economics,
  over: PriceOverrides = {},
): ResolvedTreatment {
  const factor = over.treatmentFactor?.[t.id] ?? 1;
  const lines: RateLine[] = [];
  const thicknessIn = mix ? (step.thicknessIn ?? t.defaultThicknessIn) : null;
  let tonsPerSy = 0;
  if (mix && thicknessIn) {
    const price = over.mixPricePerTon?.[mix.id] ?? mix.pricePerTon;
    tonsPerSy = (thicknessIn * mix.spreadRateLbPerSyIn) / LB_PER_TON;
    lines.push({
      label: `${mix.name}, ${thicknessIn} in at ${mix.spreadRateLbPerSyIn} lb/SY-in, $${price}/ton`,
      basis: 'per_sy',
      rate: tonsPerSy * price,
      note: `${(tonsPerSy * 1000).toFixed(1)} tons per 1,000 SY`,
    });
  }
  const millDepthIn = thicknessIn ? millDepthFor(t, thicknessIn) : null;
  for (const item of t.costItems) {
    const rate = item.basis === 'percent' ? item.amount : item.amount * factor;
    if (millDepthIn !== null && isMillingItem(t, item) && millDepthIn !== t.millDepthIn) {
      lines.push({
        label: item.label.replace(/\d+(\.\d+)?\s*in\b/, `${fmtIn(millDepthIn)} in`),
        basis: item.basis,
        rate: (rate * millDepthIn) / t.millDepthIn,
        note: `milling follows the lift: priced in proportion to depth from $${rate.toFixed(2)}/SY at ${fmtIn(t.millDepthIn)} in`,
      });
    } else lines.push({ label: item.label, basis: item.basis, rate });
  }
  if (econ.trafficControlPerDay > 0) {
    lines.push({
      label: `Traffic control, $${econ.trafficControlPerDay}/day at ${t.productionSyPerDay.toLocaleString('en-US')} SY/day`,
      basis: 'per_sy',
      rate: econ.trafficControlPerDay / t.productionSyPerDay,
    });
  }
  if (econ.mobilizationPerJob > 0)
    lines.push({ label: 'Mobilisation', basis: 'per_job', rate: econ.mobilizationPerJob });
  if (econ.engineeringFraction > 0)
    lines.push({ label: 'Engineering', basis: 'percent', rate: econ.engineeringFraction });
  if (econ.contingencyFraction > 0)
    lines.push({ label: 'Contingency', basis: 'percent', rate: econ.contingencyFraction });
  const sum = (b: RateLine['basis']) => lines.filter((l) => l.basis === b).reduce((s, l) => s + l.rate, 0);
  let serviceLifeYears: number;
  let lifeSource: ResolvedTreatment['lifeSource'];
  if (step.serviceLifeYears) {
    serviceLifeYears = step.serviceLifeYears;
    lifeSource = 'entered';
  } else if (t.lifeYears !== null) {
    serviceLifeYears = t.lifeYears;
    lifeSource = 'treatment';
  } else {
    serviceLifeYears = mix && thicknessIn ? lifeAtThickness(mix, thicknessIn) : 1;
    lifeSource = 'mix-and-lift';
  }
  const label = mix && thicknessIn ? overlayLabel(t, mix, thicknessIn, millDepthIn ?? 0) : t.name;
  return {
    label,
    rates: {
      perSy: sum('per_sy'),
      perLaneMile: sum('per_lane_mile'),
      perJob: sum('per_job'),
      addOnFraction: sum('percent'),
    },
    lines,
    tonsPerSy,
    thicknessIn,
    millDepthIn,
    serviceLifeYears,
    lifeSource,
    mix,
  };
}

/** Cost lines of one application on a group: quantity × rate, then the add-ons. */
export function costLines(r: ResolvedTreatment, q: { areaSy: number; laneMiles: number }) {
  const qty = (b: RateLine['basis']) => (b === 'per_sy' ? q.areaSy : b === 'per_lane_mile' ? q.laneMiles : 1);
  const unit = (b: RateLine['basis']) => (b === 'per_sy' ? 'SY' : b === 'per_lane_mile' ? 'lane-mi' : 'job');
  const base = r.lines
    .filter((l) => l.basis !== 'percent')
    .map((l) => ({
      label: l.label,
      quantity: qty(l.basis),
      unit: unit(l.basis),
      unitCost: l.rate,
      amount: qty(l.basis) * l.rate,
      note: l.note,
    }));
  const subtotal = base.reduce((s, l) => s + l.amount, 0);
  const addOns = r.lines
    .filter((l) => l.basis === 'percent')
    .map((l) => ({
      label: `${l.label} (${(l.rate * 100).toFixed(1)} %)`,
      quantity: subtotal,
      unit: '$',
      unitCost: l.rate,
      amount: subtotal * l.rate,
      note: undefined as string | undefined,
    }));
  const total = subtotal + addOns.reduce((s, l) => s + l.amount, 0);
  return { lines: [...base, ...addOns], subtotal, total, tons: r.tonsPerSy * q.areaSy };
}
