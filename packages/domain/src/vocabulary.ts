/**
 * The product's vocabulary: the closed sets of values used by API, portal and engine.
 * Trade terms (HOC, maintenance level, work order…) keep their trade names; the rest
 * are this project's own.
 */

export const ROLES = ['admin', 'head', 'foreman', 'crew', 'partner'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  head: 'Department head',
  foreman: 'District foreman',
  crew: 'Crew lead',
  partner: 'School / league partner',
};

/** Maintenance levels 1–4 of the department's Standards. */
export const LEVELS = [1, 2, 3, 4] as const;
export type Level = (typeof LEVELS)[number];
export const LEVEL_NAMES: Record<Level, string> = {
  1: 'Showcase',
  2: 'Competition',
  3: 'Community',
  4: 'Open space',
};

export const SPORTS = [
  'soccer',
  'football',
  'baseball',
  'softball',
  'lacrosse',
  'field_hockey',
  'multi_use',
  'lawn',
] as const;
export type Sport = (typeof SPORTS)[number];
export const SPORT_LABELS: Record<Sport, string> = {
  soccer: 'Soccer',
  football: 'American football',
  baseball: 'Baseball',
  softball: 'Softball',
  lacrosse: 'Lacrosse',
  field_hockey: 'Field hockey',
  multi_use: 'Multi-use field',
  lawn: 'Park lawn',
};

export const GRASSES = [
  'kentucky_bluegrass',
  'perennial_ryegrass',
  'tall_fescue',
  'fine_fescue',
  'bermudagrass',
  'zoysiagrass',
  'st_augustinegrass',
] as const;
export type Grass = (typeof GRASSES)[number];
export type GrassSeason = 'cool' | 'warm';
export const GRASS_SEASON: Record<Grass, GrassSeason> = {
  kentucky_bluegrass: 'cool',
  perennial_ryegrass: 'cool',
  tall_fescue: 'cool',
  fine_fescue: 'cool',
  bermudagrass: 'warm',
  zoysiagrass: 'warm',
  st_augustinegrass: 'warm',
};
export const GRASS_LABELS: Record<Grass, string> = {
  kentucky_bluegrass: 'Kentucky bluegrass',
  perennial_ryegrass: 'Perennial ryegrass',
  tall_fescue: 'Tall fescue',
  fine_fescue: 'Fine fescue',
  bermudagrass: 'Bermudagrass',
  zoysiagrass: 'Zoysiagrass',
  st_augustinegrass: 'St. Augustinegrass',
};

export const ROOTZONES = ['native_soil', 'sand_capped', 'sand_based'] as const;
export type Rootzone = (typeof ROOTZONES)[number];
export const ROOTZONE_LABELS: Record<Rootzone, string> = {
  native_soil: 'Native soil',
  sand_capped: 'Sand-capped',
  sand_based: 'Sand-based',
};

export const IRRIGATION_KINDS = ['none', 'quick_coupler', 'automatic'] as const;
export type IrrigationKind = (typeof IRRIGATION_KINDS)[number];
export const IRRIGATION_LABELS: Record<IrrigationKind, string> = {
  none: 'Not irrigated',
  quick_coupler: 'Quick couplers (manual)',
  automatic: 'Automatic system',
};

export const CLIPPINGS = ['returned', 'removed'] as const;
export type Clippings = (typeof CLIPPINGS)[number];
export const CLIPPINGS_LABELS: Record<Clippings, string> = {
  returned: 'Returned',
  removed: 'Removed',
};

/**
 * `retired`: no longer kept (built over, handed back, merged into another field). It stays
 * with its records, since a field with work on record is never deleted, and is not planned.
 */
export const FIELD_STATUSES = ['open', 'restricted', 'closed', 'retired'] as const;
export type FieldStatus = (typeof FIELD_STATUSES)[number];
export const FIELD_STATUS_LABELS: Record<FieldStatus, string> = {
  open: 'Open',
  restricted: 'Restricted',
  closed: 'Closed',
  retired: 'Retired',
};

/** Why a field is closed or restricted; the public status board says it in plain words. */
export const CLOSURE_REASONS = ['wet', 'lightning', 'hardness', 'renovation', 'event', 'other'] as const;
export type ClosureReason = (typeof CLOSURE_REASONS)[number];
export const CLOSURE_REASON_LABELS: Record<ClosureReason, string> = {
  wet: 'Wet field',
  lightning: 'Lightning',
  hardness: 'Surface too hard',
  renovation: 'Renovation',
  event: 'Event',
  other: 'Other',
};
/** The reason as the public reads it on the status board and in a partner's e-mail. */
export const CLOSURE_REASON_PUBLIC: Record<ClosureReason, string> = {
  wet: 'The ground is wet and needs time to drain.',
  lightning: 'Lightning in the area: stay off until 30 minutes after the last thunder.',
  hardness: 'The playing surface is too hard for safe play.',
  renovation: 'The grass is being repaired or renovated.',
  event: 'The field is set aside for an event.',
  other: 'Closed by the parks department.',
};
/** A closure's status: the field's status while it is in force (`open` is a reopening). */
export const CLOSURE_STATUSES = ['open', 'restricted', 'closed'] as const;
export type ClosureStatus = (typeof CLOSURE_STATUSES)[number];
/** What closing a field does with its planned work: keep it, move it to the next open working day, or cancel it. */
export const CLOSURE_WORK_CHOICES = ['keep', 'move', 'cancel'] as const;
export type ClosureWorkChoice = (typeof CLOSURE_WORK_CHOICES)[number];
export const CLOSURE_WORK_CHOICE_LABELS: Record<ClosureWorkChoice, string> = {
  keep: 'Keep it as planned',
  move: 'Move it to the next open working day',
  cancel: 'Cancel it with the closure’s reason',
};

