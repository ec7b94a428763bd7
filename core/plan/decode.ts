/**
 * The bytes of a plan file as text. JSON exchanged between systems must be UTF-8 (IETF
 * RFC 8259, section 8.1); a UTF-8 byte-order mark is tolerated and dropped (the RFC allows
 * a parser to ignore it). UTF-16 and UTF-32 text — recognised by its byte-order mark
 * (Unicode Standard, section 23.8, table 23-4) or, without one, by the zero bytes that
 * ASCII characters leave in it — and byte sequences that are not well-formed UTF-8
 * (Unicode Standard, section 3.9, table 3-7) are refused with the line and column of the
 * first bad byte, never silently turned into U+FFFD. One pass checks, one decodes.
 */

export type DecodeResult = { ok: true; text: string } | { ok: false; message: string };

function encodingName(b: Uint8Array): string | undefined {
  const [b0, b1, b2, b3] = [b[0], b[1], b[2], b[3]];
  if (b0 === 0x00 && b1 === 0x00 && b2 === 0xfe && b3 === 0xff) return 'UTF-32 (big-endian)';
  if (b0 === 0xff && b1 === 0xfe && b2 === 0x00 && b3 === 0x00) return 'UTF-32 (little-endian)';
  if (b0 === 0xfe && b1 === 0xff) return 'UTF-16 (big-endian)';
  if (b0 === 0xff && b1 === 0xfe) return 'UTF-16 (little-endian)';
  // No mark: JSON text starts with an ASCII character, which UTF-16 pads with a zero byte.
  if (b.length >= 2 && b0 === 0x00 && b1 !== 0x00) return 'UTF-16 (big-endian, no byte-order mark)';
  if (b.length >= 2 && b0 !== 0x00 && b1 === 0x00) {
    return 'UTF-16 (little-endian, no byte-order mark)';
  }
  return undefined;
}

/** Length of the well-formed UTF-8 sequence at i (Unicode table 3-7), or 0 if it is not. */
function sequenceLength(b: Uint8Array, i: number): number {
  const c = b[i] as number;
  if (c < 0x80) return 1;
  const cont = (k: number, lo = 0x80, hi = 0xbf) => {
    const v = b[i + k];
    return v !== undefined && v >= lo && v <= hi;
  };
  if (c >= 0xc2 && c <= 0xdf) return cont(1) ? 2 : 0;
  if (c === 0xe0) return cont(1, 0xa0) && cont(2) ? 3 : 0;
  if ((c >= 0xe1 && c <= 0xec) || c === 0xee || c === 0xef) return cont(1) && cont(2) ? 3 : 0;
  if (c === 0xed) return cont(1, 0x80, 0x9f) && cont(2) ? 3 : 0;
  if (c === 0xf0) return cont(1, 0x90) && cont(2) && cont(3) ? 4 : 0;
  if (c >= 0xf1 && c <= 0xf3) return cont(1) && cont(2) && cont(3) ? 4 : 0;
  if (c === 0xf4) return cont(1, 0x80, 0x8f) && cont(2) && cont(3) ? 4 : 0;
  return 0;
}

const hex = (v: number) => `0x${v.toString(16).toUpperCase().padStart(2, '0')}`;

/** Decodes well-formed UTF-8 (after an optional byte-order mark) or says why not. */
export function decodePlanBytes(bytes: Uint8Array): DecodeResult {
  const other = encodingName(bytes);
  if (other !== undefined) {
    return {
      ok: false,
      message: `the file is ${other} text; plan files are UTF-8 (RFC 8259) — save it as UTF-8 and open it again`,
    };
  }
  const start = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  let line = 1;
  let column = 1;
  let ascii = true;
  for (let i = start; i < bytes.length;) {
    const c = bytes[i] as number;
    if (c === 0x0a) {
      line += 1;
      column = 1;
      i += 1;
      continue;
    }
    const n = c < 0x80 ? 1 : sequenceLength(bytes, i);
    if (n === 0) {
      return {
        ok: false,
        message: `byte ${hex(c)} at line ${line}, column ${column} is not UTF-8 text; plan files are UTF-8 (RFC 8259) — save it as UTF-8 and open it again`,
      };
    }
    if (n > 1) ascii = false;
    // Columns count UTF-16 code units, as the JSON syntax messages do.
    column += n === 4 ? 2 : 1;
    i += n;
  }
  return { ok: true, text: ascii ? asciiText(bytes, start) : utf8Text(bytes, start) };
}

const CHUNK = 8192;

function asciiText(b: Uint8Array, start: number): string {
  let out = '';
  for (let i = start; i < b.length; i += CHUNK) {
    out += String.fromCharCode(...b.subarray(i, Math.min(b.length, i + CHUNK)));
  }
  return out;
}

/** Decodes bytes already checked to be well-formed UTF-8. */
function utf8Text(b: Uint8Array, start: number): string {
  const units: number[] = [];
  let out = '';
  for (let i = start; i < b.length;) {
    const c = b[i] as number;
    let cp: number;
    if (c < 0x80) {
      cp = c;
      i += 1;
    } else if (c < 0xe0) {
      cp = ((c & 0x1f) << 6) | ((b[i + 1] as number) & 0x3f);
      i += 2;
    } else if (c < 0xf0) {
      cp =
        ((c & 0x0f) << 12) | (((b[i + 1] as number) & 0x3f) << 6) | ((b[i + 2] as number) & 0x3f);
      i += 3;
    } else {
      cp =
        ((c & 0x07) << 18) |
        (((b[i + 1] as number) & 0x3f) << 12) |
        (((b[i + 2] as number) & 0x3f) << 6) |
        ((b[i + 3] as number) & 0x3f);
      i += 4;
    }
    if (cp >= 0x10000) {
      cp -= 0x10000;
      units.push(0xd800 + (cp >> 10), 0xdc00 + (cp & 0x3ff));
    } else units.push(cp);
    if (units.length >= CHUNK) {
      out += String.fromCharCode(...units);
      units.length = 0;
    }
  }
  return out + String.fromCharCode(...units);
}
