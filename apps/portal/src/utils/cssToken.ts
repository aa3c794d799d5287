/** A design token's value for a canvas (charts cannot read CSS variables), or the fallback outside a browser. */
export function cssToken(name: string, fallback: string): string {
  if (typeof document === 'undefined') return fallback;
  return getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;
}
