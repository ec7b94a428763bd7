/**
 * A one-pass, event-driven reader of XML 1.0 (W3C, "Extensible Markup Language (XML) 1.0",
 * 5th ed., 2008) for GPX import: start tags with their attributes, end tags and the text
 * between them, reported to a handler without building a tree. It checks what makes a
 * document well-formed for our purpose — one root element, matching start and end tags
 * (section 3, WFC "Element Type Match"), names (production [5]), quoted attribute values
 * without `<` (production [10]) given once per tag (WFC "Unique Att Spec"), references
 * spelled `&name;` or `&#…;` (production [67]) — and skips comments, processing instructions
 * and the XML declaration; CDATA sections are text. Declarations (`<!DOCTYPE`, `<!ENTITY`)
 * are the caller's to refuse before scanning. Errors carry the offset of the offending
 * character; lineColumn turns it into line and column only when one is reported.
 */

export interface XmlHandler {
  /** A start tag; `attrs` holds `count` name/raw-value pairs, reused between calls. */
  open(name: string, attrs: XmlAttributes, depth: number, offset: number): void;
  /** The end of the element opened at `depth` (also for `<a/>`). */
  close(name: string, depth: number): void;
  /** Character data directly inside the element at `depth`: text.slice(start, end). */
  text(start: number, end: number, depth: number): void;
}

export class XmlAttributes {
  names: string[] = [];
  /** Offsets of each raw value in the text: text.slice(starts[k], ends[k]). */
  starts: number[] = [];
  ends: number[] = [];
  count = 0;
  constructor(private readonly text: string) {}
  /** Index of an attribute, or −1. */
  find(name: string): number {
    for (let i = 0; i < this.count; i++) if (this.names[i] === name) return i;
    return -1;
  }
  /** The raw (not entity-decoded) value of an attribute, if present. */
  get(name: string): string | undefined {
    const i = this.find(name);
    return i < 0 ? undefined : this.value(i);
  }
  value(i: number): string {
    return this.text.slice(this.starts[i], this.ends[i]);
  }
}

export class XmlSyntaxError extends Error {
  constructor(
    message: string,
    readonly offset: number,
  ) {
    super(message);
  }
}

const isSpace = (c: number) => c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d;
const isNameStart = (c: number) =>
  (c >= 0x61 && c <= 0x7a) || (c >= 0x41 && c <= 0x5a) || c === 0x5f || c === 0x3a || c >= 0xc0;
const isNameChar = (c: number) =>
  isNameStart(c) || (c >= 0x30 && c <= 0x39) || c === 0x2d || c === 0x2e || c === 0xb7;
