/**
 * Nesting depth of parsed JSON. Deeply nested input (a GeoJSON file of a million nested
 * arrays) parses fine but overflows the stack of every recursive step after it (schema
 * checks, serialising to the database), so it is refused up front. Iterative on purpose.
 */
export const MAX_JSON_DEPTH = 32;

/** True when `value` nests arrays or objects deeper than `limit` levels. */
export function nestedDeeperThan(value: unknown, limit: number = MAX_JSON_DEPTH): boolean {
  const stack: [unknown, number][] = [[value, 0]];
  while (stack.length) {
    const [node, depth] = stack.pop()!;
    if (node === null || typeof node !== 'object') continue;
    if (depth + 1 > limit) return true;
    for (const child of Array.isArray(node) ? node : Object.values(node)) {
      if (child !== null && typeof child === 'object') stack.push([child, depth + 1]);
    }
  }
  return false;
}
