/**
 * Every cached answer's key, in one place. A key starts with its resource, so invalidating
 * `['fields']` covers the list, each field and their needs.
 */
export const queryKeys = {
  audit: (query: object) => ['audit', query] as const,
  crews: () => ['crews'] as const,
  devMail: () => ['dev-mail'] as const,
  districts: () => ['districts'] as const,
  equipment: () => ['equipment'] as const,
  fieldEvents: (query: object) => ['field-events', query] as const,
  gameDays: (query: object) => ['game-days', query] as const,
  fields: (query: object) => ['fields', 'list', query] as const,
  field: (id: number) => ['fields', 'detail', id] as const,
  fieldNeeds: (id: number, date: string | null) => ['fields', 'needs', id, date] as const,
  fieldWork: (id: number, page: number) => ['fields', 'work', id, page] as const,
  fieldChecks: (id: number) => ['fields', 'checks', id] as const,
  fieldGrowthCalibration: (id: number) => ['fields', 'growth-calibration', id] as const,
  /** Under `fields`: a field's change (its status) makes its closures stale. */
  fieldClosures: (id: number) => ['fields', 'closures', id] as const,
  /** Under `fields`: saving a pattern invalidates `field`, which also makes the week plan stale. */
  fieldStripes: (id: number) => ['fields', 'stripes', id] as const,
  fieldLinePlan: (id: number) => ['fields', 'lines', id] as const,
  fieldLogos: (id: number) => ['fields', 'logos', id] as const,
  /** The public board, read without signing in. */
  statusBoard: () => ['status-board'] as const,
  imports: () => ['imports'] as const,
  map: () => ['map'] as const,
  /** Not under `map`: the bundled basemap does not change with the data. */
  basemap: () => ['basemap'] as const,
  records: (query: object) => ['records', query] as const,
  /** Sums over work, fields, checks, requests and closures: most writes make it stale. */
  overview: (query: object) => ['overview', query] as const,
  /** Under `records`: a work order's change (an application recorded on it) makes them stale. */
  applications: (query: object) => ['records', 'applications', query] as const,
  /** Under `records`: done work and field checks change it; costs and sites too (see staleAfter). */
  compareSites: (query: object) => ['records', 'compare', query] as const,
  requests: (query: object) => ['requests', 'list', query] as const,
  request: (id: number) => ['requests', 'detail', id] as const,
  sites: (query: object) => ['sites', 'list', query] as const,
  site: (id: number) => ['sites', 'detail', id] as const,
  standards: () => ['standards'] as const,
  costs: () => ['costs'] as const,
  budget: (season: number, districtId: number | null) => ['budget', season, districtId] as const,
  /** Under `budget`: saved what-ifs are worked out against the outlook, which follows fields, Standards and costs. */
  whatIfScenarios: () => ['budget', 'what-if', 'scenarios'] as const,
  whatIfCompare: (ids: readonly number[]) => ['budget', 'what-if', 'compare', ids] as const,
  stations: () => ['weather', 'stations'] as const,
  weatherDays: (stationId: number | null, from: string, to: string) => ['weather', 'days', stationId, from, to] as const,
  weekBoard: (districtId: number | null, weekStart: string) => ['week-plans', 'board', districtId, weekStart] as const,
  /** One crew's day sheet, by the link's crew, day and (when given) district. */
  crewSheet: (link: object) => ['week-plans', 'sheet', link] as const,
  workOrders: (query: object) => ['work-orders', 'list', query] as const,
  workOrder: (id: number) => ['work-orders', 'detail', id] as const,
  users: () => ['users'] as const,
  /** The partner's own pages: a booking, a closure or planned work changes them. */
  partnerFields: () => ['partner', 'fields'] as const,
  partnerField: (id: number) => ['partner', 'field', id] as const,
  calendarFeeds: () => ['calendar-feeds'] as const,
  mailOutbox: () => ['mail-outbox'] as const,
};

/** What a write changes, by what was written. */
export type Written = 'site' | 'field' | 'fieldEvent' | 'crew' | 'equipment' | 'user' | 'standards' | 'import' | 'workOrder' | 'weather' | 'devMail' | 'fieldCheck' | 'calendarFeed' | 'request' | 'costs' | 'fieldLogo' | 'gameDay' | 'budget' | 'mailOutbox';

/**
 * The answers a write makes stale: the resource itself and every answer that shows it (a
 * field's change shows in its site's counts, the district's totals, the map and the week plan).
 */
export const staleAfter: Record<Written, readonly (readonly unknown[])[]> = {
  site: [['sites'], ['fields'], ['districts'], ['map'], ['overview'], ['records', 'compare']],
  field: [['fields'], ['sites'], ['districts'], ['map'], ['week-plans'], ['work-orders'], ['records'], ['partner'], ['budget'], ['overview']],
  fieldEvent: [['field-events'], ['fields', 'needs'], ['week-plans'], ['partner']],
  crew: [['crews'], ['equipment'], ['users'], ['week-plans'], ['work-orders']],
  equipment: [['equipment'], ['week-plans']],
  user: [['users'], ['crews']],
  standards: [['standards'], ['fields', 'needs'], ['map'], ['week-plans'], ['budget'], ['overview']],
  import: [['imports'], ['sites'], ['fields'], ['districts'], ['map'], ['overview']],
  workOrder: [['week-plans'], ['work-orders'], ['records'], ['fields'], ['map'], ['partner'], ['game-days'], ['budget'], ['overview']],
  weather: [['weather'], ['fields', 'needs'], ['map']],
  devMail: [['dev-mail']],
  fieldCheck: [['fields'], ['map'], ['records'], ['overview']],
  calendarFeed: [['calendar-feeds']],
  // A game-day preparation adds or pins work orders.
  gameDay: [['game-days'], ['week-plans'], ['work-orders'], ['partner']],
  fieldLogo: [['fields', 'logos']],
  costs: [['costs'], ['budget'], ['records', 'compare']],
  budget: [['budget']],
  mailOutbox: [['mail-outbox']],
  // Scheduling a request books the field or adds a work order; the partner's pages list requests.
  request: [['requests'], ['field-events'], ['fields', 'needs'], ['week-plans'], ['work-orders'], ['partner'], ['overview']],
};
