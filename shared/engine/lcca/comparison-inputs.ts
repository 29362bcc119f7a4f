// The uncertain inputs of a comparison (rate, prices, lives) with their ranges,
// and the model that maps their values to each alternative's net present value.
import type { Step, ComparisonInput } from '../../schemas/comparisons';
import type { PriceOverrides } from './costing';
import { evaluateScheduleForGroup } from './network';
import type { ModelInput } from './risk';
import { buildSchedule, lookup, resolveStep, ComparisonInputError } from './schedule-input';

/** The uncertain inputs: rate, each mix price, each treatment's other prices, each life. */
export function comparisonInputs(input: ComparisonInput): ModelInput[] {
  const look = lookup(input);
  const out: ModelInput[] = [];
  const r = input.economics.discountRate;
  out.push({ key: 'rate', label: 'Discount rate', base: r, low: Math.max(0, r - 0.02), high: r + 0.02 });
  const mixes = new Set<string>();
  const treatments = new Set<string>();
  input.alternatives.forEach((a, i) => {
    const steps = [a.initial, ...a.rehabilitation];
    for (const s of [...steps, ...a.maintenance.map((m) => ({ treatmentId: m.treatmentId }))]) {
      const t = look.treatment(s.treatmentId);
      if (!t) continue;
      treatments.add(t.id);
      const mixId = (s as Step).mixId ?? t.mixId;
      if (mixId && look.mix(mixId)) mixes.add(mixId);
    }
    steps.forEach((s, j) => {
      const res = resolveStep(
        s,
        `alternatives.${i}.${j === 0 ? 'initial' : `rehabilitation.${j - 1}`}`,
        input,
        look,
        {},
      );
      out.push({
        key: `alt:${i}:life:${j}`,
        label: `${a.name}: life of ${res.label}`,
        base: res.serviceLifeYears,
        low: res.serviceLifeYears * 0.75,
        high: res.serviceLifeYears * 1.25,
      });
    });
  });
  for (const id of mixes) {
    const m = look.mix(id)!;
    out.push({
      key: `mix:${id}`,
      label: `${m.name} price ($/ton)`,
      base: m.pricePerTon,
      low: m.pricePerTon * 0.85,
      high: m.pricePerTon * 1.25,
    });
  }
  for (const id of treatments) {
    const t = look.treatment(id)!;
    if (t.costItems.some((c) => c.basis !== 'percent' && c.amount > 0))
      out.push({ key: `treatment:${id}`, label: `${t.name} unit prices (factor)`, base: 1, low: 0.85, high: 1.25 });
  }
  checkRanges(input, out);
  for (const inp of out) {
    const o = input.risk.ranges[inp.key];
    if (o) {
      inp.low = o.low;
      inp.high = o.high;
    }
    const kind = o?.distribution ?? 'triangular';
    inp.distribution =
      kind === 'fixed'
        ? { type: 'fixed', value: inp.base }
        : kind === 'uniform'
          ? { type: 'uniform', min: inp.low, max: inp.high }
          : { type: 'triangular', min: inp.low, mode: inp.base, max: inp.high };
  }
  return out;
}

const fmtValue = (key: string, v: number) =>
  key === 'rate' ? `${Number((v * 100).toFixed(4))} %` : Number(v.toFixed(4)).toLocaleString('en-US');

/**
 * A range the user gives must be a distribution around the value the study
 * uses: low ≤ base ≤ high (a triangular distribution needs min ≤ mode ≤ max,
 * and a tornado row whose range leaves out the base case reads wrong), inside
 * what the quantity can be. The base is never moved to fit a range.
 */
function checkRanges(input: ComparisonInput, inputs: ModelInput[]) {
  const byKey = new Map(inputs.map((i) => [i.key, i]));
  for (const [key, o] of Object.entries(input.risk.ranges)) {
    const path = `risk.ranges.${key}`;
    const inp = byKey.get(key);
    if (!inp)
      throw new ComparisonInputError(
        path,
        `is not an uncertain input of this comparison (it has: ${inputs.map((i) => i.key).join(', ')})`,
      );
    if (!Number.isFinite(o.low) || !Number.isFinite(o.high))
      throw new ComparisonInputError(path, 'needs a low and a high value');
    if (o.low > o.high)
      throw new ComparisonInputError(
        `${path}.low`,
        `low ${fmtValue(key, o.low)} is above high ${fmtValue(key, o.high)} for ${inp.label}`,
      );
    if (o.low > inp.base)
      throw new ComparisonInputError(
        `${path}.low`,
        `low ${fmtValue(key, o.low)} is above the value the comparison uses, ${fmtValue(key, inp.base)}, for ${inp.label}; the range must contain it`,
      );
    if (o.high < inp.base)
      throw new ComparisonInputError(
        `${path}.high`,
        `high ${fmtValue(key, o.high)} is below the value the comparison uses, ${fmtValue(key, inp.base)}, for ${inp.label}; the range must contain it`,
      );
    if (key === 'rate' ? o.low <= -1 : key.includes(':life:') ? o.low <= 0 : o.low < 0)
      throw new ComparisonInputError(
        `${path}.low`,
        key === 'rate'
          ? 'a discount rate must be more than −100 %'
          : key.includes(':life:')
            ? 'a service life must be more than 0 years'
            : 'a price cannot be negative',
      );
  }
}

function overridesFrom(values: Record<string, number>): PriceOverrides {
  const over: PriceOverrides = { mixPricePerTon: {}, treatmentFactor: {} };
  for (const [k, v] of Object.entries(values)) {
    if (k.startsWith('mix:')) over.mixPricePerTon![k.slice(4)] = v;
    else if (k.startsWith('treatment:')) over.treatmentFactor![k.slice(10)] = v;
  }
  return over;
}

export function comparisonModel(input: ComparisonInput) {
  const look = lookup(input);
  const q = { areaSy: input.group.areaSy, laneMiles: input.group.laneMiles };
  return (values: Record<string, number>) => {
    const over = overridesFrom(values);
    return input.alternatives.map(
      (a, i) =>
        evaluateScheduleForGroup(
          buildSchedule(a, i, input, look, over, values).plan,
          q,
          values.rate,
          input.economics.analysisPeriodYears,
        ).result.presentValue,
    );
  };
}
