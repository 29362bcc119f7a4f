// Tornado rows for one alternative: full labels, the range each input was moved
// over, and the inputs that do not change this alternative left out.

type Row = { key: string; label: string; low: number; high: number; npvAtLow: number[]; npvAtHigh: number[] };

const years = (v: number) => `${Number(v.toFixed(2))} yr`;
const pct = (v: number) => `${Number((v * 100).toFixed(2))} %`;
const dollars = (v: number) => `$${Number(v.toFixed(2)).toLocaleString('en-US')}`;
const factor = (v: number) => `×${Number(v.toFixed(2))}`;

export function rangeText(key: string, low: number, high: number) {
  const f = key === 'rate' ? pct : key.startsWith('mix:') ? dollars : key.startsWith('treatment:') ? factor : years;
  return `${f(low)} – ${f(high)}`;
}

/** Swings below half a dollar are no effect (the other alternatives' lives and prices). */
const NO_EFFECT = 0.5;

export function tornadoRows(rows: Row[], alt: number, altNames: string[]) {
  const shown = rows
    .filter((r) => Math.abs(r.npvAtHigh[alt] - r.npvAtLow[alt]) >= NO_EFFECT)
    .sort((a, b) => Math.abs(b.npvAtHigh[alt] - b.npvAtLow[alt]) - Math.abs(a.npvAtHigh[alt] - a.npvAtLow[alt]))
    .map((r) => {
      const own = `${altNames[alt]}: `;
      const label = r.key.startsWith(`alt:${alt}:`) && r.label.startsWith(own) ? r.label.slice(own.length) : r.label;
      return {
        key: r.key,
        label: label.charAt(0).toUpperCase() + label.slice(1),
        range: rangeText(r.key, r.low, r.high),
        atLow: r.npvAtLow[alt],
        atHigh: r.npvAtHigh[alt],
      };
    });
  return { shown, hidden: rows.length - shown.length };
}
