/**
 * Where a JSON text goes wrong, as line and column. JavaScript engines do not always report
 * a position in JSON.parse errors, so this scans the text against the JSON grammar
 * (ECMA-404, 2nd edition) with an explicit stack (no recursion, any nesting depth) and
 * returns the offset of the first character that cannot continue a valid document.
 */

const WS = new Set([' ', '\t', '\n', '\r']);

/** Offset of the first offending character (text.length when the text ends early); -1 if valid. */
export function jsonErrorOffset(text: string): number {
  const n = text.length;
  let i = 0;
  const stack: string[] = [];
  const skipWs = (): void => {
    while (i < n && WS.has(text[i] as string)) i += 1;
  };
  const digits = (): boolean => {
    const start = i;
    while (i < n && text[i]! >= '0' && text[i]! <= '9') i += 1;
    return i > start;
  };
  // Each scanner returns true when it consumed a complete token starting at i.
  const scanString = (): boolean => {
    if (text[i] !== '"') return false;
    i += 1;
    while (i < n) {
      const c = text[i]!;
      if (c === '"') {
        i += 1;
        return true;
      }
      if (c < ' ') return false;
      if (c === '\\') {
        const e = text[i + 1];
        if (e === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 2, i + 6))) {
            i += 2;
            return false;
          }
          i += 6;
        } else if (e !== undefined && '"\\/bfnrt'.includes(e)) i += 2;
        else {
          i += 1;
          return false;
        }
      } else i += 1;
    }
    return false;
  };
  const scanNumber = (): boolean => {
    if (text[i] === '-') i += 1;
    if (text[i] === '0') i += 1;
    else if (!digits()) return false;
    if (text[i] === '.') {
      i += 1;
      if (!digits()) return false;
    }
    if (text[i] === 'e' || text[i] === 'E') {
      i += 1;
      if (text[i] === '+' || text[i] === '-') i += 1;
      if (!digits()) return false;
    }
    return true;
  };
  const scanWord = (word: string): boolean => {
    for (const ch of word) {
      if (text[i] !== ch) return false;
      i += 1;
    }
    return true;
  };
  /** A key and its colon inside an object. */
  const scanKey = (): boolean => {
    skipWs();
    if (!scanString()) return false;
    skipWs();
    if (text[i] !== ':') return false;
    i += 1;
    return true;
  };

  let expectValue = true;
  for (;;) {
    skipWs();
    if (expectValue) {
      const c = text[i];
      let ok: boolean;
      if (c === '{' || c === '[') {
        i += 1;
        skipWs();
        if (text[i] === (c === '{' ? '}' : ']')) {
          i += 1;
          expectValue = false;
          continue;
        }
        stack.push(c);
        if (c === '{' && !scanKey()) return Math.min(i, n);
        continue;
      } else if (c === '"') ok = scanString();
      else if (c === '-' || (c !== undefined && c >= '0' && c <= '9')) ok = scanNumber();
      else if (c === 't') ok = scanWord('true');
      else if (c === 'f') ok = scanWord('false');
      else if (c === 'n') ok = scanWord('null');
      else ok = false;
      if (!ok) return Math.min(i, n);
      expectValue = false;
      continue;
    }
    const top = stack[stack.length - 1];
    if (top === undefined) return i < n ? i : -1;
    const c = text[i];
    if (c === ',') {
      i += 1;
      if (top === '{' && !scanKey()) return Math.min(i, n);
      expectValue = true;
    } else if ((top === '{' && c === '}') || (top === '[' && c === ']')) {
      stack.pop();
      i += 1;
    } else return Math.min(i, n);
  }
}

/** 1-based line and column (in UTF-16 code units) of an offset; CR LF counts as one break. */
export function lineColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  const end = Math.min(Math.max(offset, 0), text.length);
  for (let i = 0; i < end; i += 1) {
    if (text[i] === '\n') {
      line += 1;
      lineStart = i + 1;
    }
  }
  return { line, column: end - lineStart + 1 };
}

