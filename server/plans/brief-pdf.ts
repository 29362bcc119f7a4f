// The council brief as a PDF (pdfkit): a page a council member can read on
// paper. Headings are also bookmarks, so a reader (and a test) can find them.
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { BAND_MAPPING_NOTE, CONDITION_BANDS } from '../../shared/condition';
import { BRIEF_CAUTIONS, briefMethod, briefSummary } from '../../shared/engine/plan/brief-text';
import type { PlanResult } from '../../shared/engine/plan/run-plan';

const require = createRequire(import.meta.url);
const LATO = require.resolve('@fontsource/lato/files/lato-latin-400-normal.woff');
const LATO_BOLD = require.resolve('@fontsource/lato/files/lato-latin-700-normal.woff');

const INK = '#1f2328';
const MUTED = '#5b6068';
const TEAL = '#0f766e';
const SAND = '#d6b25e';

const money = (v: number) =>
  Math.abs(v) >= 1e6 ? `$${(v / 1e6).toFixed(2)}M` : `$${Math.round(v).toLocaleString('en-US')}`;
const int = (v: number) => Math.round(v).toLocaleString('en-US');

type Geometry = { type: string; coordinates: number[][] | number[][][] };

// The schemas bound every name at the input (agency and plan names 120 characters, road
// names 120, segment ids 60); this is only the last guard, since laying out a very long
// string froze pdfkit for seconds.
const clip = (s: string, max = 120) => (s.length > max ? `${s.slice(0, max - 1)}…` : s);

