// Layout checks in the browser: does any text draw over other text?
//
// `textOverlaps(page, '#scope')` collects every visible piece of text in the
// container — the line boxes of DOM text (Range.getClientRects, so a wrapped
// paragraph is its lines, not one big box) and SVG <text> — clips each box by
// its overflow-hiding ancestors (an ellipsis-truncated cell is its cell, an
// off-screen row of a scroller is nothing), and reports every pair whose boxes
// cross by more than a sliver, naming both texts. A fixed-position layer (a
// panel, a tooltip, a toast) covers what is under it, so its texts are checked
// among themselves, not against the page beneath. `expectNoTextOverlap` fails
// the test with that list.
import type { Page } from 'playwright-core';
import { expect } from 'vitest';

export type Box = { x: number; y: number; w: number; h: number };
export type Overlap = { a: string; b: string; boxA: Box; boxB: Box; overlap: { w: number; h: number } };

export type OverlapOptions = {
  /** Smallest crossing, in px each way, that counts (anti-aliasing and rounding make slivers). */
  minPx?: number;
  /** CSS selector of subtrees to leave out (a map canvas's own controls, a deliberate overlay). */
  ignore?: string;
};

export async function textOverlaps(page: Page, scope = 'body', opts: OverlapOptions = {}): Promise<Overlap[]> {
  return page.evaluate(
    ({ scope, minPx, ignore }) => {
      type B = { x: number; y: number; w: number; h: number };
      const root = document.querySelector(scope);
      if (!root) throw new Error(`layout check: nothing matches ${scope}`);
      const clipCache = new Map<Element, B | null>();
      const inter = (a: B, b: B): B | null => {
        const x = Math.max(a.x, b.x);
        const y = Math.max(a.y, b.y);
        const w = Math.min(a.x + a.w, b.x + b.w) - x;
        const h = Math.min(a.y + a.h, b.y + b.h) - y;
        return w > 0 && h > 0 ? { x, y, w, h } : null;
      };
      const fromRect = (r: DOMRect): B => ({ x: r.left, y: r.top, w: r.width, h: r.height });
      const everything: B = { x: -1e6, y: -1e6, w: 2e6, h: 2e6 };
      // The visible region an element's content may paint in: the intersection of every
      // ancestor (and itself) that hides overflow. null = nothing shows.
      const clipOf = (el: Element | null): B | null => {
        if (!el || el === document.documentElement) return everything;
        const cached = clipCache.get(el);
        if (cached !== undefined) return cached;
        const cs = getComputedStyle(el);
        let clip = clipOf(el.parentElement);
        if (
          clip &&
          (cs.overflowX !== 'visible' || cs.overflowY !== 'visible' || cs.clip === 'rect(0px, 0px, 0px, 0px)')
        )
          clip = inter(clip, fromRect(el.getBoundingClientRect()));
        clipCache.set(el, clip);
        return clip;
      };
      const shownCache = new Map<Element, boolean>();
      const shown = (el: Element | null): boolean => {
        if (!el) return true;
        const cached = shownCache.get(el);
        if (cached !== undefined) return cached;
        const cs = getComputedStyle(el);
        const own = !(ignore && el.matches(ignore)) && cs.display !== 'none' && Number(cs.opacity) !== 0;
        const v = own && shown(el.parentElement);
        shownCache.set(el, v);
        return v;
      };
      const visible = (el: Element) => shown(el) && getComputedStyle(el).visibility !== 'hidden';
      const name = (t: string) => t.replace(/\s+/g, ' ').trim().slice(0, 60);
      const items: { text: string; box: B; node: number; layer: Element | null }[] = [];
      let node = 0;
      const layerCache = new Map<Element, Element | null>();
      const layerOf = (el: Element | null): Element | null => {
        if (!el) return null;
        const cached = layerCache.get(el);
        if (cached !== undefined) return cached;
        const v = getComputedStyle(el).position === 'fixed' ? el : layerOf(el.parentElement);
        layerCache.set(el, v);
        return v;
      };
      const add = (text: string, r: B, el: Element) => {
        const c = clipOf(el);
        const box = c && inter(r, c);
        if (box && box.w >= 1 && box.h >= 1) items.push({ text: name(text), box, node, layer: layerOf(el) });
      };
      const walk = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
      for (let n = walk.nextNode(); n; n = walk.nextNode()) {
        node++;
        const parent = n.parentElement;
        if (!parent || !n.textContent?.trim() || !visible(parent)) continue;
        if (parent.closest('script, style, title, option')) continue;
        if (parent instanceof SVGElement) {
          const el = parent.closest('text');
          if (el && el.firstChild === n) add(el.textContent ?? '', fromRect(el.getBoundingClientRect()), el);
          continue;
        }
        const range = document.createRange();
        range.selectNodeContents(n);
        for (const r of range.getClientRects())
          if (r.width > 0 && r.height > 0) add(n.textContent, fromRect(r), parent);
      }
      const out: { a: string; b: string; boxA: B; boxB: B; overlap: { w: number; h: number } }[] = [];
      // Line boxes of one text are often taller than its glyphs; require a real crossing both ways.
      for (let i = 0; i < items.length; i++)
        for (let j = i + 1; j < items.length; j++) {
          // The rectangles of one text node (its lines, an ellipsis fragment) are not two texts.
          if (items[i].node === items[j].node || items[i].layer !== items[j].layer) continue;
          const a = items[i].box;
          const b = items[j].box;
          if (a.x > b.x + b.w || b.x > a.x + a.w || a.y > b.y + b.h || b.y > a.y + a.h) continue;
          const o = inter(a, b);
          if (o && o.w >= minPx && o.h >= Math.max(minPx, Math.min(a.h, b.h) * 0.35))
            out.push({ a: items[i].text, b: items[j].text, boxA: a, boxB: b, overlap: { w: o.w, h: o.h } });
        }
      return out;
    },
    { scope, minPx: opts.minPx ?? 2, ignore: opts.ignore ?? null },
  );
}

/** One line per overlap: “"PCI 81" over "Length (mi)" (12×14 px at 640,212)”. */
export const describeOverlaps = (list: Overlap[]) =>
  list.map(
    (o) =>
      `"${o.a}" over "${o.b}" (${Math.round(o.overlap.w)}×${Math.round(o.overlap.h)} px at ${Math.round(o.boxB.x)},${Math.round(o.boxB.y)})`,
  );

export async function expectNoTextOverlap(page: Page, scope = 'body', where = scope, opts: OverlapOptions = {}) {
  const found = await textOverlaps(page, scope, opts);
  expect(describeOverlaps(found), `text drawn over text in ${where}`).toEqual([]);
}