/**
 * The engine's JSON.parse complaint without its copy of the text and its own position,
 * control characters escaped, at most 80 characters.
 */
export function cleanJsonMessage(message: string): string {
  const m = message
    .replace(/,\s*".*"\s*is not valid JSON\s*$/s, '')
    .replace(/\s*in JSON at position \d+.*$/s, '')
    .replace(/\s*\(line \d+ column \d+\)\s*$/, '')
    .trim();
  if (m.length === 0) return 'syntax error';
  const shown = printable(m);
  return shown.length > 80 ? `${shown.slice(0, 79)}…` : shown;
}

export interface DuplicateKey {
  /** JSON path of the repeated member, e.g. `aircraft.polar.CD0`. */
  path: string;
  /** Offsets of the first and the repeated key. */
  first: number;
  again: number;
}

/**
 * The first key given twice in one object of a valid JSON text (JSON.parse keeps the last
 * silently; RFC 8259 section 4 says names SHOULD be unique, and a plan file is refused when
 * they are not). Keys compare after unescaping, so "a" and "\u0061" are the same. One pass.
 */
export function duplicateKey(text: string): DuplicateKey | undefined {
  // Per open container: its key set (objects) or null (arrays), and the current path part.
  const keys: (Map<string, number> | null)[] = [];
  const parts: (string | number)[] = [];
  let expectKey = false;
  const n = text.length;
  for (let i = 0; i < n; i++) {
    const c = text.charCodeAt(i);
    if (c === 0x22) {
      const start = i;
      let escaped = false;
      for (i += 1; i < n; i++) {
        const d = text.charCodeAt(i);
        if (d === 0x5c) {
          i += 1;
          escaped = true;
        } else if (d === 0x22) break;
      }
      if (expectKey) {
        const raw = text.slice(start + 1, i);
        const key = escaped ? (JSON.parse(`"${raw}"`) as string) : raw;
        const set = keys[keys.length - 1] as Map<string, number>;
        const first = set.get(key);
        parts[parts.length - 1] = key;
        if (first !== undefined) return { path: pathOf(parts), first, again: start };
        set.set(key, start);
        expectKey = false;
      }
    } else if (c === 0x7b) {
      keys.push(new Map());
      parts.push('');
      expectKey = true;
    } else if (c === 0x5b) {
      keys.push(null);
      parts.push(0);
    } else if (c === 0x7d || c === 0x5d) {
      keys.pop();
      parts.pop();
      expectKey = false;
    } else if (c === 0x2c) {
      const top = keys[keys.length - 1];
      if (top === null) parts[parts.length - 1] = (parts[parts.length - 1] as number) + 1;
      else expectKey = true;
    }
  }
  return undefined;
}

function pathOf(parts: readonly (string | number)[]): string {
  return parts.map(String).join('.');
}

/**
 * At most `width` characters of the line around an offset, with control characters shown
 * as escapes, so a message never carries raw file text across lines.
 */
export function excerptAt(text: string, offset: number, width = 32): string {
  const at = Math.min(Math.max(offset, 0), text.length);
  let from = text.lastIndexOf('\n', at - 1) + 1;
  let to = text.indexOf('\n', at);
  if (to < 0) to = text.length;
  const half = Math.floor(width / 2);
  const lead = Math.max(from, at - half) > from;
  from = Math.max(from, at - half);
  const tail = to > from + width;
  to = Math.min(to, from + width);
  return `${lead ? '…' : ''}${printable(text.slice(from, to).replace(/\r$/, ''))}${tail ? '…' : ''}`;
}

/** Control characters as \uXXXX escapes. */
export function printable(s: string): string {
  return s.replace(
    // eslint-disable-next-line no-control-regex -- matching control characters is the point
    /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g,
    (ch) => `\\u${ch.charCodeAt(0).toString(16).padStart(4, '0')}`,
  );
}
