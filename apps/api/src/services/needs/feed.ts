/** The feed plan card: the season's year, split by monthly growth potential. */
import { CAUTIONS, annualNitrogen, monthOf, monthlyNSplitByGp, planNApplications, productForArea } from '@swardwise/domain';
import { input, sum, type NeedsBasis } from './basis.ts';

/** Mean growth potential of each month of `year` (null for a month without weather). */
function monthlyMeanGp(b: NeedsBasis, year: number): (number | null)[] {
  const monthGp: (number | null)[] = new Array(12).fill(null);
  const monthDays = new Array(12).fill(0);
  b.prepared.dates.forEach((d, i) => {
    if (Number(d.slice(0, 4)) !== year) return;
    const m = monthOf(d) - 1;
    monthGp[m] = (monthGp[m] ?? 0) + (b.daily.gp[i] as number);
    monthDays[m]++;
  });
  return monthGp.map((g, m) => (g === null ? null : g / monthDays[m]));
}

export function feedCard(b: NeedsBasis, irrigated: boolean) {
  const { field, level, standards, std, params, prepared, weekStart } = b;
  const year = Number(prepared.startDate.slice(0, 4));
  const annual = annualNitrogen({ grass: field.grass, level, clippings: field.clippings, irrigated }, standards);
  const monthly = monthlyNSplitByGp(annual.gPerM2, monthlyMeanGp(b, year));
  const product = params.fertiliserProduct;
  const applications = planNApplications(monthly, { slowReleaseShare: product.slowReleaseShare, year, params }).map((a) => {
    const need = productForArea(a.nGPerM2, product, field.areaM2, params.fertiliserBagKg, params.costs.fertiliserPerKg);
    return { date: a.date!, month: a.month, nGPerM2: a.nGPerM2, productGPerM2: need.productGPerM2, productKg: need.productKg, bags: need.bags };
  });
  return {
    annualNGPerM2: annual.gPerM2,
    reasons: annual.reasons,
    monthlyNGPerM2: monthly,
    product: { analysis: `${product.n}-${product.p}-${product.k}`, slowReleaseShare: product.slowReleaseShare, bagKg: params.fertiliserBagKg },
    applications,
    nextApplication: applications.find((a) => a.date >= weekStart) ?? null,
    productKgSeason: sum(applications.map((a) => a.productKg)),
    inputs: [
      input('grass', 'Grass', field.grass),
      input('clippings', 'Clippings', field.clippings),
      input('irrigated', 'Irrigated', irrigated),
      input('share', 'Standards: share of the grass\u2019s upper N', std.annualNShare, '%'),
      input('product', 'Default product (N-P-K)', `${product.n}-${product.p}-${product.k}, ${Math.round(product.slowReleaseShare * 100)} % slow-release N`),
      input('area', 'Field area', field.areaM2, 'm2'),
    ],
    how: 'Annual N = the grass\u2019s published annual range (upper end when irrigated, lower when not) × the level\u2019s share (a level fed below the published range says so), less 25–60 % when clippings are returned, more on older turf (Qian et al. 2003; 25 % when the turf\u2019s age is not recorded). It is split over the months in proportion to each month\u2019s mean growth potential (months below GP 0.1 or without weather get none) and into applications that keep soluble N within 1 lb N/1000 ft² (4.9 g/m²). Product = N ÷ N %.',
    cautions: [CAUTIONS.feed],
  };
}
