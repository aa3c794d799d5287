/** Options of a select: a value and what the person reads. */
export interface Option<V extends string | number> {
  value: V;
  label: string;
}

/** Options from one of the domain's lists and its labels (`SPORTS`, `SPORT_LABELS`). */
export function optionsOf<V extends string | number>(values: readonly V[], label: Record<V, string> | ((value: V) => string)): Option<V>[] {
  return values.map((value) => ({ value, label: typeof label === 'function' ? label(value) : label[value] }));
}

/** Options from rows with an id and a name (districts, crews, sites). */
export function rowOptions(rows: readonly { id: number; name: string }[]): Option<number>[] {
  return rows.map((r) => ({ value: r.id, label: r.name }));
}
