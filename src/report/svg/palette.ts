/**
 * Colours, dash patterns and marker shapes for chart series, and the sequential scale of heat maps.
 *
 * Series colours: the Okabe–Ito palette (Okabe & Ito 2008, "Color Universal Design — how to make
 * figures and presentations that are friendly to colorblind people"), distinguishable under the
 * common colour-vision deficiencies. Series also differ by dash pattern and marker shape, so they
 * stay apart in grey-scale print and for readers who cannot tell the colours apart.
 */
import { el, px } from './xml.js';

/** The eight Okabe–Ito colours by their published names. */
export const OKABE_ITO = {
  black: '#000000',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
} as const;

/** Series order: strongest contrast on white first; yellow (low contrast on white) last. */
export const SERIES_COLOURS: readonly string[] = [
  OKABE_ITO.blue,
  OKABE_ITO.vermillion,
  OKABE_ITO.bluishGreen,
  OKABE_ITO.reddishPurple,
  OKABE_ITO.orange,
  OKABE_ITO.skyBlue,
  OKABE_ITO.black,
  OKABE_ITO.yellow,
];

/** stroke-dasharray per series ('' = solid), in pixels. */
export const DASHES: readonly string[] = ['', '7 3', '2 2', '9 3 2 3', '4 3', '12 3 3 3', '1 3', '6 2 2 2 2 2'];

export type MarkerShape = 'circle' | 'square' | 'triangle' | 'diamond' | 'triangle-down' | 'hexagon' | 'plus' | 'cross';

/** Marker shape per series. */
export const MARKERS: readonly MarkerShape[] = ['circle', 'square', 'triangle', 'diamond', 'triangle-down', 'hexagon', 'plus', 'cross'];

export interface SeriesStyle {
  readonly colour: string;
  readonly dash: string;
  readonly marker: MarkerShape;
}

/** The style of series `index` (cycles after eight series). */
export function seriesStyle(index: number): SeriesStyle {
  const i = ((index % 8) + 8) % 8;
  return { colour: SERIES_COLOURS[i] ?? OKABE_ITO.black, dash: DASHES[i] ?? '', marker: MARKERS[i] ?? 'circle' };
}

/** Unit-radius outlines, scaled by the marker size; y grows downwards as in SVG. */
const OUTLINES: Record<Exclude<MarkerShape, 'circle'>, ReadonlyArray<readonly [number, number]>> = {
  square: [[-0.85, -0.85], [0.85, -0.85], [0.85, 0.85], [-0.85, 0.85]],
  triangle: [[0, -1.15], [1, 0.6], [-1, 0.6]],
  diamond: [[0, -1.2], [1.05, 0], [0, 1.2], [-1.05, 0]],
  'triangle-down': [[0, 1.15], [1, -0.6], [-1, -0.6]],
  hexagon: [[0, -1.1], [0.95, -0.55], [0.95, 0.55], [0, 1.1], [-0.95, 0.55], [-0.95, -0.55]],
  plus: [[-0.35, -1.1], [0.35, -1.1], [0.35, -0.35], [1.1, -0.35], [1.1, 0.35], [0.35, 0.35], [0.35, 1.1], [-0.35, 1.1], [-0.35, 0.35], [-1.1, 0.35], [-1.1, -0.35], [-0.35, -0.35]],
  cross: [[-0.78, -1.03], [0, -0.25], [0.78, -1.03], [1.03, -0.78], [0.25, 0], [1.03, 0.78], [0.78, 1.03], [0, 0.25], [-0.78, 1.03], [-1.03, 0.78], [-0.25, 0], [-1.03, -0.78]],
};

/** A filled marker centred at (cx, cy) with radius `r` pixels, outlined in white to stand out on lines. */
export function marker(shape: MarkerShape, cx: number, cy: number, r: number, colour: string): string {
  const common = { fill: colour, stroke: '#ffffff', 'stroke-width': '0.75' };
  if (shape === 'circle') return el('circle', { cx, cy, r, ...common });
  const points = OUTLINES[shape].map(([x, y]) => `${px(cx + x * r)},${px(cy + y * r)}`).join(' ');
  return el('polygon', { points, ...common });
}

/**
 * Viridis (Smith & van der Walt 2015, "A Better Default Colormap for Matplotlib", SciPy 2015): a
 * perceptually uniform sequential map, monotonic in lightness and readable by colour-blind viewers.
 * Stops: entries round(k·255/16), k = 0…16, of matplotlib's 256-entry viridis table, as sRGB hex.
 */
export const VIRIDIS_STOPS: readonly string[] = [
  '#440154', '#48186a', '#472d7b', '#424086', '#3b528b', '#33638d', '#2c728e', '#26828e', '#21918c',
  '#1f9f88', '#27ad81', '#3dbc74', '#5cc863', '#81d34d', '#aadc32', '#d5e21a', '#fde725',
];

function channels(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

function toHex(rgb: readonly number[]): string {
  return `#${rgb.map((c) => Math.round(c).toString(16).padStart(2, '0')).join('')}`;
}

/** Colour for t ∈ [0, 1] (clamped; NaN → 0): linear sRGB-space interpolation between viridis stops. */
export function sequentialColour(t: number): string {
  const u = Number.isFinite(t) ? Math.min(1, Math.max(0, t)) : 0;
  const pos = u * (VIRIDIS_STOPS.length - 1);
  const i = Math.min(VIRIDIS_STOPS.length - 2, Math.floor(pos));
  const f = pos - i;
  const a = channels(VIRIDIS_STOPS[i] ?? '#000000');
  const b = channels(VIRIDIS_STOPS[i + 1] ?? '#000000');
  return toHex(a.map((c, k) => c + (b[k]! - c) * f));
}

/** Relative luminance (WCAG 2.x definition) of a #rrggbb colour, for choosing black or white text. */
export function luminance(hex: string): number {
  const lin = channels(hex).map((c) => {
    const s = c / 255;
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * lin[0]! + 0.7152 * lin[1]! + 0.0722 * lin[2]!;
}

/**
 * Text colour with the better WCAG contrast on `background`: black or white. Since either reaches at
 * least 4.58:1 on any background, cell text always meets WCAG 2.1 AA (SC 1.4.3, 4.5:1).
 */
export function textColourOn(background: string): string {
  const l = luminance(background);
  return 1.05 / (l + 0.05) >= (l + 0.05) / 0.05 ? '#ffffff' : '#000000';
}
