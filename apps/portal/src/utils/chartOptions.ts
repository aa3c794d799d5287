/**
 * What the portal's echarts options share: design tokens read for the canvas, and axes that
 * carry their name (with its unit: every axis names one) in the middle, in the muted ink.
 */

/** Canvas cannot read CSS variables: a design token's value, or the fallback outside a browser. */
export function cssToken(name: string, fallback: string): string {
  if (typeof document === 'undefined') return fallback;
  return getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;
}

/** The muted ink every axis name is written in. */
export const axisInk = (): string => cssToken('--sw-ink-muted', '#525a54');

export interface AxisNameStyle {
  color: string;
  fontSize: number;
}

/**
 * An axis whose name stands in the middle, `gap` px off the axis; `rest` adds what the chart
 * needs beyond that (data, min and max, position, labels).
 */
export function namedAxis<R extends object>(type: 'value' | 'category' | 'time', name: string, gap: number, nameTextStyle: AxisNameStyle, rest?: R) {
  return { type, name, nameLocation: 'middle' as const, nameGap: gap, nameTextStyle, ...rest };
}