export const SITE_KINDS = ['park', 'school', 'complex'] as const;
export type SiteKind = (typeof SITE_KINDS)[number];
export const SITE_KIND_LABELS: Record<SiteKind, string> = {
  park: 'Park',
  school: 'School campus',
  complex: 'Athletic complex',
};

export const SITE_OWNERS = ['city', 'school_district'] as const;
export type SiteOwner = (typeof SITE_OWNERS)[number];
export const SITE_OWNER_LABELS: Record<SiteOwner, string> = {
  city: 'City parks',
  school_district: 'School district',
};

/**
 * Surface hardness testers. A Gmax reading means something only with its device and method:
 * ASTM F1936 with the F355 missile A (9.1 kg, 610 mm drop) and the 2.25 kg portable tester
 * (ASTM F1702 style) read on different scales and are not comparable.
 */
export const HARDNESS_DEVICES = ['f355_missile_a', 'portable_2_25kg'] as const;
export type HardnessDevice = (typeof HARDNESS_DEVICES)[number];
export const HARDNESS_DEVICE_LABELS: Record<HardnessDevice, string> = {
  f355_missile_a: 'ASTM F1936 / F355 missile A (9.1 kg)',
  portable_2_25kg: '2.25 kg portable tester (ASTM F1702)',
};

export const UNIT_SYSTEMS = ['imperial', 'metric'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export const EQUIPMENT_KINDS = ['reel_mower', 'rotary_mower', 'flail_mower', 'line_marker', 'spreader', 'sprayer'] as const;
export type EquipmentKind = (typeof EQUIPMENT_KINDS)[number];
export const EQUIPMENT_KIND_LABELS: Record<EquipmentKind, string> = {
  reel_mower: 'Reel mower',
  rotary_mower: 'Rotary mower',
  flail_mower: 'Flail mower',
  line_marker: 'Line marker',
  spreader: 'Spreader',
  sprayer: 'Sprayer',
};
export const MOWER_KINDS: readonly EquipmentKind[] = ['reel_mower', 'rotary_mower', 'flail_mower'];

export const WORK_TASKS = ['mow', 'paint_lines', 'feed', 'irrigate', 'field_check', 'aerate', 'overseed', 'topdress', 'weed_control', 'colourant', 'sharpen_blades'] as const;
export type WorkTask = (typeof WORK_TASKS)[number];
export const WORK_TASK_LABELS: Record<WorkTask, string> = {
  mow: 'Mow',
  paint_lines: 'Paint lines',
  feed: 'Feed',
  irrigate: 'Irrigate',
  field_check: 'Field check',
  aerate: 'Aerate',
  overseed: 'Overseed',
  topdress: 'Topdress',
  weed_control: 'Weed control',
  colourant: 'Colourant',
  sharpen_blades: 'Sharpen blades',
};
export const WORK_STATUSES = ['planned', 'assigned', 'started', 'done', 'skipped'] as const;
export type WorkStatus = (typeof WORK_STATUSES)[number];
export const WORK_STATUS_LABELS: Record<WorkStatus, string> = {
  planned: 'Planned',
  assigned: 'Assigned',
  started: 'Started',
  done: 'Done',
  skipped: 'Skipped',
};
/** What a crew may report on a work order. */
export const WORK_REPORTS = ['started', 'done', 'skipped'] as const;
export type WorkReport = (typeof WORK_REPORTS)[number];

export const FIELD_EVENT_KINDS = ['game', 'tournament', 'practice', 'ceremony', 'other'] as const;
export type FieldEventKind = (typeof FIELD_EVENT_KINDS)[number];
export const FIELD_EVENT_KIND_LABELS: Record<FieldEventKind, string> = {
  game: 'Game',
  tournament: 'Tournament',
  practice: 'Practice',
  ceremony: 'Ceremony',
  other: 'Other booking',
};

/** Stripe patterns a foreman may ask for on a field's mowings (field frame: length along the long axis). */
export const STRIPE_PATTERNS = ['lengthwise', 'side_to_side', 'checkerboard', 'diagonal'] as const;
export type StripePattern = (typeof STRIPE_PATTERNS)[number];
export const STRIPE_PATTERN_LABELS: Record<StripePattern, string> = {
  lengthwise: 'Length-wise stripes',
  side_to_side: 'Side-to-side stripes',
  checkerboard: 'Checkerboard (criss-cross)',
  diagonal: 'Diagonal stripes',
};

/** What a partner asks of the department (a school athletic director, a league contact). */
export const REQUEST_KINDS = ['game_lines', 'wet_area', 'damaged_turf', 'safety'] as const;
export type RequestKind = (typeof REQUEST_KINDS)[number];
export const REQUEST_KIND_LABELS: Record<RequestKind, string> = {
  game_lines: 'Lines for a game',
  wet_area: 'Wet area',
  damaged_turf: 'Damaged turf',
  safety: 'Safety concern',
};
/** requested → scheduled → done, or declined with a reason. */
export const REQUEST_STATES = ['requested', 'scheduled', 'done', 'declined'] as const;
export type RequestState = (typeof REQUEST_STATES)[number];
export const REQUEST_STATE_LABELS: Record<RequestState, string> = {
  requested: 'Requested',
  scheduled: 'Scheduled',
  done: 'Done',
  declined: 'Declined',
};
