/**
 * Greedy placement of the route view's texts so they do not cover each other: each segment
 * tag slides along its segment, each waypoint name tries the four corners around its point
 * and keeps off the segments, and the first spot that overlaps nothing placed before wins
 * (else the least-covered one).
 * Text widths are estimated from the character count (about 6.5 units a character at 11 px).
 */
export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface PlacedLabel {
  x: number;
  /** Baseline of the text. */
  y: number;
  anchor: 'start' | 'end';
}

const CHAR_W = 6.5;
const LINE_H = 13;

function overlap(a: Box, b: Box): number {
  const w = Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x);
  const h = Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y);
  return w > 0 && h > 0 ? w * h : 0;
}

function outside(b: Box, frame: { width: number; height: number }): number {
  const w = Math.max(0, -b.x) + Math.max(0, b.x + b.w - frame.width);
  const h = Math.max(0, -b.y) + Math.max(0, b.y + b.h - frame.height);
  return (w + h) * LINE_H;
}

/** The candidate covering least of what is placed (and of the frame's outside); it joins `taken`. */
function pick<T>(
  candidates: { box: Box; value: T }[],
  taken: Box[],
  frame: { width: number; height: number },
): T {
  let best = candidates[0] as { box: Box; value: T };
  let bestCost = Infinity;
  for (const c of candidates) {
    const cost = taken.reduce((s, t) => s + overlap(c.box, t), 0) + outside(c.box, frame);
    if (cost < bestCost) {
      best = c;
      bestCost = cost;
      if (cost === 0) break;
    }
  }
  taken.push(best.box);
  return best.value;
}

export function tagWidth(text: string): number {
  return 10 + 7 * text.length;
}

export function placeTexts(
  points: readonly { x: number; y: number; text: string }[],
  tags: readonly { x1: number; y1: number; x2: number; y2: number; text: string }[],
  frame: { width: number; height: number },
): { labels: PlacedLabel[]; tags: { x: number; y: number }[] } {
  const taken: Box[] = points.map((p) => ({ x: p.x - 5, y: p.y - 5, w: 10, h: 10 }));
  const placedTags = tags.map((t) => {
    const w = tagWidth(t.text);
    return pick(
      [0.5, 0.35, 0.65, 0.22, 0.78].map((f) => {
        const x = t.x1 + (t.x2 - t.x1) * f;
        const y = t.y1 + (t.y2 - t.y1) * f;
        return { box: { x: x - w / 2, y: y - 8, w, h: 16 }, value: { x, y } };
      }),
      taken,
      frame,
    );
  });
  // The segments as a chain of small boxes, so that names keep off the lines.
  for (const t of tags) {
    const n = Math.ceil(Math.hypot(t.x2 - t.x1, t.y2 - t.y1) / 6);
    for (let k = 1; k < n; k++) {
      const x = t.x1 + ((t.x2 - t.x1) * k) / n;
      const y = t.y1 + ((t.y2 - t.y1) * k) / n;
      taken.push({ x: x - 2, y: y - 2, w: 4, h: 4 });
    }
  }
  const labels = points.map((p) => {
    const w = CHAR_W * p.text.length;
    const corner = (dx: number, dy: number, anchor: 'start' | 'end') => ({
      box: {
        x: anchor === 'start' ? p.x + dx : p.x + dx - w,
        y: p.y + dy - LINE_H + 3,
        w,
        h: LINE_H,
      },
      value: { x: p.x + dx, y: p.y + dy, anchor },
    });
    return pick(
      [
        corner(7, -6, 'start'),
        corner(7, 15, 'start'),
        corner(-7, -6, 'end'),
        corner(-7, 15, 'end'),
      ],
      taken,
      frame,
    );
  });
  return { labels, tags: placedTags };
}
