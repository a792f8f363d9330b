/**
 * A small well-formedness checker for the SVG and HTML we write (XML 1.0, W3C Recommendation, 5th ed.:
 * §2.1 one root element, §3.1 matching start/end tags and quoted, unique attributes, §2.4 no raw `<`
 * and `&` only as an entity reference in text and attribute values, §2.2 allowed characters).
 * Also flags "NaN" and "Infinity" inside attribute values. Returns the problems found (empty = fine).
 */

const NAME = /^[A-Za-z_][\w:.-]*/;
const ENTITY = /^&(?:amp|lt|gt|quot|apos|#\d+|#x[0-9a-fA-F]+);/;
const FORBIDDEN = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/;

/** Problems with `&` in a piece of text or attribute value. */
function checkAmpersands(s: string, where: string, problems: string[]): void {
  for (let i = s.indexOf('&'); i >= 0; i = s.indexOf('&', i + 1)) {
    if (!ENTITY.test(s.slice(i))) problems.push(`${where}: bare & at "${s.slice(i, i + 12)}"`);
  }
}

interface Cursor {
  readonly doc: string;
  pos: number;
}

function skipSpace(c: Cursor): boolean {
  const start = c.pos;
  while (c.pos < c.doc.length && /\s/.test(c.doc[c.pos]!)) c.pos++;
  return c.pos > start;
}

/** Parses a start tag at c.pos (just after `<`); returns its name and whether it self-closes. */
function startTag(c: Cursor, problems: string[]): { name: string; selfClosing: boolean } | null {
  const name = NAME.exec(c.doc.slice(c.pos))?.[0];
  if (name === undefined) {
    problems.push(`bad tag name at ${c.pos}`);
    return null;
  }
  c.pos += name.length;
  const seen = new Set<string>();
  for (;;) {
    const spaced = skipSpace(c);
    if (c.doc.startsWith('/>', c.pos)) {
      c.pos += 2;
      return { name, selfClosing: true };
    }
    if (c.doc[c.pos] === '>') {
      c.pos += 1;
      return { name, selfClosing: false };
    }
    const attr = NAME.exec(c.doc.slice(c.pos))?.[0];
    if (!spaced || attr === undefined) {
      problems.push(`<${name}>: malformed attribute list at ${c.pos}`);
      return null;
    }
    if (seen.has(attr)) problems.push(`<${name}>: duplicate attribute ${attr}`);
    seen.add(attr);
    c.pos += attr.length;
    if (c.doc[c.pos] !== '=' || c.doc[c.pos + 1] !== '"') {
      problems.push(`<${name}>: attribute ${attr} not written as ="…"`);
      return null;
    }
    const end = c.doc.indexOf('"', c.pos + 2);
    if (end < 0) {
      problems.push(`<${name}>: unterminated attribute ${attr}`);
      return null;
    }
    const value = c.doc.slice(c.pos + 2, end);
    if (value.includes('<')) problems.push(`<${name}>: < in attribute ${attr}`);
    if (/NaN|Infinity/.test(value)) problems.push(`<${name}>: ${attr}="${value}"`);
    checkAmpersands(value, `<${name} ${attr}>`, problems);
    c.pos = end + 1;
  }
}

/** Checks that `doc` is one well-formed XML element (leading/trailing whitespace allowed). */
export function checkXml(doc: string): string[] {
  const problems: string[] = [];
  if (FORBIDDEN.test(doc)) problems.push('character not allowed in XML');
  const c: Cursor = { doc, pos: 0 };
  const stack: string[] = [];
  let roots = 0;
  while (c.pos < doc.length && problems.length < 20) {
    const lt = doc.indexOf('<', c.pos);
    const textEnd = lt < 0 ? doc.length : lt;
    const content = doc.slice(c.pos, textEnd);
    if (stack.length === 0 && content.trim() !== '') problems.push(`text outside the root: "${content.slice(0, 20)}"`);
    checkAmpersands(content, 'text', problems);
    if (lt < 0) break;
    c.pos = lt + 1;
    if (doc.startsWith('!--', c.pos)) {
      const end = doc.indexOf('-->', c.pos);
      c.pos = end < 0 ? doc.length : end + 3;
    } else if (doc[c.pos] === '/') {
      const close = /^\/([A-Za-z_][\w:.-]*)\s*>/.exec(doc.slice(c.pos));
      const open = stack.pop();
      if (close === null || close[1] !== open) problems.push(`end tag ${close?.[1] ?? '?'} does not match <${open ?? ''}>`);
      c.pos += close === null ? 1 : close[0].length;
    } else {
      const tag = startTag(c, problems);
      if (tag === null) break;
      if (stack.length === 0) roots++;
      if (!tag.selfClosing) stack.push(tag.name);
    }
  }
  if (stack.length > 0) problems.push(`unclosed: ${stack.join(' > ')}`);
  if (roots !== 1) problems.push(`${roots} root elements`);
  return problems;
}

/** Number of start tags `<name …>` whose attributes include class="cls". */
export function countClass(doc: string, name: string, cls: string): number {
  const re = new RegExp(`<${name}\\b[^>]*\\bclass="${cls}"`, 'g');
  return (doc.match(re) ?? []).length;
}
