// Layout check for tables: the box of every piece of text in a table's cells
// (Range.getClientRects of each text node, so a long number is measured as it
// is drawn, not as its cell is sized) must not intersect the text of another
// cell, and the table must not be wider than the box that shows it.
import type { Page } from 'playwright-core';

export type LayoutProblem = string;

export async function tableLayoutProblems(page: Page, testId: string): Promise<LayoutProblem[]> {
  return page.evaluate((id) => {
    const table = document.querySelector(`[data-testid="${id}"]`);
    if (!table) return [`no table ${id}`];
    const problems: string[] = [];
    type Box = { text: string; cell: Element; r: DOMRect };
    const boxes: Box[] = [];
    for (const cell of table.querySelectorAll('th, td')) {
      const walker = document.createTreeWalker(cell, NodeFilter.SHOW_TEXT);
      for (let n = walker.nextNode(); n; n = walker.nextNode()) {
        const text = (n.textContent ?? '').trim();
        if (!text) continue;
        const range = document.createRange();
        range.selectNodeContents(n);
        for (const r of range.getClientRects()) if (r.width > 0 && r.height > 0) boxes.push({ text, cell, r });
      }
    }
    // A detail row's inner table is measured as its own cell's text only.
    const own = boxes.filter((b) => b.cell.closest('table') === table);
    const tol = 0.5;
    for (let i = 0; i < own.length; i++) {
      for (let j = i + 1; j < own.length; j++) {
        const a = own[i];
        const b = own[j];
        if (a.cell === b.cell) continue;
        const w = Math.min(a.r.right, b.r.right) - Math.max(a.r.left, b.r.left);
        const h = Math.min(a.r.bottom, b.r.bottom) - Math.max(a.r.top, b.r.top);
        if (w > tol && h > tol) problems.push(`“${a.text}” overlaps “${b.text}” in ${id}`);
      }
    }
    // Text drawn outside its own cell runs into the next one even when nothing is there yet.
    for (const b of own) {
      const c = b.cell.getBoundingClientRect();
      if (b.r.left < c.left - tol || b.r.right > c.right + tol)
        problems.push(`“${b.text}” runs out of its cell in ${id}`);
    }
    const frame = table.parentElement!;
    if (table.scrollWidth > frame.clientWidth + 1)
      problems.push(`${id} is ${table.scrollWidth}px wide in a ${frame.clientWidth}px box: columns are cut off`);
    return problems;
  }, testId);
}
