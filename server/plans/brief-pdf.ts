// The council brief as a PDF (pdfkit): pages a council member can read on paper.
// Headings are also bookmarks, so a reader (and a test) can find them. Everything,
// the map included, is drawn with pdfkit's own paths and text: no tiles, no images.
// Lato's Latin subset has no arrows, so the text says "to" where a screen shows "→".
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { BAND_MAPPING_NOTE, CONDITION_BANDS } from '../../shared/condition';
import { BRIEF_CAUTIONS, briefMethod, briefSummary } from '../../shared/engine/plan/brief-text';
import type { PlanResult } from '../../shared/engine/plan/run-plan';
import { type AnyPlanResult, headline } from '../../shared/plan-headline';
import type { BudgetChoice } from './brief-choices';

const require = createRequire(import.meta.url);
const LATO = require.resolve('@fontsource/lato/files/lato-latin-400-normal.woff');
const LATO_BOLD = require.resolve('@fontsource/lato/files/lato-latin-700-normal.woff');

const INK = '#1f2328';
const MUTED = '#5b6068';
const GRID = '#d9d4c7';
const TEAL = '#0f766e';
const FAILED = '#7f1d1d';
/** Treatment-year colours on the map: far apart in hue and lightness, so neighbours read apart. */
const YEAR_COLORS = ['#0f766e', '#d97706', '#2563eb', '#a21caf', '#be123c', '#4d7c0f'];
const NO_WORK = '#c9c3b4';

const moneyFull = (v: number) =>
  Math.abs(v) >= 1e6 ? `$${(v / 1e6).toFixed(2)}M` : `$${Math.round(v).toLocaleString('en-US')}`;
const int = (v: number) => Math.round(v).toLocaleString('en-US');
/** Axis values: $0, $50k, $1.5M, $300M — short, since they sit in a narrow margin. */
const moneyTick = (v: number) =>
  v === 0
    ? '$0'
    : Math.abs(v) >= 1e6
      ? `$${Number((v / 1e6).toPrecision(3))}M`
      : Math.abs(v) >= 1e3
        ? `$${Number((v / 1e3).toPrecision(3))}k`
        : `$${Math.round(v)}`;

type Geometry = { type: string; coordinates: number[][] | number[][][] };
type SegmentFacts = { fromDesc: string | null; toDesc: string | null; functionalClass: string; roadName: string };

/** What PCI means on the ground, in one sentence. */
export const PCI_ON_THE_GROUND =
  'PCI (Pavement Condition Index, 0 to 100) is a survey score of the cracks, ruts and patches seen on the road: above 85 a road rides smooth with little cracking, near 55 it shows wide cracks and patches and rides rough, and at 25 or below it has broken up and needs rebuilding, not resurfacing.';

// The schemas bound every name at the input (agency and plan names 120 characters, road
// names 120, segment ids 60); this is only the last guard, since laying out a very long
// string froze pdfkit for seconds.
const clip = (s: string, max = 120) => (s.length > max ? `${s.slice(0, max - 1)}…` : s);

/** Round axis values from 0 to at least max: 4 to 6 steps of 1, 2 or 5 × 10^k. */
export function niceTicks(max: number, target = 4) {
  if (!(max > 0)) return [0, 1];
  const raw = max / target;
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * p).find((s) => s >= raw) ?? 10 * p;
  const out: number[] = [];
  for (let v = 0; v < max + step * 0.999; v += step) out.push(Number(v.toPrecision(12)));
  return out;
}

const MAIN_CLASSES = new Set(['interstate', 'freeway', 'principal_arterial', 'minor_arterial', 'major_collector']);

