/**
 * Small helpers for writing SVG/XML text: escaping, coordinate formatting and element building.
 * Everything here is pure and locale-free, so the same input always gives byte-identical output.
 */

/** Characters XML 1.0 forbids in a document (C0 controls other than tab, LF, CR; U+FFFE, U+FFFF). */
const FORBIDDEN = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;

/** Lone UTF-16 surrogates: not characters, so no XML parser accepts them. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/** Escapes text for XML/HTML content and double- or single-quoted attributes; drops forbidden characters. */
export function escapeXml(text: string): string {
  return text
    .replace(FORBIDDEN, '')
    .replace(LONE_SURROGATE, '\uFFFD')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

/**
 * A coordinate in pixels with at most two decimals, trailing zeros dropped ("12.5", "3", "-0.25").
 * Non-finite input gives "0" so that NaN can never reach an attribute; callers filter points first.
 */
export function px(value: number): string {
  if (!Number.isFinite(value)) return '0';
  const clamped = Math.max(-1e6, Math.min(1e6, value));
  const text = clamped.toFixed(2).replace(/\.?0+$/, '');
  return text === '-0' ? '0' : text;
}

/** Attribute value: a string (escaped) or a number (formatted as a pixel coordinate). */
export type AttrValue = string | number;

/** Builds a start tag's attribute list in the given order; undefined values are left out. */
export function attrs(list: Record<string, AttrValue | undefined>): string {
  let out = '';
  for (const [name, value] of Object.entries(list)) {
    if (value === undefined) continue;
    out += ` ${name}="${typeof value === 'number' ? px(value) : escapeXml(value)}"`;
  }
  return out;
}

/** An element: self-closing when `children` is undefined, otherwise with the (already escaped) children. */
export function el(name: string, list: Record<string, AttrValue | undefined>, children?: string): string {
  return children === undefined ? `<${name}${attrs(list)}/>` : `<${name}${attrs(list)}>${children}</${name}>`;
}

/** A text element with escaped content. */
export function text(list: Record<string, AttrValue | undefined>, content: string): string {
  return el('text', list, escapeXml(content));
}

/** FNV-1a 32-bit hash (Fowler, Noll, Vo) as 8 hex digits: a deterministic id prefix per chart. */
export function hashId(input: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < input.length; i++) {
    h ^= input.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, '0');
}

/** Estimated width in pixels of `content` at `fontSize`: 0.55 em per character (common practice for sans-serif). */
export function textWidth(content: string, fontSize: number): number {
  return Array.from(content).length * fontSize * 0.55;
}