const REFERENCE = /&(#x[0-9a-fA-F]+|#[0-9]+|[A-Za-z_:][\w.:-]*);/y;

/** 1-based line and column of an offset (LF ends a line). */
export function lineColumnAt(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let start = 0;
  for (let i = text.indexOf('\n'); i !== -1 && i < offset; i = text.indexOf('\n', i + 1)) {
    line += 1;
    start = i + 1;
  }
  return { line, column: offset - start + 1 };
}

/**
 * Scans the whole text, calling the handler; throws XmlSyntaxError at the first fault.
 * `onProgress` gets the fraction read about every megabyte.
 */
export function scanXml(
  text: string,
  handler: XmlHandler,
  onProgress?: (fraction: number) => void,
): void {
  const n = text.length;
  const stack: string[] = [];
  const openedAt: number[] = [];
  const attrs = new XmlAttributes(text);
  // Names repeat (trkpt, ele, time …): reuse the string instead of cutting it out again.
  const known: string[] = [];
  let roots = 0;
  let i = 0;
  let nextReport = 1 << 20;
  const fail = (message: string, at: number): never => {
    throw new XmlSyntaxError(message, at);
  };
  // The next '&' at or after a position, found once and reused: scanning stays O(n).
  let amp = -2;
  const nextAmp = (from: number): number => {
    if (amp !== -1 && amp < from) amp = text.indexOf('&', from);
    return amp;
  };
  const checkReferences = (from: number, to: number) => {
    for (let a = nextAmp(from); a !== -1 && a < to; a = nextAmp(a + 1)) {
      REFERENCE.lastIndex = a;
      if (!REFERENCE.test(text) || REFERENCE.lastIndex > to) {
        fail("'&' must start a reference such as &amp; or &#38;", a);
      }
    }
  };
  const readName = (): string => {
    const start = i;
    if (i >= n || !isNameStart(text.charCodeAt(i))) {
      fail(i >= n ? 'the text ends inside a tag' : `'${text[i]}' cannot start a name`, i);
    }
    i += 1;
    while (i < n && isNameChar(text.charCodeAt(i))) i += 1;
    const length = i - start;
    for (const k of known) if (k.length === length && text.startsWith(k, start)) return k;
    const name = text.slice(start, i);
    if (known.length < 32) known.push(name);
    return name;
  };
  const skipSpace = () => {
    while (i < n && isSpace(text.charCodeAt(i))) i += 1;
  };

  while (i < n) {
    if (onProgress !== undefined && i >= nextReport) {
      onProgress(i / n);
      nextReport = i + (1 << 20);
    }
    const lt = text.indexOf('<', i);
    const end = lt === -1 ? n : lt;
    if (end > i) {
      if (stack.length === 0) {
        for (let k = i; k < end; k++) {
          if (!isSpace(text.charCodeAt(k))) fail('text outside the root element', k);
        }
      } else {
        checkReferences(i, end);
        handler.text(i, end, stack.length);
      }
    }
    if (lt === -1) break;
    i = lt + 1;
    const c = text.charCodeAt(i);
    if (c === 0x3f) {
      // <? … ?>: the XML declaration or a processing instruction
      const close = text.indexOf('?>', i + 1);
      if (close === -1) fail('a processing instruction <? … is never closed with ?>', lt);
      i = close + 2;
    } else if (c === 0x21) {
      if (text.startsWith('!--', i)) {
        const close = text.indexOf('-->', i + 3);
        if (close === -1) fail('a comment <!-- … is never closed with -->', lt);
        i = close + 3;
      } else if (text.startsWith('![CDATA[', i)) {
        const close = text.indexOf(']]>', i + 8);
        if (close === -1) fail('a CDATA section is never closed with ]]>', lt);
        if (stack.length === 0) fail('a CDATA section outside the root element', lt);
        handler.text(i + 8, close, stack.length);
        i = close + 3;
      } else fail("'<!' must start a comment or a CDATA section here", lt);
    } else if (c === 0x2f) {
      i += 1;
      const top = stack[stack.length - 1];
      // The usual case compares in place, without cutting the name out of the text.
      const same =
        top !== undefined &&
        text.startsWith(top, i) &&
        !isNameChar(text.charCodeAt(i + top.length));
      let name: string;
      if (same) {
        name = top;
        i += top.length;
      } else name = readName();
      skipSpace();
      if (text.charCodeAt(i) !== 0x3e) fail(`the end tag '${name}' is not closed with '>'`, i);
      i += 1;
      if (top === undefined) fail(`the end tag '${name}' has no start tag`, lt);
      if (!same) {
        const at = lineColumnAt(text, openedAt[openedAt.length - 1] as number);
        fail(
          `the end tag '${name}' does not match the open element '${top}' (opened at line ${at.line}, column ${at.column})`,
          lt,
        );
      }
      handler.close(name, stack.length);
      stack.pop();
      openedAt.pop();
    } else {
      const name = readName();
      attrs.count = 0;
      for (;;) {
        const before = i;
        skipSpace();
        if (i >= n) fail(`the tag '${name}' is never closed`, lt);
        const d = text.charCodeAt(i);
        if (d === 0x3e || d === 0x2f) break;
        if (i === before) fail(`'${text[i] ?? ''}' is not expected in the tag '${name}'`, i);
        const attr = readName();
        skipSpace();
        if (text.charCodeAt(i) !== 0x3d) fail(`the attribute '${attr}' has no value`, i);
        i += 1;
        skipSpace();
        const q = text.charCodeAt(i);
        if (q !== 0x22 && q !== 0x27) fail(`the value of '${attr}' must be quoted`, i);
        const close = text.indexOf(q === 0x22 ? '"' : "'", i + 1);
        if (close === -1) fail(`the value of '${attr}' is never closed`, i);
        const lt2 = text.indexOf('<', i + 1);
        if (lt2 !== -1 && lt2 < close) fail(`the value of '${attr}' contains '<'`, lt2);
        checkReferences(i + 1, close);
        for (let k = 0; k < attrs.count; k++) {
          if (attrs.names[k] === attr) fail(`the attribute '${attr}' is given twice`, before);
        }
        attrs.names[attrs.count] = attr;
        attrs.starts[attrs.count] = i + 1;
        attrs.ends[attrs.count] = close;
        attrs.count += 1;
        i = close + 1;
      }
      const selfClosing = text.charCodeAt(i) === 0x2f;
      if (selfClosing) i += 1;
      if (text.charCodeAt(i) !== 0x3e) {
        fail(i >= n ? `the tag '${name}' is never closed` : `'/' must be followed by '>'`, i);
      }
      i += 1;
      if (stack.length === 0) {
        roots += 1;
        if (roots > 1) fail('a second root element; an XML document has exactly one', lt);
      }
      stack.push(name);
      openedAt.push(lt);
      handler.open(name, attrs, stack.length, lt);
      if (selfClosing) {
        handler.close(name, stack.length);
        stack.pop();
        openedAt.pop();
      }
    }
  }
  if (stack.length > 0) {
    fail(
      `the element '${stack[stack.length - 1]}' is never closed`,
      openedAt[openedAt.length - 1] as number,
    );
  }
  if (roots === 0) fail('no root element', n);
}
