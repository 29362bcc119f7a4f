// The answer of a comparison in one sentence, first: which alternative wins,
// by how much over the period, and why (the part of the difference that
// decides it), among the alternatives that give the same service on these
// roads. Works on saved results of any age (fields added later are optional).
import type { ServiceCheck } from './comparison-cautions';

export type AnswerAlternative = {
  name: string;
  presentValue: number;
  presentValueOfCosts: number;
  presentValueOfRemainingLife: number;
  firstCost: number;
  initial: { serviceLifeYears: number };
  cashFlows: { kind?: string }[];
  service?: Omit<ServiceCheck, 'outsideClassShare'>;
};

export type AnswerInput = {
  analysisPeriodYears: number;
  discountRate: number;
  alternatives: AnswerAlternative[];
  ranking: number[];
  monteCarlo: { iterations: number; probabilityCheapest: number[]; probabilityCheapestAmong?: number[] } | null;
};

type Part = { key: 'first' | 'later' | 'credit' | 'user'; amount: number };

export type Answer = {
  /** The cheapest alternative that gives the same service; null when none does. */
  winner: number | null;
  runnerUp: number | null;
  /** Present value by which the winner beats the runner-up. */
  margin: number;
  /** The cheapest of all, equal service or not. */
  cheapest: number;
  /** Alternatives left out because they do not give the same service. */
  leftOut: number[];
  /** The runner-up's cost less the winner's, by part: first cost, later work, remaining-life credit, user costs. */
  parts: Part[];
  /** The answer itself: who wins, by how much, why. */
  headline: string;
  /** What follows it: how sure, and what was left out and why. */
  details: string[];
  /** headline and details in one paragraph. */
  sentence: string;
};

const money = (v: number) => `$${Math.round(Math.abs(v)).toLocaleString('en-US')}`;
const years = (v: number) => Number(v.toFixed(2)).toLocaleString('en-US');
const treatments = (a: AnswerAlternative) => a.cashFlows.filter((c) => c.kind !== 'maintenance').length;

function phrase(part: Part, w: AnswerAlternative, r: AnswerAlternative, n: number, favour: boolean) {
  const d = money(part.amount);
  switch (part.key) {
    case 'first':
      return favour ? `it costs ${d} less to put down` : `its ${d} higher first cost`;
    case 'later': {
      const kw = treatments(w);
      const kr = treatments(r);
      if (favour && kw < kr)
        return `its ${years(w.initial.serviceLifeYears)}-year life needs ${kw} treatment${kw === 1 ? '' : 's'} in ${n} years, not ${kr}`;
      return favour
        ? `its later work costs ${d} less in present value`
        : `the ${d} more its later work costs in present value`;
    }
    case 'credit':
      return favour ? `it leaves ${d} more life at year ${n}` : `the ${d} less life it leaves at year ${n}`;
    case 'user':
      return favour ? `its work zones cost road users ${d} less` : `the ${d} more its work zones cost road users`;
  }
}

export function answerFor(r: AnswerInput): Answer {
  const n = r.analysisPeriodYears;
  const alts = r.alternatives;
  const cheapest = r.ranking[0];
  const equal = r.ranking.filter((i) => alts[i].service?.equal !== false);
  const leftOut = r.ranking.filter((i) => alts[i].service?.equal === false);
  const winner = equal[0] ?? null;
  const runnerUp = equal[1] ?? null;
  const rate = `${Number((r.discountRate * 100).toFixed(2))} %`;
  const pciOf = alts.find((a) => a.service?.groupPci != null)?.service?.groupPci;
  const pci = pciOf == null ? null : Math.round(pciOf);
  let sentence: string;
  const details: string[] = [];
  let parts: Part[] = [];
  let margin = 0;

  const these = pci === null ? 'these roads' : `these roads (PCI ${pci})`;
  if (winner === null) {
    const c = alts[cheapest];
    sentence = `None of the alternatives is one the catalog gives to ${these}; of them, ${c.name} costs least, ${money(c.presentValue)} in present value over ${n} years at ${rate} (real). Choose a treatment meant for roads like these.`;
  } else if (runnerUp === null) {
    const w = alts[winner];
    sentence = `${w.name} is the only alternative the catalog gives to ${these}: ${money(w.presentValue)} in present value over ${n} years at ${rate} (real).`;
  } else {
    const w = alts[winner];
    const ru = alts[runnerUp];
    margin = ru.presentValue - w.presentValue;
    const later = (a: AnswerAlternative) => a.presentValueOfCosts - a.firstCost;
    parts = [
      { key: 'first', amount: ru.firstCost - w.firstCost },
      { key: 'later', amount: later(ru) - later(w) },
      { key: 'credit', amount: w.presentValueOfRemainingLife - ru.presentValueOfRemainingLife },
    ];
    const user = margin - parts.reduce((s, p) => s + p.amount, 0);
    if (Math.abs(user) > 1e-6 * Math.max(1, Math.abs(margin))) parts.push({ key: 'user', amount: user });
    const pro = parts.filter((p) => p.amount > 0).sort((a, b) => b.amount - a.amount);
    const con = parts.filter((p) => p.amount < 0).sort((a, b) => a.amount - b.amount);
    let because: string;
    if (pro.length === 0) because = 'the two cost the same';
    else {
      because = phrase(pro[0], w, ru, n, true);
      if (pro[1] && pro[1].amount >= 0.25 * margin) because += ` and ${phrase(pro[1], w, ru, n, true)}`;
      else if (con.length && -con[0].amount >= 0.05 * margin)
        because += `, which outweighs ${phrase({ ...con[0], amount: -con[0].amount }, w, ru, n, false)}`;
    }
    const narrow = w.presentValue > 0 && margin / w.presentValue < 0.02;
    sentence = `${w.name} wins${narrow ? ' narrowly' : ''} by ${money(margin)} over ${n} years against ${ru.name} (present value at ${rate} real) because ${because}.`;
    const mc = r.monteCarlo;
    const prob = leftOut.length ? mc?.probabilityCheapestAmong : mc?.probabilityCheapest;
    if (mc && prob) {
      const p = Math.round(prob[winner] * 100);
      details.push(
        `It is the cheapest${leftOut.length ? ' of those that give the same service' : ''} in ${p} % of ${mc.iterations.toLocaleString('en-US')} simulated futures.`,
      );
    }
  }
  for (const i of leftOut) {
    if (winner === null) break;
    const a = alts[i];
    if (a.presentValue >= alts[winner].presentValue) continue;
    const sv = a.service!;
    const rule =
      sv.reason === 'class'
        ? `the catalog does not give ${sv.treatment} to roads of this class`
        : `${sv.treatment} is for roads at PCI ${sv.pciMin}–${sv.pciMax}`;
    details.push(
      `${a.name} would cost ${money(alts[winner].presentValue - a.presentValue)} less, but ${rule}, so it does not give the same service here.`,
    );
  }
  const headline = sentence;
  return {
    winner,
    runnerUp,
    margin,
    cheapest,
    leftOut,
    parts,
    headline,
    details,
    sentence: [headline, ...details].join(' '),
  };
}