export async function briefPdf(args: {
  plan: { name: string; status: string; settings: unknown; version?: number };
  result: PlanResult | AnyPlanResult;
  choices?: BudgetChoice[];
  geometries: Map<number, Geometry>;
  limits?: Map<number, SegmentFacts>;
  author: string;
  agencyName: string;
}) {
  const r = args.result as AnyPlanResult;
  const { geometries } = args;
  const limits = args.limits ?? new Map<number, SegmentFacts>();
  const choices = args.choices ?? [];
  const plan = { ...args.plan, name: clip(args.plan.name) };
  const author = clip(args.author);
  const agencyName = clip(args.agencyName);
  const h = headline(r);
  const doc = new PDFDocument({
    size: 'LETTER',
    margins: { top: 54, bottom: 54, left: 54, right: 54 },
    info: { Title: `${agencyName} — ${plan.name}`, Author: author, Creator: 'Wearcourse' },
  });
  doc.registerFont('body', LATO);
  doc.registerFont('bold', LATO_BOLD);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  const L = 54;
  const W = doc.page.width - 108;
  const bottomLimit = () => doc.page.height - 54;
  const heading = (text: string, room = 160) => {
    if (doc.y > doc.page.height - room) doc.addPage();
    doc.x = L;
    doc.moveDown(0.6).font('bold').fontSize(13).fillColor(INK).text(text, L, doc.y, { width: W });
    doc.outline.addItem(text);
    doc.moveDown(0.3).font('body').fontSize(10).fillColor(INK);
  };
  const note = (text: string, size = 9) => {
    doc.x = L;
    doc.font('body').fontSize(size).fillColor(MUTED).text(text, L, doc.y, { width: W });
  };
  const first = r.years[0];
  const last = r.years[r.years.length - 1];
  const years = r.years.map((y) => y.calendarYear);

  // ---- Page 1: what the plan does, in words and numbers --------------------------------
  doc.font('bold').fontSize(20).fillColor(INK).text(`${agencyName}: ${plan.name}`);
  doc
    .font('body')
    .fontSize(11)
    .fillColor(MUTED)
    .text(
      `Paving plan ${first.calendarYear}–${last.calendarYear} · ${plan.status === 'published' ? 'published' : 'draft'}${plan.version ? ` version ${plan.version}` : ''} · prepared ${new Date().toISOString().slice(0, 10)} by ${author} with Wearcourse`,
    );

  heading('Summary');
  doc.fontSize(11).text(briefSummary(r as PlanResult, agencyName), { width: W, lineGap: 2 });
  doc.moveDown(0.4);
  doc.font('bold').fontSize(10).fillColor(INK).text('What PCI means on the ground', { width: W });
  doc.font('body').fontSize(10).text(PCI_ON_THE_GROUND, { width: W, lineGap: 1.5 });

  heading('The plan in four numbers');
  {
    const boxes = [
      { t: 'Budget a year', v: moneyFull(h.budgetPerYear), s: `${moneyFull(h.totalBudget)} over ${h.years} years` },
      {
        t: 'Network PCI',
        v: `${h.startPci.toFixed(0)} to ${h.finalPci.toFixed(0)}`,
        s: `now to ${h.lastYear}; no work: ${h.finalPciDoNothing.toFixed(0)}`,
      },
      { t: 'Lane-miles treated', v: int(h.laneMilesTreated), s: `${int(h.jobs)} jobs` },
      {
        t: 'Failed lane-miles',
        v: `${int(h.failedStart)} to ${int(h.failedEnd)}`,
        s: `PCI 25 or less, now to ${h.lastYear}`,
        alert: true,
      },
    ];
    const top = doc.y;
    const bw = (W - 18) / 4;
    boxes.forEach((b, i) => {
      const x = L + i * (bw + 6);
      doc
        .roundedRect(x, top, bw, 62, 4)
        .lineWidth(b.alert ? 1.5 : 0.8)
        .strokeColor(b.alert ? FAILED : GRID)
        .stroke();
      doc
        .font('body')
        .fontSize(8)
        .fillColor(MUTED)
        .text(b.t, x + 6, top + 6, { width: bw - 12 });
      doc
        .font('bold')
        .fontSize(15)
        .fillColor(b.alert ? FAILED : INK)
        .text(b.v, x + 6, top + 19, { width: bw - 12, lineBreak: false });
      doc
        .font('body')
        .fontSize(7.5)
        .fillColor(MUTED)
        .text(b.s, x + 6, top + 42, { width: bw - 12 });
    });
    doc.y = top + 70;
    doc.x = L;
    const failedWord =
      h.failedEnd > h.failedStart + 0.5
        ? `Failed roads grow from ${int(h.failedStart)} to ${int(h.failedEnd)} lane-miles under this budget: those roads need rebuilding, which costs several times a resurfacing.`
        : `Failed roads go from ${int(h.failedStart)} to ${int(h.failedEnd)} lane-miles under this budget.`;
    doc.font('bold').fontSize(9.5).fillColor(FAILED).text(failedWord, L, doc.y, { width: W });
  }

  if (choices.length) {
    heading('Budget choices side by side', 200);
    const cols = [{ t: '', w: 130 }, ...choices.map(() => ({ t: '', w: (W - 130) / choices.length }))];
    const rows: [string, (c: BudgetChoice) => string][] = [
      ['Budget a year', (c) => moneyFull(c.budgetPerYear)],
      [`Network PCI in ${h.lastYear}`, (c) => c.finalPci.toFixed(0)],
      ['Lane-miles treated', (c) => int(c.laneMilesTreated)],
      [`Failed lane-miles in ${h.lastYear}`, (c) => int(c.failedEnd)],
      [`Backlog in ${h.lastYear}`, (c) => moneyFull(c.backlogEnd)],
    ];
    const line = (cells: string[], bold: boolean[], color = INK) => {
      const y = doc.y;
      let x = L;
      cells.forEach((v, i) => {
        doc
          .font(bold[i] ? 'bold' : 'body')
          .fontSize(9)
          .fillColor(i === 0 ? MUTED : color)
          .text(v, x, y, { width: cols[i].w - 6, align: i === 0 ? 'left' : 'right', lineBreak: false });
        x += cols[i].w;
      });
      doc.y = y + 14;
    };
    line(['', ...choices.map((c) => c.label)], [false, ...choices.map(() => true)]);
    doc
      .moveTo(L, doc.y - 2)
      .lineTo(L + W, doc.y - 2)
      .lineWidth(0.5)
      .strokeColor(GRID)
      .stroke();
    for (const [label, f] of rows) line([label, ...choices.map(f)], [false, ...choices.map((c) => c.thisPlan)]);
    doc.x = L;
    note(
      `Each column is this plan re-run on the same inventory, costs and rules with every year’s budget changed; the last column, when present, is the flat budget the budget search found.${r.method === 'exact' ? ' This plan was chosen by the exact method; the other columns by the fast method, which reports its gap to a bound.' : ''}`,
      8,
    );
  }

  // ---- Charts, each with its values on both axes ------------------------------------
  /** A chart box: y axis values from `ticks` (formatted), years along the bottom. */
  const chart = (
    h: number,
    ticks: number[],
    fmt: (v: number) => string,
    yTitle: string,
    draw: (x: (i: number) => number, y: (v: number) => number, band: number) => void,
  ) => {
    if (doc.y + h + 40 > bottomLimit()) doc.addPage();
    doc.font('body').fontSize(7.5);
    const labelW = Math.max(...ticks.map((t) => doc.widthOfString(fmt(t)))) + 8;
    const top = doc.y + 16;
    const left = L + labelW + 4;
    const right = L + W - 70;
    const n = r.years.length;
    const band = (right - left) / n;
    const x = (i: number) => left + band * (i + 0.5);
    const max = ticks[ticks.length - 1] || 1;
    const y = (v: number) => top + h - (h * Math.min(v, max)) / max;
    doc
      .font('body')
      .fontSize(7.5)
      .fillColor(MUTED)
      .text(yTitle, L, top - 16, { width: W });
    for (const t of ticks) {
      doc.moveTo(left, y(t)).lineTo(right, y(t)).lineWidth(0.3).strokeColor(GRID).stroke();
      doc
        .font('body')
        .fontSize(7.5)
        .fillColor(MUTED)
        .text(fmt(t), L, y(t) - 4, { width: labelW, align: 'right', lineBreak: false });
    }
    draw(x, y, band);
    const every = Math.max(1, Math.ceil(30 / band));
    r.years.forEach((yr, i) => {
      if (i % every !== 0 && i !== n - 1) return;
      doc
        .font('body')
        .fontSize(7.5)
        .fillColor(MUTED)
        .text(String(yr.calendarYear), x(i) - 14, top + h + 4, { width: 28, align: 'center', lineBreak: false });
    });
    doc.y = top + h + 18;
    doc.x = L;
  };

  heading('Network condition', 260);
  chart(
    150,
    [0, 20, 40, 60, 80, 100],
    (v) => String(v),
    'Network PCI (0–100)',
    (x, y) => {
      const line = (vals: number[], color: string, dash = false) => {
        vals.forEach((v, i) => (i === 0 ? doc.moveTo(x(i), y(v)) : doc.lineTo(x(i), y(v))));
        if (dash) doc.dash(3, { space: 2 });
        doc.lineWidth(1.6).strokeColor(color).stroke();
        doc.undash();
      };
      const series = [
        { label: 'no work', color: FAILED, vals: r.years.map((v) => v.networkPciDoNothing), dash: true },
        { label: 'worst-first', color: '#8c8574', vals: r.baseline.years.map((v) => v.networkPci), dash: true },
        { label: 'this plan', color: TEAL, vals: r.years.map((v) => v.networkPci), dash: false },
      ];
      for (const s of series) line(s.vals, s.color, s.dash);
      // End labels, spread so they never touch.
      const ends = series.map((s) => ({ s, y: y(s.vals[s.vals.length - 1]) - 4 })).sort((a, b) => a.y - b.y);
      for (let i = 1; i < ends.length; i++) if (ends[i].y < ends[i - 1].y + 10) ends[i].y = ends[i - 1].y + 10;
      for (const e of ends)
        doc
          .font(e.s.dash ? 'body' : 'bold')
          .fontSize(7.5)
          .fillColor(e.s.color)
          .text(`${e.s.label} ${e.s.vals[e.s.vals.length - 1].toFixed(0)}`, x(r.years.length - 1) + 6, e.y, {
            width: 64,
            lineBreak: false,
          });
    },
  );
  note(
    `Length-weighted network PCI by year. Teal: this plan. Red dashed: no work at all. Grey dashed: the same budgets spent worst-first (${r.baseline.finalPci.toFixed(0)} in ${last.calendarYear}).`,
  );

  heading('Lane-miles by condition band', 240);
  const total = r.summary.laneMiles || 1;
  chart(
    120,
    niceTicks(total),
    (v) => int(v),
    'Lane-miles',
    (x, y, band) => {
      const bw = Math.max(6, Math.min(28, band * 0.6));
      r.years.forEach((yr, i) => {
        let acc = 0;
        for (const b of CONDITION_BANDS.slice().reverse()) {
          const v = yr.laneMilesByBand[b.id] ?? 0;
          const y0 = y(acc);
          acc += v;
          doc.rect(x(i) - bw / 2, y(acc), bw, y0 - y(acc)).fill(b.color);
        }
      });
      // Legend at the right: each band's colour and words, worst at the bottom as in the bars.
      CONDITION_BANDS.forEach((b, k) => {
        const ly = y(total) + k * 12;
        const lx = x(r.years.length - 1) + 18;
        doc.rect(lx, ly, 8, 8).fill(b.color);
        doc
          .font('body')
          .fontSize(7)
          .fillColor(INK)
          .text(b.label, lx + 11, ly, { width: 52, lineBreak: false });
      });
    },
  );
  doc.font('body').fontSize(8).fillColor(INK);
  doc.text(
    CONDITION_BANDS.map(
      (b) =>
        `${b.label} (PCI ${b.min}–${b.max}): ${int(first.laneMilesByBand[b.id] ?? 0)} to ${int(last.laneMilesByBand[b.id] ?? 0)} lane-mi`,
    ).join(' · '),
    L,
    doc.y,
    { width: W },
  );
  note(BAND_MAPPING_NOTE, 8);

  heading('Backlog', 220);
  const maxB = Math.max(1, ...r.years.map((y) => y.backlog));
  chart(90, niceTicks(maxB), moneyTick, 'Backlog, dollars', (x, y, band) => {
    const bw = Math.max(6, Math.min(28, band * 0.6));
    r.years.forEach((yr, i) => {
      doc.rect(x(i) - bw / 2, y(yr.backlog), bw, y(0) - y(yr.backlog)).fill('#b45309');
    });
  });
  const noFit = r.years[r.years.length - 1] as { backlogNoFit?: { segments: number; laneMiles: number } };
  note(
    `Cost of the work needed on roads below the needs-work PCI that the plan has not funded by that year${noFit.backlogNoFit ? ', treated roads counted again when they fall back below it' : ''}: ${moneyFull(first.backlog)} in ${first.calendarYear}, ${moneyFull(last.backlog)} in ${last.calendarYear}.${noFit.backlogNoFit ? ` A further ${int(noFit.backlogNoFit.laneMiles)} lane-miles (${int(noFit.backlogNoFit.segments)} segments) need work that no catalog treatment fits.` : ''}`,
  );

  // ---- The map: roads coloured by the year of their first planned work ---------------
  doc.addPage();
  heading('Map of the planned work');
  const firstYear = new Map<number, number>();
  for (const w of r.work) if (!firstYear.has(w.ref) || w.year < firstYear.get(w.ref)!) firstYear.set(w.ref, w.year);
  const H = r.years.length;
  const groupSize = Math.max(1, Math.ceil(H / YEAR_COLORS.length));
  const groups = Array.from({ length: Math.ceil(H / groupSize) }, (_, g) => {
    const a = g * groupSize;
    const b = Math.min(H - 1, a + groupSize - 1);
    return {
      color: YEAR_COLORS[g],
      label: a === b ? String(years[a]) : `${years[a]}–${years[b]}`,
      count: [...firstYear.values()].filter((y) => y >= a && y <= b).length,
    };
  });
  const colorOf = (y: number) => groups[Math.floor(y / groupSize)].color;
  const all = [...geometries.entries()];
  if (all.length) {
    let minX = Infinity;
    let minY = Infinity;
    let maxX = -Infinity;
    let maxY = -Infinity;
    const lines = (g: Geometry) =>
      g.type === 'LineString' ? [g.coordinates as number[][]] : (g.coordinates as number[][][]);
    for (const [, g] of all)
      for (const l of lines(g))
        for (const [lon, lat] of l) {
          minX = Math.min(minX, lon);
          maxX = Math.max(maxX, lon);
          minY = Math.min(minY, lat);
          maxY = Math.max(maxY, lat);
        }
    const k = Math.cos((((minY + maxY) / 2) * Math.PI) / 180);
    const boxW = W;
    const boxH = 440;
    const scale = Math.min(boxW / ((maxX - minX) * k || 1), boxH / (maxY - minY || 1)) * 0.94;
    const ox = L + (boxW - (maxX - minX) * k * scale) / 2;
    const oy = doc.y + 6;
    const px = (lon: number) => ox + (lon - minX) * k * scale;
    const py = (lat: number) => oy + boxH - (boxH - (maxY - minY) * scale) / 2 - (lat - minY) * scale;
    doc
      .rect(L, oy - 4, boxW, boxH + 8)
      .lineWidth(0.5)
      .strokeColor(GRID)
      .stroke();
    const draw = (g: Geometry, color: string, width: number) => {
      for (const l of lines(g)) {
        l.forEach(([lon, lat], i) => (i === 0 ? doc.moveTo(px(lon), py(lat)) : doc.lineTo(px(lon), py(lat))));
        doc.lineWidth(width).strokeColor(color).lineCap('round').stroke();
      }
    };
    for (const [ref, g] of all) if (!firstYear.has(ref)) draw(g, NO_WORK, 0.6);
    for (const [ref, g] of all) if (firstYear.has(ref)) draw(g, colorOf(firstYear.get(ref)!), 2.2);

    // Road names on the main roads: the longest named roads of the higher classes first,
    // each once, at the middle of its longest piece, never over another label.
    const byRoad = new Map<
      string,
      { len: number; main: boolean; best: { pts: number[][]; len: number } | null; pieces: number[][][] }
    >();
    for (const [ref, g] of all) {
      const f = limits.get(ref);
      if (!f?.roadName) continue;
      const e = byRoad.get(f.roadName) ?? { len: 0, main: false, best: null, pieces: [] };
      for (const l of lines(g)) {
        e.pieces.push(l);
        let len = 0;
        for (let i = 1; i < l.length; i++)
          len += Math.hypot(px(l[i][0]) - px(l[i - 1][0]), py(l[i][1]) - py(l[i - 1][1]));
        e.len += len;
        if (!e.best || len > e.best.len) e.best = { pts: l, len };
      }
      e.main ||= MAIN_CLASSES.has(f.functionalClass);
      byRoad.set(f.roadName, e);
    }
    const placed: { x: number; y: number; w: number; h: number }[] = [];
    const roads = [...byRoad.entries()]
      .filter(([, e]) => e.best)
      .sort((a, b) => Number(b[1].main) - Number(a[1].main) || b[1].len - a[1].len)
      .slice(0, 40);
    doc.font('bold').fontSize(7);
    let labelled = 0;
    for (const [name, e] of roads) {
      if (labelled >= 18) break;
      // The vertex nearest the middle of the road's whole extent: a label sits on the road, centred.
      const verts = e.pieces.flat();
      const cx = verts.reduce((a, p) => a + p[0], 0) / verts.length;
      const cy = verts.reduce((a, p) => a + p[1], 0) / verts.length;
      const mid = verts.reduce((b, p) => (Math.hypot(p[0] - cx, p[1] - cy) < Math.hypot(b[0] - cx, b[1] - cy) ? p : b));
      const text = clip(name, 40);
      const tw = doc.widthOfString(text) + 4;
      const rect = { x: px(mid[0]) - tw / 2, y: py(mid[1]) - 5, w: tw, h: 10 };
      if (rect.x < L + 2 || rect.x + rect.w > L + boxW - 2 || rect.y < oy || rect.y + rect.h > oy + boxH) continue;
      if (
        placed.some((p) => p.x < rect.x + rect.w && rect.x < p.x + p.w && p.y < rect.y + rect.h && rect.y < p.y + p.h)
      )
        continue;
      placed.push(rect);
      doc.save().opacity(0.85).rect(rect.x, rect.y, rect.w, rect.h).fill('#ffffff').restore();
      doc
        .font('bold')
        .fontSize(7)
        .fillColor(INK)
        .text(text, rect.x + 2, rect.y + 1.5, { width: tw, lineBreak: false });
      labelled++;
    }

    // North arrow (top right) and scale bar (bottom left).
    const nx = L + boxW - 24;
    const ny = oy + 8;
    doc
      .moveTo(nx, ny)
      .lineTo(nx - 7, ny + 22)
      .lineTo(nx, ny + 16)
      .lineTo(nx + 7, ny + 22)
      .closePath()
      .fill(INK);
    doc
      .font('bold')
      .fontSize(9)
      .fillColor(INK)
      .text('N', nx - 4, ny + 24, { width: 8, align: 'center', lineBreak: false });
    const ptsPerMile = scale / 69.05; // one degree of latitude ≈ 69.05 statute miles (from memory)
    const targetMi = 100 / ptsPerMile;
    const barMi = [0.25, 0.5, 1, 2, 5, 10, 20, 50].reduce((b, c) => (c <= targetMi ? c : b), 0.25);
    const barW = barMi * ptsPerMile;
    const sx = L + 10;
    const sy = oy + boxH - 10;
    doc.rect(sx, sy - 4, barW / 2, 4).fill(INK);
    doc
      .rect(sx + barW / 2, sy - 4, barW / 2, 4)
      .lineWidth(0.6)
      .strokeColor(INK)
      .stroke();
    doc
      .font('body')
      .fontSize(7.5)
      .fillColor(INK)
      .text('0', sx - 3, sy + 2, { width: 8, lineBreak: false })
      .text(`${barMi} mi`, sx + barW - 10, sy + 2, { width: 40, lineBreak: false });

    // Legend under the map.
    doc.y = oy + boxH + 12;
    let lx = L;
    const ly = doc.y;
    doc.font('bold').fontSize(8).fillColor(INK).text('Legend: first planned work', lx, ly, { lineBreak: false });
    lx += doc.widthOfString('Legend: first planned work') + 12;
    const items = [
      ...groups.map((g) => ({ color: g.color, label: `${g.label} (${g.count})`, thick: true })),
      { color: NO_WORK, label: 'no work planned', thick: false },
    ];
    doc.font('body').fontSize(8);
    let row = 0;
    for (const it of items) {
      const w = doc.widthOfString(it.label) + 26;
      if (lx + w > L + W) {
        row++;
        lx = L;
      }
      const y0 = ly + row * 13;
      doc
        .moveTo(lx, y0 + 4)
        .lineTo(lx + 16, y0 + 4)
        .lineWidth(it.thick ? 2.5 : 1)
        .strokeColor(it.color)
        .stroke();
      doc.fillColor(INK).text(it.label, lx + 20, y0, { lineBreak: false });
      lx += w + 6;
    }
    doc.y = ly + (row + 1) * 13 + 4;
    note(
      `Roads drawn from the inventory’s own segment lines, coloured by the year of their first planned work (number of segments in brackets). Names are shown on the main roads where they fit. ${labelled} road names shown.`,
      8,
    );
  } else {
    doc.text('The inventory has no geometry to draw.');
  }

  // ---- The work list, with from–to limits -------------------------------------------
  heading('Work list, first two years');
  const cols = [
    { t: 'Year', w: 30 },
    { t: 'Road', w: 92 },
    { t: 'From', w: 80 },
    { t: 'To', w: 80 },
    { t: 'Treatment', w: 110 },
    { t: 'Lane-mi', w: 38, right: true },
    { t: 'Cost', w: 74, right: true },
  ];
  const row = (vals: string[], bold = false) => {
    if (doc.y > doc.page.height - 72) doc.addPage();
    const y = doc.y;
    let x = L;
    vals.forEach((v, i) => {
      doc
        .font(bold ? 'bold' : 'body')
        .fontSize(7.5)
        .fillColor(INK)
        .text(v, x, y, {
          width: cols[i].w - 4,
          align: cols[i].right ? 'right' : 'left',
          lineBreak: false,
          ellipsis: true,
        });
      x += cols[i].w;
    });
    doc.y = y + 11;
    doc.x = L;
  };
  row(
    cols.map((c) => c.t),
    true,
  );
  const work12 = r.work.filter((w) => w.year <= 1);
  const shown = work12.slice(0, 90);
  let flagged = 0;
  for (const w of shown) {
    const f = limits.get(w.ref);
    const flag = (w as { structuralFlag?: string | null }).structuralFlag;
    if (flag) flagged++;
    row([
      String(w.calendarYear),
      clip(w.roadName, 60),
      clip(w.fromDesc ?? f?.fromDesc ?? '—', 60),
      clip(w.toDesc ?? f?.toDesc ?? '—', 60),
      `${flag ? '(!) ' : ''}${clip(w.treatment, 80)}`,
      w.laneMiles.toFixed(2),
      moneyFull(w.cost),
    ]);
  }
  if (work12.length > shown.length)
    note(`… and ${work12.length - shown.length} more; the full list is in the work-list export.`, 8);
  if (flagged)
    doc
      .font('bold')
      .fontSize(8)
      .fillColor(FAILED)
      .text(
        `(!) ${flagged} item${flagged === 1 ? '' : 's'} flagged by the structural check: a thin lift on a base that may be too weak. Have an engineer confirm the structure before letting the work.`,
        L,
        doc.y,
        { width: W },
      );
  doc
    .font('bold')
    .fontSize(8)
    .fillColor(INK)
    .text(
      `Spent: ${first.calendarYear} ${moneyFull(first.spent)} of ${moneyFull(first.budget)}${r.years[1] ? `; ${r.years[1].calendarYear} ${moneyFull(r.years[1].spent)} of ${moneyFull(r.years[1].budget)}` : ''}.`,
      L,
      doc.y,
      { width: W },
    );

  heading('Method');
  doc.fontSize(9).text(briefMethod(r as PlanResult), { width: W, lineGap: 1.5 });
  heading('Cautions');
  doc.fontSize(9).text(BRIEF_CAUTIONS, { width: W, lineGap: 1.5 });
  doc.moveDown(0.3);
  doc
    .fontSize(9)
    .text(
      'Work zones: every job on a road open to traffic needs a traffic-control plan to the applicable manual and the agency’s own rules. Cold weather: hot-mix paving and chip seals have minimum air and surface temperatures in the agency’s specifications; late-season work may be deferred.',
      { width: W, lineGap: 1.5 },
    );
  doc.end();
  return done;
}
