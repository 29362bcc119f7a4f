// The comparison as a whole: the answer sentence and its decomposition, equal
// service by the catalog's PCI ranges, milling that follows the lift, the lane
// width behind "per lane-mile", and cautions grouped by what they concern.
import { describe, expect, it } from 'vitest';
import { answerFor } from '../../shared/engine/lcca/answer';
import { runComparison } from '../../shared/engine/lcca/comparison';
import { alt, oneMile, comparisonInput } from './lcca-fixture';

const three = [
  alt('2 in dense-graded', { treatmentId: 'mill_and_overlay' }),
  alt('1.5 in rubber-modified', { treatmentId: 'mill_and_overlay', mixId: 'rubber', thicknessIn: 1.5 }),
  alt('Chip seal cycle', { treatmentId: 'chip_seal' }),
];
const atPci = (pci: number) => ({ ...oneMile, segments: oneMile.segments.map((s) => ({ ...s, pci })) });

describe('the answer first', () => {
  it('names the winner, the margin over the period against the runner-up, and the part of the difference that decides it', () => {
    const r = runComparison(comparisonInput(three.slice(0, 2)), { monteCarlo: false });
    const a = r.answer;
    const [w, ru] = [r.alternatives[a.winner!], r.alternatives[a.runnerUp!]];
    expect(a.margin).toBeCloseTo(ru.presentValue - w.presentValue, 6);
    // First cost + later work − remaining-life credit add up to the whole difference (NPV = PV costs − PV RSL).
    expect(a.parts.reduce((s, p) => s + p.amount, 0)).toBeCloseTo(a.margin, 6);
    expect(a.sentence).toMatch(
      new RegExp(
        `^${w.name} wins by \\$[\\d,]+ over 40 years against ${ru.name} \\(present value at 4 % real\\) because `,
      ),
    );
    expect(a.sentence).toContain(`$${Math.round(a.margin).toLocaleString('en-US')}`);
  });

  it('leaves out an alternative that cannot give the same service: a chip seal on roads at PCI 42 (catalog range 50–85)', () => {
    const r = runComparison(comparisonInput(three, { group: atPci(42) }), { monteCarlo: false });
    const chip = 2;
    expect(r.alternatives[chip].service).toMatchObject({ equal: false, pciMin: 50, pciMax: 85, groupPci: 42 });
    expect(r.alternatives[0].service.equal).toBe(true);
    expect(r.ranking[0]).toBe(chip); // cheapest on paper …
    expect(r.answer.winner).not.toBe(chip); // … but not the answer
    expect(r.answer.leftOut).toEqual([chip]);
    expect(r.answer.sentence).toMatch(
      /Chip seal cycle would cost \$[\d,]+ less, but Chip seal is for roads at PCI 50–85/,
    );
    const service = r.cautions.filter((c) => c.kind === 'service');
    expect(service).toHaveLength(1);
    expect(service[0]).toMatchObject({ alternativeIndex: chip, alternative: 'Chip seal cycle' });
  });

  it('nor does a treatment the catalog does not give to the class of most of the roads (chip seal on arterials)', () => {
    const group = {
      ...oneMile,
      segments: oneMile.segments.map((s) => ({ ...s, pci: 60, functionalClass: 'minor_arterial' as const })),
    };
    const r = runComparison(comparisonInput(three, { group }), { monteCarlo: false });
    expect(r.alternatives[2].service).toMatchObject({ equal: false, reason: 'class', outsideClassShare: 1 });
    expect(r.answer.winner).not.toBe(2);
    expect(r.cautions.find((c) => c.kind === 'service')?.message).toMatch(
      /does not give Chip seal to the functional class of 100 %/,
    );
  });

  it('the chance of being cheapest is counted among the alternatives that give the same service', () => {
    const r = runComparison(
      comparisonInput(three, { group: atPci(42), risk: { iterations: 400, seed: 3, ranges: {} } }),
    );
    const among = r.monteCarlo!.probabilityCheapestAmong!;
    expect(among[2]).toBe(0);
    expect(among.reduce((s, p) => s + p, 0)).toBeCloseTo(1, 12);
    const p = Math.round(among[r.answer.winner!] * 100);
    expect(r.answer.sentence).toContain(
      `cheapest of those that give the same service in ${p} % of 400 simulated futures`,
    );
  });

  it('the group PCI is weighted by centreline length', () => {
    const group = {
      ...oneMile,
      segments: [
        { ...oneMile.segments[0], segmentId: 'a', pci: 40, lengthMi: 3 },
        { ...oneMile.segments[0], segmentId: 'b', pci: 80, lengthMi: 1 },
      ],
    };
    const r = runComparison(comparisonInput(three, { group }), { monteCarlo: false });
    expect(r.group.pci).toBeCloseTo((40 * 3 + 80 * 1) / 4, 12);
  });

  it('works on a saved result from before equal service was recorded (no service field)', () => {
    const r = runComparison(comparisonInput(three.slice(0, 2)), { monteCarlo: false });
    const old = { ...r, alternatives: r.alternatives.map(({ service: _s, ...a }) => a) };
    expect(answerFor(old).winner).toBe(r.answer.winner);
  });
});

