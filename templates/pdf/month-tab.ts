// Thumb tabs for press output: a black tab at the outer edge of each month page, one twelfth of the
// type area lower for each month, running into the bleed so the trimmed edge shows a mark to thumb to.
import type { PageContext } from './page.js';
import { unit } from './page.js';
import { INK, WHITE } from './style.js';
import { put } from './text.js';

export function drawMonthTab(ctx: PageContext, month: number): void {
  if (ctx.bleed <= 0) return;
  const { doc, box, number } = ctx;
  const g = ctx.settings.geometry;
  const s = unit(ctx);
  const recto = number % 2 === 1;
  const h = box.height / 12;
  const y = box.y + (month - 1) * h;
  const inside = g.margins.outer * 0.55; // how far the tab reaches in from the trimmed edge
  const x = recto ? g.size.width - inside : -ctx.bleed;
  doc.save().rect(x, y + 0.5, inside + ctx.bleed, h - 1).fill(INK).restore();
  const cx = recto ? g.size.width - inside / 2 : inside / 2;
  put(doc, String(month), cx, y + h / 2 + 2.6 * s, { font: 'narrow-bold', size: Math.min(7.5 * s, inside * 0.9), color: WHITE }, 'center');
}
