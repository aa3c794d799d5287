/**
 * Where each overview figure's rows are: the existing pages with their query filters
 * (`/fields?level=2&target=below`, `/records?from=…&to=…`, `/requests?state=requested`).
 */
import type { Level, Overview, OverviewBlock } from '@swardwise/domain';
import type { RouteLocationRaw } from 'vue-router';

type Where = Pick<OverviewBlock, 'districtId' | 'name'>;
/** The fields list filters its district column by name; a department block names none. */
const districtName = (b: Where) => (b.districtId === null ? {} : { district: b.name });

export const overviewLinks = {
  fields: (b: Where, filter: { level?: Level; target?: 'below'; status?: 'closed' | 'restricted' } = {}): RouteLocationRaw => ({
    path: '/fields',
    query: { ...districtName(b), ...(filter.level ? { level: String(filter.level) } : {}), ...(filter.target ? { target: filter.target } : {}), ...(filter.status ? { status: filter.status } : {}) },
  }),
  records: (b: Where, span: 'week' | 'season', o: Pick<Overview, 'weekFrom' | 'weekTo' | 'seasonFrom' | 'seasonTo'>): RouteLocationRaw => ({
    path: '/records',
    query: {
      ...(b.districtId === null ? {} : { district: String(b.districtId) }),
      from: span === 'week' ? o.weekFrom : o.seasonFrom,
      to: span === 'week' ? o.weekTo : o.seasonTo,
    },
  }),
  requests: (state?: 'requested' | 'scheduled' | 'done'): RouteLocationRaw => ({ path: '/requests', query: state ? { state } : {} }),
};
