/**
 * XML 1.0 text handling for GPX (W3C, "Extensible Markup Language (XML) 1.0", 5th ed.,
 * 2008): the five predefined entities and character references (section 4.1, 4.6), the
 * characters a document may carry (section 2.2, production [2] Char), and decimal numbers
 * written the way xsd:decimal allows (no exponent; W3C XML Schema Part 2, section 3.2.3).
 */

const PREDEFINED: Readonly<Record<string, string>> = {
  amp: '&',
  lt: '<',
  gt: '>',
  quot: '"',
  apos: "'",
};

/**
 * Decodes the predefined entities and numeric character references in one pass (so
 * `&amp;#65;` stays `&#65;`); anything else, such as an undeclared `&name;`, is left as is.
 */
export function decodeXmlText(s: string): string {
  if (!s.includes('&')) return s;
  return s.replace(/&(#x[0-9a-fA-F]{1,6}|#[0-9]{1,7}|[a-z]{2,4});/g, (whole, ref: string) => {
    if (ref.startsWith('#')) {
      const code = ref[1] === 'x' ? parseInt(ref.slice(2), 16) : parseInt(ref.slice(1), 10);
      return isXmlChar(code) ? String.fromCodePoint(code) : whole;
    }
    return PREDEFINED[ref] ?? whole;
  });
}

/** Production [2] Char of XML 1.0. */
function isXmlChar(code: number): boolean {
  return (
    code === 0x9 ||
    code === 0xa ||
    code === 0xd ||
    (code >= 0x20 && code <= 0xd7ff) ||
    (code >= 0xe000 && code <= 0xfffd) ||
    (code >= 0x10000 && code <= 0x10ffff)
  );
}

/**
 * Escapes text for element content and double-quoted attributes. Characters XML 1.0 cannot
 * carry at all (control characters, lone surrogates) become U+FFFD, the replacement character.
 */
export function escapeXml(s: string): string {
  let out = '';
  for (const ch of s) {
    const code = ch.codePointAt(0) as number;
    if (ch === '&') out += '&amp;';
    else if (ch === '<') out += '&lt;';
    else if (ch === '>') out += '&gt;';
    else if (ch === '"') out += '&quot;';
    else if (ch === "'") out += '&apos;';
    else if (code === 0xd) out += '&#13;';
    else out += isXmlChar(code) ? ch : '\uFFFD';
  }
  return out;
}

/**
 * A finite number as an xsd:decimal literal with enough digits to read back the same
 * double: the shortest round-trip form, expanded when JavaScript would use an exponent.
 */
export function xsdDecimal(x: number): string {
  const s = String(x === 0 ? 0 : x);
  if (!/e/i.test(s)) return s;
  const [mantissa = '', exp = '0'] = s.split(/e/i);
  const e = Number(exp);
  const negative = mantissa.startsWith('-');
  const digits = mantissa.replace('-', '').replace('.', '');
  const point = (mantissa.replace('-', '').split('.')[0] ?? '').length + e;
  let body: string;
  if (point <= 0) body = `0.${'0'.repeat(-point)}${digits}`;
  else if (point >= digits.length) body = digits + '0'.repeat(point - digits.length);
  else body = `${digits.slice(0, point)}.${digits.slice(point)}`;
  return negative ? `-${body}` : body;
}

/** Character index of the start of each line. */
export function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) starts.push(i + 1);
  return starts;
}

/** 1-based line of a character index (binary search over line starts). */
export function lineOf(starts: readonly number[], index: number): number {
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((starts[mid] as number) <= index) lo = mid;
    else hi = mid - 1;
  }
  return lo + 1;
}
