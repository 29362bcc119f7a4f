// Reads what a NetworkMap has actually drawn, through the map handle the
// component leaves on its container (`__map`). Every count here comes from
// queryRenderedFeatures (deduped by id: a feature comes back once per tile it
// crosses), never from the data the component was given.
import type { Page } from 'playwright-core';

/** CSS selector of the map container inside `scope` (a selector, default the page). */
const mapSelector = (scope: string) => `${scope} [data-testid=network-map] .maplibregl-map`;

/** Resolves once the map has loaded, drawn its tiles and gone idle after a forced repaint. */
export async function settledMap(page: Page, scope = 'body') {
  const sel = mapSelector(scope);
  await page.waitForFunction(
    (s) => {
      const el = document.querySelector(s) as (HTMLElement & { __map?: { loaded(): boolean } }) | null;
      return !!el?.__map && el.__map.loaded();
    },
    sel,
    { timeout: 60_000 },
  );
  // One more idle after a repaint: any data swap the last interaction started has finished.
  await page.evaluate(
    (s) =>
      new Promise<void>((resolve) => {
        const el = document.querySelector(s) as HTMLElement & {
          __map: { once(e: string, f: () => void): void; triggerRepaint(): void };
        };
        el.__map.once('idle', () => resolve());
        el.__map.triggerRepaint();
      }),
    sel,
  );
}

export type Rendered = { ids: number[]; selected: number[]; planned: number[]; total: number };

/** Distinct rendered segment ids, those drawn as selected, those with a planned year; `total` = features given. */
export async function rendered(page: Page, scope = 'body'): Promise<Rendered> {
  await settledMap(page, scope);
  return page.evaluate((s) => {
    const el = document.querySelector(s) as HTMLElement & {
      __map: {
        queryRenderedFeatures(o: object): { id: number; state: { selected?: boolean; py?: number } }[];
        getCanvas(): HTMLCanvasElement;
      };
    };
    const hits = el.__map.queryRenderedFeatures({ layers: ['segments-line'] });
    const uniq = (xs: number[]) => [...new Set(xs)].sort((a, b) => a - b);
    return {
      ids: uniq(hits.map((f) => Number(f.id))),
      selected: uniq(hits.filter((f) => f.state.selected).map((f) => Number(f.id))),
      planned: uniq(hits.filter((f) => (f.state.py ?? -1) >= 0).map((f) => Number(f.id))),
      total: Number(el.__map.getCanvas().dataset.features ?? -1),
    };
  }, mapSelector(scope));
}

/** Page coordinates of the middle of one drawn segment (not near an intersection), with its id. */
export async function pointOnSegment(page: Page, scope = 'body', nth = 0) {
  await settledMap(page, scope);
  return page.evaluate(
    ({ s, nth }) => {
      type Pt = { x: number; y: number };
      const el = document.querySelector(s) as HTMLElement & {
        __map: {
          queryRenderedFeatures(o: object): { id: number; geometry: { type: string; coordinates: number[][] } }[];
          project(c: number[]): Pt;
          getCanvas(): HTMLCanvasElement;
        };
      };
      const map = el.__map;
      const rect = map.getCanvas().getBoundingClientRect();
      const hits = map
        .queryRenderedFeatures({ layers: ['segments-line'] })
        .filter((f) => f.geometry.type === 'LineString');
      // Long segments far from the edges, so the click lands on one road only.
      const candidates = hits
        .map((f) => {
          const c = f.geometry.coordinates;
          const a = map.project(c[0]);
          const b = map.project(c[c.length - 1]);
          return { id: Number(f.id), x: (a.x + b.x) / 2, y: (a.y + b.y) / 2, len: Math.hypot(a.x - b.x, a.y - b.y) };
        })
        .filter((p) => p.len > 12 && p.x > 60 && p.y > 60 && p.x < rect.width - 60 && p.y < rect.height - 60)
        .sort((p, q) => q.len - p.len || p.id - q.id);
      const p = candidates[nth];
      return p ? { id: p.id, x: Math.round(rect.left + p.x), y: Math.round(rect.top + p.y) } : null;
    },
    { s: mapSelector(scope), nth },
  );
}

/** Distinct segment ids drawn inside a page-coordinate box (what a box selection over it should pick). */
export async function idsInBox(page: Page, box: { x0: number; y0: number; x1: number; y1: number }, scope = 'body') {
  return page.evaluate(
    ({ s, box }) => {
      const el = document.querySelector(s) as HTMLElement & {
        __map: { queryRenderedFeatures(b: number[][], o: object): { id: number }[]; getCanvas(): HTMLCanvasElement };
      };
      const r = el.__map.getCanvas().getBoundingClientRect();
      const hits = el.__map.queryRenderedFeatures(
        [
          [box.x0 - r.left, box.y0 - r.top],
          [box.x1 - r.left, box.y1 - r.top],
        ],
        { layers: ['segments-line'] },
      );
      return [...new Set(hits.map((h) => Number(h.id)))].sort((a, b) => a - b);
    },
    { s: mapSelector(scope), box },
  );
}

/** The map canvas's box in page coordinates. */
export async function mapBox(page: Page, scope = 'body') {
  const box = await page.locator(mapSelector(scope)).boundingBox();
  if (!box) throw new Error('the map is not on the page');
  return box;
}