export async function briefPdf(args: {
  plan: { name: string; status: string; settings: unknown };
  result: PlanResult;
  geometries: Map<number, Geometry>;
  author: string;
  agencyName: string;
}) {
  const { result: r, geometries } = args;
  const plan = { ...args.plan, name: clip(args.plan.name) };
  const author = clip(args.author);
  const agencyName = clip(args.agencyName);
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
  const W = doc.page.width - 108;
  const heading = (text: string) => {
    if (doc.y > doc.page.height - 160) doc.addPage();
    doc.moveDown(0.6).font('bold').fontSize(13).fillColor(INK).text(text);
    doc.outline.addItem(text);
    doc.moveDown(0.3).font('body').fontSize(10).fillColor(INK);
  };
  const first = r.years[0];
  const last = r.years[r.years.length - 1];

  doc.font('bold').fontSize(20).fillColor(INK).text(`${agencyName}: ${plan.name}`);
  doc
    .font('body')
    .fontSize(11)
    .fillColor(MUTED)
    .text(
      `Paving plan ${first.calendarYear}–${last.calendarYear} · ${plan.status === 'published' ? 'published' : 'draft'} · prepared ${new Date().toISOString().slice(0, 10)} by ${author} with Wearcourse`,
    );

  heading('Summary');
  doc.fontSize(11).text(briefSummary(r, agencyName), { width: W, lineGap: 2 });

  // Network PCI by year: the plan, no work, and the worst-first baseline.
  heading('Network condition');
  const chart = (h: number, draw: (x: (i: number) => number, y0: number, y1: number) => void) => {
    if (doc.y + h + 30 > doc.page.height - 54) doc.addPage();
    const top = doc.y;
    const left = 90;
    const right = 54 + W - 10;
    const n = r.years.length;
    const x = (i: number) => left + (n === 1 ? 0 : ((right - left) * i) / (n - 1));
    draw(x, top, top + h);
    r.years.forEach((y, i) =>
      doc
        .font('body')
        .fontSize(7)
        .fillColor(MUTED)
        .text(String(y.calendarYear), x(i) - 12, top + h + 4, { width: 24, align: 'center' }),
    );
    doc.y = top + h + 18;
    doc.x = 54;
  };
  chart(150, (x, top, bottom) => {
    const y = (p: number) => bottom - ((bottom - top) * p) / 100;
    for (const p of [0, 25, 50, 75, 100]) {
      doc
        .moveTo(90, y(p))
        .lineTo(54 + W - 10, y(p))
        .lineWidth(0.3)
        .strokeColor('#d9d4c7')
        .stroke();
      doc
        .font('body')
        .fontSize(7)
        .fillColor(MUTED)
        .text(String(p), 62, y(p) - 4, { width: 22, align: 'right' });
    }
    const line = (vals: number[], color: string, dash = false) => {
      vals.forEach((v, i) => (i === 0 ? doc.moveTo(x(i), y(v)) : doc.lineTo(x(i), y(v))));
      if (dash) doc.dash(3, { space: 2 });
      doc.lineWidth(1.6).strokeColor(color).stroke();
      doc.undash();
    };
    line(
      r.years.map((v) => v.networkPciDoNothing),
      '#7f1d1d',
      true,
    );
    line(
      r.baseline.years.map((v) => v.networkPci),
      '#8c8574',
      true,
    );
    line(
      r.years.map((v) => v.networkPci),
      TEAL,
    );
    const lastX = x(r.years.length - 1) + 4;
    doc
      .font('bold')
      .fontSize(7)
      .fillColor(TEAL)
      .text(`this plan ${last.networkPci.toFixed(0)}`, lastX - 60, y(last.networkPci) - 10, { width: 70 });
    doc
      .font('body')
      .fontSize(7)
      .fillColor('#7f1d1d')
      .text(`no work ${last.networkPciDoNothing.toFixed(0)}`, lastX - 60, y(last.networkPciDoNothing) + 2, {
        width: 70,
      });
  });
  doc
    .font('body')
    .fontSize(9)
    .fillColor(MUTED)
    .text(
      `Length-weighted network PCI by year. Teal: this plan. Red dashed: no work at all. Grey dashed: the same budgets spent worst-first (${r.baseline.finalPci.toFixed(0)} in ${last.calendarYear}).`,
      { width: W },
    );

  heading('Lane-miles by condition band');
  const total = r.summary.laneMiles || 1;
  chart(120, (x, top, bottom) => {
    const bw = Math.max(6, Math.min(28, (x(1) - x(0)) * 0.6 || 28));
    r.years.forEach((yr, i) => {
      let acc = 0;
      for (const b of CONDITION_BANDS.slice().reverse()) {
        const v = yr.laneMilesByBand[b.id] ?? 0;
        const h0 = bottom - ((bottom - top) * acc) / total;
        acc += v;
        const h1 = bottom - ((bottom - top) * acc) / total;
        doc.rect(x(i) - bw / 2, h1, bw, h0 - h1).fill(b.color);
      }
    });
  });
  doc.font('body').fontSize(8).fillColor(INK);
  doc.text(
    CONDITION_BANDS.map(
      (b) =>
        `${b.label} (PCI ${b.min}–${b.max}): ${int(first.laneMilesByBand[b.id] ?? 0)} → ${int(last.laneMilesByBand[b.id] ?? 0)} lane-mi`,
    ).join(' · '),
    { width: W },
  );
  doc.fillColor(MUTED).text(BAND_MAPPING_NOTE, { width: W });

  heading('Backlog');
  const maxB = Math.max(1, ...r.years.map((y) => y.backlog));
  chart(80, (x, top, bottom) => {
    const bw = Math.max(6, Math.min(28, (x(1) - x(0)) * 0.6 || 28));
    r.years.forEach((yr, i) => {
      const h = ((bottom - top) * yr.backlog) / maxB;
      doc.rect(x(i) - bw / 2, bottom - h, bw, h).fill('#b45309');
    });
  });
  doc
    .font('body')
    .fontSize(9)
    .fillColor(MUTED)
    .text(
      `Cost of work needed on roads below PCI ${r.years.length ? 71 : ''} that the plan has not funded by that year: ${money(first.backlog)} in ${first.calendarYear}, ${money(last.backlog)} in ${last.calendarYear}.`,
      { width: W },
    );

  // Map: all segments faint, the first two years' work in colour.
  doc.addPage();
  heading('Map of the first two years’ work');
  const work12 = r.work.filter((w) => w.year <= 1);
  const yearOf = new Map(work12.map((w) => [w.ref, w.year]));
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
    const boxH = 380;
    const scale = Math.min(boxW / ((maxX - minX) * k || 1), boxH / (maxY - minY || 1));
    const ox = 54;
    const oy = doc.y;
    const px = (lon: number) => ox + (lon - minX) * k * scale;
    const py = (lat: number) => oy + boxH - (lat - minY) * scale;
    const draw = (g: Geometry, color: string, width: number) => {
      for (const l of lines(g)) {
        l.forEach(([lon, lat], i) => (i === 0 ? doc.moveTo(px(lon), py(lat)) : doc.lineTo(px(lon), py(lat))));
        doc.lineWidth(width).strokeColor(color).stroke();
      }
    };
    for (const [ref, g] of all) if (!yearOf.has(ref)) draw(g, '#cfc9bb', 0.4);
    for (const [ref, g] of all) if (yearOf.has(ref)) draw(g, yearOf.get(ref) === 0 ? TEAL : SAND, 2.2);
    doc.y = oy + boxH + 8;
    doc.x = 54;
    doc
      .font('body')
      .fontSize(9)
      .fillColor(INK)
      .text(
        `Teal: ${first.calendarYear} work (${r.work.filter((w) => w.year === 0).length} segments). Sand: ${first.calendarYear + 1} work (${r.work.filter((w) => w.year === 1).length} segments). Grey: other roads.`,
        { width: W },
      );
  } else {
    doc.text('The inventory has no geometry to draw.');
  }

  heading('Work list, first two years');
  const cols = [
    { t: 'Year', w: 34 },
    { t: 'Segment', w: 70 },
    { t: 'Road', w: 110 },
    { t: 'Treatment', w: 120 },
    { t: 'Tons', w: 45, right: true },
    { t: 'SY', w: 55, right: true },
    { t: 'Cost', w: 66, right: true },
  ];
  const row = (vals: string[], bold = false) => {
    if (doc.y > doc.page.height - 72) doc.addPage();
    const y = doc.y;
    let x = 54;
    vals.forEach((v, i) => {
      doc
        .font(bold ? 'bold' : 'body')
        .fontSize(8)
        .fillColor(INK)
        .text(v, x, y, {
          width: cols[i].w - 4,
          align: cols[i].right ? 'right' : 'left',
          lineBreak: false,
          ellipsis: true,
        });
      x += cols[i].w;
    });
    doc.y = y + 12;
    doc.x = 54;
  };
  row(
    cols.map((c) => c.t),
    true,
  );
  const shown = work12.slice(0, 80);
  for (const w of shown)
    row([
      String(w.calendarYear),
      clip(w.segmentId, 60),
      clip(w.roadName),
      clip(w.treatment, 80),
      w.tons ? int(w.tons) : '—',
      int(w.areaSy),
      money(w.cost),
    ]);
  if (work12.length > shown.length)
    doc
      .font('body')
      .fontSize(8)
      .fillColor(MUTED)
      .text(`… and ${work12.length - shown.length} more; the full list is in the work-list export.`);
  doc
    .font('bold')
    .fontSize(8)
    .fillColor(INK)
    .text(
      `Spent: ${first.calendarYear} ${money(first.spent)} of ${money(first.budget)}${r.years[1] ? `; ${r.years[1].calendarYear} ${money(r.years[1].spent)} of ${money(r.years[1].budget)}` : ''}.`,
    );

  heading('Method');
  doc.fontSize(9).text(briefMethod(r), { width: W, lineGap: 1.5 });
  heading('Cautions');
  doc.fontSize(9).text(BRIEF_CAUTIONS, { width: W, lineGap: 1.5 });
  doc.end();
  return done;
}
