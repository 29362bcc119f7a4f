// What a comparison must say beside its numbers: whether each alternative
// gives the same service on these roads (the catalog's PCI range against the
// group's PCI), thin lifts on weak busy roads, treatments outside the catalog's
// rules, cold-weather notes of the mixes used, and lives that are assumptions.
import type { Mix } from '../../schemas/catalog';
import { OVERLAY_KINDS } from '../../schemas/catalog';
import type { Group, ComparisonInput } from '../../schemas/comparisons';
import { checkOverlay } from '../structural';
import type { Lookup } from './schedule-input';

export type CautionKind = 'service' | 'structural' | 'applicability' | 'cold-weather' | 'life-assumption';

export type ComparisonCaution = {
  kind: CautionKind;
  /** The alternative it concerns, by name and by position in the input. */
  alternative: string;
  alternativeIndex: number;
  /** What it is about (a mix, a treatment), so one note shared by several alternatives can be shown once. */
  subject?: string;
  message: string;
};

export type ServiceCheck = {
  /**
   * False when the group's PCI is outside the PCI range the catalog gives the
   * initial treatment, or when the catalog does not give it to the functional
   * class of most of the group's length.
   */
  equal: boolean;
  groupPci: number | null;
  pciMin: number;
  pciMax: number;
  treatment: string;
  /** Why not, in words, when not equal. */
  reason?: 'pci' | 'class';
  /** Share of the group's length whose functional class the treatment is not given to. */
  outsideClassShare?: number;
};

export const fmtYears = (v: number) => Number(v.toFixed(2)).toLocaleString('en-US');

/** The group's PCI: weighted by centreline length where segment lengths are known, else a plain mean. */
export function groupPci(group: Group): number | null {
  let w = 0;
  let s = 0;
  for (const seg of group.segments) {
    if (seg.pci === null) continue;
    const len = seg.lengthMi ?? 1;
    w += len;
    s += len * seg.pci;
  }
  return w > 0 ? s / w : null;
}

/** Equal service: the initial treatment is one the catalog gives to roads in this condition. */
export function serviceChecks(input: ComparisonInput, look: Lookup): ServiceCheck[] {
  const pci = groupPci(input.group);
  const length = input.group.segments.reduce((s, x) => s + (x.lengthMi ?? 1), 0);
  return input.alternatives.map((a) => {
    const t = look.treatment(a.initial.treatmentId)!;
    const { pciMin, pciMax } = t.applicability;
    const pciOk = pci === null || (Math.round(pci) >= pciMin && Math.round(pci) <= pciMax);
    const outside = input.group.segments
      .filter((x) => !t.applicability.classes.includes(x.functionalClass as never))
      .reduce((s, x) => s + (x.lengthMi ?? 1), 0);
    const outsideClassShare = length > 0 ? outside / length : 0;
    const equal = pciOk && outsideClassShare <= 0.5;
    const reason = !pciOk ? ('pci' as const) : !equal ? ('class' as const) : undefined;
    return { equal, groupPci: pci, pciMin, pciMax, treatment: t.name, reason, outsideClassShare };
  });
}

type AltView = {
  name: string;
  initial: { label: string; thicknessIn: number | null; serviceLifeYears: number; lifeSource: string };
  rehabilitation: unknown[];
};

export function comparisonCautions(
  input: ComparisonInput,
  look: Lookup,
  alternatives: AltView[],
  service: ServiceCheck[],
): ComparisonCaution[] {
  const cautions: ComparisonCaution[] = [];
  const n = input.group.segments.length;
  const anyEqual = service.some((s) => s.equal);
  input.alternatives.forEach((a, i) => {
    const alt = alternatives[i];
    const base = { alternative: a.name, alternativeIndex: i };
    const t = look.treatment(a.initial.treatmentId)!;
    const sv = service[i];
    if (!sv.equal) {
      const why =
        sv.reason === 'pci'
          ? `${t.name} is for roads at PCI ${sv.pciMin}–${sv.pciMax} by the catalog's rules, and these roads average PCI ${Math.round(sv.groupPci ?? 0)}`
          : `The catalog does not give ${t.name} to the functional class of ${Math.round((sv.outsideClassShare ?? 0) * 100)} % of these roads' length`;
      cautions.push({
        ...base,
        kind: 'service',
        subject: t.name,
        message: `${why}: it does not give the same service as an alternative that suits them${anyEqual ? ', so it is left out of the answer' : ''}. A cheap cycle that cannot repair the road only looks cheaper.`,
      });
    }
    if ((OVERLAY_KINDS as readonly string[]).includes(t.kind) && alt.initial.thicknessIn) {
      const flagged = input.group.segments
        .map((s) => ({
          s,
          c: checkOverlay(s, { thicknessIn: alt.initial.thicknessIn!, serviceLifeYears: alt.initial.serviceLifeYears }),
        }))
        .filter((x) => x.c.caution);
      if (flagged.length) {
        const worst = flagged.sort((x, y) => y.c.shortBy - x.c.shortBy)[0];
        cautions.push({
          ...base,
          kind: 'structural',
          message: `${flagged.length} of ${n} segment${n === 1 ? '' : 's'} may be structurally short for a ${alt.initial.thicknessIn}-in lift (worst ${worst.s.segmentId}: estimated SN ${worst.c.snWithOverlay.toFixed(2)} against ${worst.c.requiredSn.toFixed(2)} asked by the AASHTO 1993 equation for ${Math.round(worst.c.designEsals).toLocaleString('en-US')} ESALs). A planning flag from assumed layer values, not a design: confirm with cores, deflection testing and a pavement design.`,
        });
      }
    }
    const outside = input.group.segments.filter(
      (s) =>
        !t.applicability.classes.includes(s.functionalClass as never) ||
        (s.pci !== null && (s.pci < t.applicability.pciMin || s.pci > t.applicability.pciMax)),
    );
    if (outside.length) {
      cautions.push({
        ...base,
        kind: 'applicability',
        subject: t.name,
        message: `${t.name} is outside the catalog's rules (PCI ${t.applicability.pciMin}–${t.applicability.pciMax}; ${t.applicability.classes.length} functional classes) for ${outside.length} of ${n} segment${n === 1 ? '' : 's'}, e.g. ${outside[0].segmentId}.`,
      });
    }
    const steps = [a.initial, ...a.rehabilitation];
    const mixes = steps.map((s) => look.mix(s.mixId ?? look.treatment(s.treatmentId)?.mixId ?? ''));
    for (const m of new Set(mixes.filter((x): x is Mix => !!x))) {
      if (m.coldWeatherNote)
        cautions.push({ ...base, kind: 'cold-weather', subject: m.name, message: m.coldWeatherNote });
    }
    if (
      alt.initial.lifeSource === 'mix-and-lift' &&
      alt.initial.thicknessIn !== look.mix(a.initial.mixId ?? t.mixId ?? '')?.refLiftIn
    ) {
      cautions.push({
        ...base,
        kind: 'life-assumption',
        message: `The ${fmtYears(alt.initial.serviceLifeYears)}-year life of ${alt.initial.label} is scaled from the mix's reference lift in proportion to thickness (an assumption); enter the agency's own life if it has one.`,
      });
    }
  });
  return cautions;
}
