import { InputError } from '../engine';

/**
 * How a stored model sits in the workbook: one custom XML part per model
 * (ECMA-376 Part 1, §22.5 "Custom XML Data Properties"; Excel JavaScript
 * API `workbook.customXmlParts`, ExcelApi 1.5), in our own namespace:
 *
 *   <spotloomModel xmlns="urn:spotloom:model:1" name="week-ahead">{"format":"spotloom-model",...}</spotloomModel>
 *
 * The model's JSON text is the element's character data, escaped as XML 1.0
 * requires (§2.4). These helpers are plain text functions so that they run
 * and are tested without the host. Reading is strict about the element and
 * lenient about what a host may add when it re-serialises a part (an XML
 * declaration, comments, a namespace prefix, character references); the
 * JSON itself is validated later by the engine's model schema.
 */
export const MODEL_XML_NAMESPACE = 'urn:spotloom:model:1';
const ROOT = 'spotloomModel';

// XML 1.0 §2.2 Char, less the characters JSON.stringify never leaves raw
const NOT_XML_CHAR = /[^\t\n\r\u0020-\uD7FF\uE000-\uFFFD\u{10000}-\u{10FFFF}]/u;

/**
 * @throws InputError when the text holds characters XML cannot carry
 * @example modelXml('a', '{"x":"<"}') // '<spotloomModel xmlns="urn:spotloom:model:1" name="a">{"x":"&lt;"}</spotloomModel>'
 */
export function modelXml(name: string, text: string): string {
  // U+FFFE and U+FFFF are not XML characters but may sit inside JSON strings: a JSON escape keeps their meaning
  const json = text.replace(/[\uFFFE\uFFFF]/g, (c) => `\\u${c.charCodeAt(0).toString(16)}`);
  if (NOT_XML_CHAR.test(json) || NOT_XML_CHAR.test(name)) {
    throw new InputError(`model "${clip(name)}" holds control characters that cannot be stored in the workbook`);
  }
  return `<${ROOT} xmlns="${MODEL_XML_NAMESPACE}" name="${escapeXml(name)}">${escapeXml(json)}</${ROOT}>`;
}

/**
 * The name and text of a model part, or undefined when the XML is not one
 * of ours (the caller skips such parts).
 */
export function readModelXml(xml: string): { name: string; text: string } | undefined {
  const body = xml
    .replace(/^\uFEFF/, '')
    .replace(/^\s*<\?xml[^?]*\?>/, '')
    .replace(/<!--[\s\S]*?-->/g, '')
    .trim();
  const m = /^<(?:([A-Za-z_][\w.-]*):)?spotloomModel(\s[^>]*)?>([\s\S]*)<\/(?:([A-Za-z_][\w.-]*):)?spotloomModel\s*>$/.exec(body);
  if (!m || (m[1] ?? '') !== (m[4] ?? '')) return undefined;
  const attrs = m[2] ?? '';
  const ns = attribute(attrs, m[1] ? `xmlns:${m[1]}` : 'xmlns');
  const name = attribute(attrs, 'name');
  if (ns !== MODEL_XML_NAMESPACE || name === undefined) return undefined;
  const content = m[3].replace(/<!\[CDATA\[([\s\S]*?)\]\]>/g, (_, raw: string) => escapeXml(raw));
  if (/</.test(content)) return undefined; // child elements: not a model part
  const text = unescapeXml(content);
  return text === undefined ? undefined : { name, text };
}

function attribute(attrs: string, key: string): string | undefined {
  const m = new RegExp(`(?:^|\\s)${key.replace(/[.:]/g, '\\$&')}\\s*=\\s*(?:"([^"]*)"|'([^']*)')`).exec(attrs);
  if (!m) return undefined;
  return unescapeXml(m[1] ?? m[2]);
}

export function escapeXml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!);
}

const NAMED: Record<string, string> = { lt: '<', gt: '>', amp: '&', quot: '"', apos: "'" };

/** @returns undefined for an unknown entity or a reference to a non-character */
function unescapeXml(s: string): string | undefined {
  let bad = false;
  const out = s.replace(/&(#x[0-9A-Fa-f]+|#\d+|[A-Za-z]+);|&/g, (all, ref: string | undefined) => {
    if (ref === undefined) { bad = true; return all; }
    if (ref[0] !== '#') {
      if (!(ref in NAMED)) bad = true;
      return NAMED[ref] ?? all;
    }
    const code = ref[1] === 'x' ? parseInt(ref.slice(2), 16) : parseInt(ref.slice(1), 10);
    if (!(code <= 0x10ffff) || NOT_XML_CHAR.test(String.fromCodePoint(code))) { bad = true; return all; }
    return String.fromCodePoint(code);
  });
  return bad ? undefined : out;
}

function clip(s: string): string {
  return s.length > 40 ? `${s.slice(0, 40)}…` : s;
}
