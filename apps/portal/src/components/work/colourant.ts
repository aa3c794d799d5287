import { M2_PER_FT2, ML_PER_US_FL_OZ } from '@swardwise/domain';

/** A colourant as a form holds it: the product, and the label's rate and the area in the person's units. */
export interface ColourantEntry {
  product: string;
  rate: number | null;
  area: number | null;
}

/**
 * The colourant in the API's units: the rate in mL per m² (from fl oz per 1,000 ft² in imperial,
 * to three decimals), the area in m² (from ft², to one decimal); an empty rate or area is 0.
 */
export function colourantBody(entry: ColourantEntry, imperial: boolean) {
  const rate = entry.rate ?? 0;
  const area = entry.area ?? 0;
  return {
    product: entry.product,
    rateMlPerM2: Math.round((imperial ? (rate * ML_PER_US_FL_OZ) / (1000 * M2_PER_FT2) : rate) * 1000) / 1000,
    areaM2: Math.round((imperial ? area * M2_PER_FT2 : area) * 10) / 10,
  };
}
