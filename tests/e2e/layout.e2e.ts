// The overlap check itself, on pages made for it: it must catch text drawn over
// text, and must not cry wolf over wrapped lines, ellipsis cells, scrolled-away
// rows or screen-reader-only text.
import { type Browser, chromium, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHROMIUM } from './harness';
import { describeOverlaps, textOverlaps } from './layout';

let browser: Browser;
let page: Page;
beforeAll(async () => {
  browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: ['--no-sandbox', '--no-first-run', '--disable-background-networking', '--disable-component-update'],
  });
  page = await browser.newPage({ viewport: { width: 800, height: 600 } });
});
afterAll(async () => {
  await browser?.close();
});

const show = (body: string) =>
  page.setContent(`<!doctype html><html><body style="margin:0;font:14px/1.3 sans-serif">${body}</body></html>`);

describe('textOverlaps', () => {
  it('names two texts that draw over each other', async () => {
    await show(
      '<div style="position:relative;height:40px"><span style="position:absolute;left:10px;top:5px">Length (mi)</span><span style="position:absolute;left:40px;top:8px">Width (ft)</span></div>',
    );
    const found = await textOverlaps(page);
    expect(found.map((o) => [o.a, o.b])).toEqual([['Length (mi)', 'Width (ft)']]);
    expect(describeOverlaps(found)[0]).toMatch(/^"Length \(mi\)" over "Width \(ft\)" \(\d+×\d+ px at \d+,\d+\)$/);
  });

  it('catches SVG labels on top of each other', async () => {
    await show(
      '<svg width="300" height="60"><text x="10" y="30" font-size="12">2027</text><text x="22" y="32" font-size="12">2028</text><text x="200" y="30" font-size="12">2035</text></svg>',
    );
    expect((await textOverlaps(page)).map((o) => [o.a, o.b])).toEqual([['2027', '2028']]);
  });

  it('finds nothing in wrapped text, neighbours on a line, ellipsis cells, scrolled rows, or sr-only text', async () => {
    await show(`
      <p style="width:120px">A long paragraph that wraps onto several lines of text here.</p>
      <p><span>PCI </span><strong>81</strong><span> (good)</span></p>
      <div style="display:flex;width:200px">
        <div style="width:60px;overflow:hidden;white-space:nowrap;text-overflow:ellipsis">Tallow Creek Parkway</div>
        <div style="width:60px">Road A</div>
      </div>
      <div style="height:40px;overflow:auto;position:relative">
        <div style="height:20px">Row one</div><div style="height:20px">Row two</div><div style="height:20px">Row three</div>
      </div>
      <div style="position:relative"><span>Visible label</span>
        <span style="position:absolute;left:0;top:0;width:1px;height:1px;overflow:hidden;clip:rect(0,0,0,0)">What is PCI?</span></div>
      <div style="position:relative;height:20px"><span>Shown</span><span style="position:absolute;left:0;top:0;display:none">Hidden</span></div>`);
    expect(describeOverlaps(await textOverlaps(page))).toEqual([]);
  });

  it('a fixed panel covers the page under it; texts inside the panel are still checked', async () => {
    await show(`<p>Page text under the panel</p>
      <aside style="position:fixed;top:0;left:0;width:300px;height:200px;background:#fff">
        <span>Panel title</span><span style="position:absolute;left:10px;top:2px">Clash</span></aside>`);
    expect((await textOverlaps(page)).map((o) => [o.a, o.b])).toEqual([['Panel title', 'Clash']]);
  });

  it('looks only inside the container it is given, and skips what it is told to', async () => {
    await show(
      '<div id="a" style="position:relative;height:30px"><span style="position:absolute">One</span><span style="position:absolute;left:4px">Two</span></div><div id="b">Fine</div>',
    );
    expect(await textOverlaps(page, '#b')).toEqual([]);
    expect(await textOverlaps(page, '#a')).toHaveLength(1);
    expect(await textOverlaps(page, 'body', { ignore: '#a' })).toEqual([]);
  });
});
