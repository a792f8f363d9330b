/** Labels of categorical axes: horizontal when they fit, rotated by 40° otherwise. */
import { el, escapeXml, px, text, textWidth } from './xml.js';
import { INK, TICK_FONT, type Area } from './frame.js';

const ROTATION = 40;

export interface CategoryLabels { svg: string; height: number }

/** Category labels: horizontal when they fit their band, otherwise rotated by 40° (shortened with "…" if needed). */
export function categoryLabels(categories: string[], area: Area, maxHeight: number): CategoryLabels {
  const band = (area.x1 - area.x0) / Math.max(1, categories.length);
  const widest = categories.reduce((w, c) => Math.max(w, textWidth(c, TICK_FONT)), 0);
  const y = area.y1 + 16;
  if (widest <= band - 6) {
    const svg = categories.map((c, j) => text({ x: area.x0 + band * (j + 0.5), y, 'text-anchor': 'middle', 'font-size': TICK_FONT, fill: INK }, c)).join('');
    return { svg, height: 22 };
  }
  const sin = Math.sin((ROTATION * Math.PI) / 180);
  const cos = Math.cos((ROTATION * Math.PI) / 180);
  const svg = categories.map((c, j) => {
    const x = area.x0 + band * (j + 0.5);
    const room = Math.min((maxHeight - 14) / sin, (x - 4) / cos);
    const shown = fit(c, room);
    const title = shown === c ? '' : el('title', {}, escapeXml(c));
    const attrs = { x, y: y - 4, 'text-anchor': 'end', 'font-size': TICK_FONT, fill: INK, transform: `rotate(-${ROTATION} ${px(x)} ${px(y - 4)})` };
    return el('text', attrs, title + escapeXml(shown));
  });
  return { svg: svg.join(''), height: Math.min(maxHeight, widest * sin + 14) };
}

/** `label` shortened with "…" to at most `room` pixels at the tick font. */
function fit(label: string, room: number): string {
  const chars = Array.from(label);
  const max = Math.max(1, Math.floor(room / (TICK_FONT * 0.55)));
  return chars.length <= max ? label : `${chars.slice(0, Math.max(1, max - 1)).join('')}…`;
}

