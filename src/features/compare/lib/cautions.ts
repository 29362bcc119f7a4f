// Cautions grouped by kind, each message once, with the alternatives (and the
// mixes or treatments) it concerns.

export type CautionLike = {
  kind: string;
  alternative: string;
  alternativeIndex?: number;
  subject?: string;
  message: string;
};

export const CAUTION_KINDS: { kind: string; title: string; tag: string }[] = [
  { kind: 'service', title: 'Not the same service', tag: 'not the same service' },
  { kind: 'structural', title: 'Structure of the road', tag: 'structure' },
  { kind: 'applicability', title: 'Outside the catalog’s rules', tag: 'outside the rules' },
  { kind: 'life-assumption', title: 'Assumed lives', tag: 'assumed life' },
  { kind: 'cold-weather', title: 'Cold-weather paving', tag: 'cold weather' },
];

export type CautionGroup = {
  kind: string;
  title: string;
  items: { message: string; alternatives: number[]; subjects: string[] }[];
};

const indexOf = (c: CautionLike, names: string[]) => c.alternativeIndex ?? names.indexOf(c.alternative);

export function groupCautions(cautions: CautionLike[], names: string[]): CautionGroup[] {
  return CAUTION_KINDS.map(({ kind, title }) => {
    const items: CautionGroup['items'] = [];
    for (const c of cautions.filter((x) => x.kind === kind)) {
      let item = items.find((i) => i.message === c.message);
      if (!item) {
        item = { message: c.message, alternatives: [], subjects: [] };
        items.push(item);
      }
      const i = indexOf(c, names);
      if (i >= 0 && !item.alternatives.includes(i)) item.alternatives.push(i);
      if (c.subject && !item.subjects.includes(c.subject)) item.subjects.push(c.subject);
    }
    return { kind, title, items };
  }).filter((g) => g.items.length > 0);
}

/** The kinds of caution that concern one alternative, for the tags beside its name. */
export function kindsFor(cautions: CautionLike[], names: string[], alt: number) {
  const kinds = new Set(cautions.filter((c) => indexOf(c, names) === alt).map((c) => c.kind));
  return CAUTION_KINDS.filter((k) => kinds.has(k.kind));
}
