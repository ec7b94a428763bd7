/**
 * Reading and writing a plan by dotted path (`aircraft.mass.empty_kg`, `legs.2.end.distance_m`),
 * the same paths the plan loader names in its issues. Writes copy only along the path, so
 * history snapshots stay cheap and unchanged branches stay shared.
 */

export type PathKey = string | number;

export function splitPath(path: string): PathKey[] {
  if (path === '') return [];
  return path.split('.').map((part) => (/^\d+$/.test(part) ? Number(part) : part));
}

export function joinPath(...parts: PathKey[]): string {
  return parts.filter((p) => p !== '').join('.');
}

export function getAtPath(root: unknown, path: string): unknown {
  let node: unknown = root;
  for (const key of splitPath(path)) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<PathKey, unknown>)[key];
  }
  return node;
}

/** A copy of `root` with `value` at `path`; `undefined` removes the key (optional fields). */
export function setAtPath<T>(root: T, path: string, value: unknown): T {
  return setKeys(root, splitPath(path), value) as T;
}

function setKeys(node: unknown, keys: PathKey[], value: unknown): unknown {
  const [head, ...rest] = keys;
  if (head === undefined) return value;
  if (Array.isArray(node)) {
    if (typeof head !== 'number' || head < 0 || head >= node.length) {
      throw new RangeError(`no element ${String(head)} in a list of ${node.length}`);
    }
    const copy = node.slice();
    copy[head] = setKeys(node[head], rest, value);
    return copy;
  }
  const record = node !== null && typeof node === 'object' ? (node as Record<string, unknown>) : {};
  const copy: Record<string, unknown> = { ...record };
  const next = setKeys(record[head], rest, value);
  if (next === undefined) delete copy[head];
  else copy[head] = next;
  return copy;
}

/** True when `prefix` is `path` or one of its ancestors (`legs.2` covers `legs.2.end.distance_m`). */
export function pathCovers(prefix: string, path: string): boolean {
  return path === prefix || path.startsWith(`${prefix}.`);
}