describe('quantities and prices behind the figures', () => {
  it('milling depth follows the lift: 1.5 in laid on a 2-in mill-and-overlay mills 1.5 in, priced by depth', () => {
    const r = runComparison(comparisonInput(three.slice(0, 2)), { monteCarlo: false });
    const thin = r.alternatives[1].initial;
    expect(thin.millDepthIn).toBe(1.5);
    expect(thin.label).toBe('Mill and overlay — Rubber-modified, dry process, 1.5 in, 1.5 in milled');
    const mill = thin.costLines.lines.find((l) => /milling/i.test(l.label))!;
    expect(mill.label).toBe('Milling 1.5 in');
    // Demo price $2.40/SY at 2 in, in proportion to depth (a planning rule): $1.80/SY at 1.5 in.
    expect(mill.unitCost).toBeCloseTo(1.8, 12);
    const full = r.alternatives[0].initial;
    expect(full.millDepthIn).toBe(2);
    expect(full.costLines.lines.find((l) => /milling/i.test(l.label))!.unitCost).toBeCloseTo(2.4, 12);
  });

  it('states the lane width behind "per lane-mile": SY × 9 / (lane-miles × 5,280)', () => {
    const r = runComparison(comparisonInput(three.slice(0, 2)), { monteCarlo: false });
    // 1 mi × 24 ft = 14,080 SY on 2 lane-miles → 12-ft lanes (7,040 SY per lane-mile, common practice anchor).
    expect(r.group.laneWidthFt).toBeCloseTo(12, 12);
    const v = r.vsBaseline[1];
    expect(v.firstCostSavingsPerLaneMile).toBeCloseTo(v.firstCostSavings / 2, 9);
    // Mix saved: 2 in × 110 − 1.5 in × 108 lb/SY-in over 14,080 SY, in US tons.
    expect(v.tonsSaved).toBeCloseTo((14_080 * (2 * 110 - 1.5 * 108)) / 2000, 9);
    expect(r.alternatives[1].firstCostPerTon).toBeCloseTo(
      r.alternatives[1].firstCost / r.alternatives[1].initialTons,
      9,
    );
  });

  it('cautions name the alternative they concern; one cold-weather note shared by two mixes stays one message', () => {
    const r = runComparison(comparisonInput(three), { monteCarlo: false });
    const cold = r.cautions.filter((c) => c.kind === 'cold-weather');
    expect(cold.map((c) => c.alternativeIndex)).toEqual([0, 1]);
    expect(cold.map((c) => c.subject)).toEqual(['Dense-graded 12.5 mm', 'Rubber-modified, dry process']);
    expect(new Set(cold.map((c) => c.message)).size).toBe(1);
  });
});
