/**
 * The invented demo city: districts, sites, fields, crews, users, weather stations, a season
 * of weather and an offline basemap. Everything here is made up for the demo — the city,
 * its streets, parks, schools and people do not exist. The city is placed in open ocean
 * (about 37.55° N, 66.40° W) so that nobody takes it for a real place.
 *
 * Pure and deterministic: no I/O, no clock, no Math.random; two calls give equal results.
 */
import type { Feature, FeatureCollection, LineString, Polygon as GeoPolygon } from 'geojson';
import type { Clippings, FieldRow, FieldStatus, Grass, IrrigationKind, Level, Polygon, Role, Rootzone, SiteKind, SiteRow, Sport } from '@swardwise/domain';
import {
  fanShape,
  lawnShape,
  layoutSite,
  offsetLatLng,
  offsetPosition,
  rectangleShape,
  ringToPolygon,
  type LatLng,
  type Vec,
} from './city-geometry.ts';
import { rngFor, uniform } from './prng.ts';
import { stationSeason, stationWeather, type DemoWeatherDay, type DemoWeatherStation, type StationClimate } from './demo-weather.ts';

export type { DemoWeatherDay, DemoWeatherStation } from './demo-weather.ts';

// ---------------------------------------------------------------------------------------------
// Types
// ---------------------------------------------------------------------------------------------

export interface DemoDistrict {
  code: string;
  name: string;
  boundary: Polygon;
  yard: { name: string; lat: number; lng: number };
}

/** A site of the demo city, its district named by code and its fields by the site's key. */
export type DemoSite = Pick<SiteRow, 'name' | 'kind' | 'owner' | 'address' | 'lat' | 'lng' | 'notes'> & { key: string; districtCode: string };

/** A field of the demo city: a field's own attributes, its site named by key. */
export type DemoField = Pick<FieldRow, 'name' | 'sport' | 'grass' | 'rootzone' | 'irrigation' | 'maintenanceLevel' | 'hocOverrideMm' | 'clippings' | 'status' | 'statusNote' | 'weeklyUseHours'> & { siteKey: string; geometry: Polygon };

export interface DemoCrew {
  districtCode: string;
  name: string;
  hoursPerDay: number;
  members: string[];
}

export interface DemoUser {
  email: string;
  name: string;
  role: Role;
  districtCode: string | null;
  crewName: string | null;
  siteKeys: string[];
  password: string;
}

export interface DemoCity {
  city: { name: string; center: { lat: number; lng: number }; note: string };
  districts: DemoDistrict[];
  sites: DemoSite[];
  fields: DemoField[];
  crews: DemoCrew[];
  users: DemoUser[];
  weatherStations: DemoWeatherStation[];
  weather: DemoWeatherDay[];
  basemap: FeatureCollection;
}

// ---------------------------------------------------------------------------------------------
// The city
// ---------------------------------------------------------------------------------------------

export const DEMO_CITY_NAME = 'Sallowmere';
const DEMO_SCHOOL_DISTRICT_NAME = 'Sallowmere Unified School District';
const DEMO_EMAIL_DOMAIN = 'swardwise.example';
const CENTER: LatLng = { lat: 37.55, lng: -66.4 };
const CITY_NOTE =
  'Invented demo city. Sallowmere, its districts, streets, parks, the Sallowmere Unified School ' +
  'District and its schools, the people and the weather are all made up for the Swardwise demo ' +
  'and describe no real place or person. It sits in open ocean (37.55° N, 66.40° W) on purpose.';

/** One shared demo password per role (each at least 10 characters), documented in the README. */
export const DEMO_PASSWORDS: Record<Role, string> = {
  admin: 'demo-admin-2026',
  head: 'demo-head-2026',
  foreman: 'demo-foreman-2026',
  crew: 'demo-crew-2026',
  partner: 'demo-partner-2026',
};

/** One demo user per role to sign in with. */
export const DEMO_SIGN_INS: Record<Role, { email: string; password: string }> = {
  admin: { email: 'admin@swardwise.example', password: DEMO_PASSWORDS.admin },
  head: { email: 'head@swardwise.example', password: DEMO_PASSWORDS.head },
  foreman: { email: 'foreman.north@swardwise.example', password: DEMO_PASSWORDS.foreman },
  crew: { email: 'crew.north-ridge-a@swardwise.example', password: DEMO_PASSWORDS.crew },
  partner: { email: 'partner.kestrel-hill@swardwise.example', password: DEMO_PASSWORDS.partner },
};

/** Kilometres east/north of the city centre → { lat, lng }. */
const km = (x: number, y: number): LatLng => offsetLatLng(CENTER, x * 1000, y * 1000);
const kmRing = (points: [number, number][]): Polygon =>
  ringToPolygon(
    CENTER,
    points.map(([x, y]) => [x * 1000, y * 1000]),
  );

// The city spans x −5…5 km, y −4…4 km. District lines follow streets (counter-clockwise rings).
const DISTRICT_SPECS: { code: string; name: string; ring: [number, number][]; yard: { name: string; at: [number, number] } }[] = [
  {
    code: 'north',
    name: 'North Ridge',
    ring: [
      [-5, 1.6],
      [1.6, 1.6],
      [1.6, 2.4],
      [5, 2.4],
      [5, 4],
      [-5, 4],
    ],
    yard: { name: 'North Ridge Yard', at: [-0.4, 2.0] },
  },
  {
    code: 'central',
    name: 'Riverbend',
    ring: [
      [-5, -1.6],
      [-0.8, -1.6],
      [-0.8, -0.8],
      [5, -0.8],
      [5, 2.4],
      [1.6, 2.4],
      [1.6, 1.6],
      [-5, 1.6],
    ],
    yard: { name: 'Riverbend Yard', at: [1.2, 1.2] },
  },
  {
    code: 'south',
    name: 'South Meadows',
    ring: [
      [-5, -4],
      [5, -4],
      [5, -0.8],
      [-0.8, -0.8],
      [-0.8, -1.6],
      [-5, -1.6],
    ],
    yard: { name: 'South Meadows Yard', at: [-2.0, -2.0] },
  },
];

// Street grid: north–south lines every 0.8 km from x = −4.8, east–west lines every 0.8 km from
// y = −4.0. The line at x = −0.8 is the expressway; the river runs where y = 0 would be.
/** Streets every 0.8 km from `from` (km), one name a line in order, null where none runs. */
const streetLines = (from: number, names: (string | null)[]) =>
  names.flatMap((name, i) => (name ? [{ at: Math.round((from + 0.8 * i) * 10) / 10, name, kind: name.endsWith(' Avenue') ? ('avenue' as const) : ('street' as const) }] : []));
const NS_STREETS = streetLines(-4.8, ['Alder Street', 'Birchwood Street', 'Cedar Street', 'Kestrel Avenue', 'Dogwood Street', null, 'Elmcroft Street', 'Founders Avenue', 'Hazel Street', 'Ironwood Street', 'Juniper Street', 'Larch Street', 'Magnolia Street']).map(({ at, ...s }) => ({ x: at, ...s }));
const EW_STREETS = streetLines(-4.0, ['Saltmarsh Road', 'Meadowlark Road', 'Cattail Road', 'Millrace Avenue', 'Tannery Street', null, 'Lantern Street', 'Ridge Avenue', 'Wren Street', 'Quarry Road', 'Summit Road']).map(({ at, ...s }) => ({ y: at, ...s }));
const HIGHWAY = {
  name: 'Sallow Valley Expressway',
  points: [
    [-1.5, -4.9],
    [-0.8, -4.0],
    [-0.8, 4.0],
    [-0.1, 4.9],
  ] as [number, number][],
};
const RIVER_NAME = 'Sallow River';
const LAKE = { name: 'Sallow Mere', center: [2.0, -2.8] as [number, number] };

/** The river's centre line: y (km) at x (km), never more than about 140 m from y = 0. */
const riverY = (x: number) => 0.11 * Math.sin(1.3 * x + 0.4) + 0.03 * Math.sin(3.1 * x);

// ---------------------------------------------------------------------------------------------
// Field shapes (metres)
// ---------------------------------------------------------------------------------------------

const FT = 0.3048;
const YD = 0.9144;

type ShapeSpec =
  | { kind: 'rect'; lengthM: number; widthM: number }
  | { kind: 'fan'; foulLineM: number; centerFieldM: number }
  | { kind: 'lawn'; areaM2: number; aspect: number };

const rect = (lengthM: number, widthM: number): ShapeSpec => ({ kind: 'rect', lengthM, widthM });
/** Full-size soccer pitch, 105 × 68 m. */
const SOCCER_FULL = rect(105, 68);
/** Youth 9 v 9 pitch, 64 × 46 m. */
const SOCCER_9V9 = rect(64, 46);
/** Youth 7 v 7 pitch, 50 × 32 m. */
const SOCCER_7V7 = rect(50, 32);
/** American football, 360 × 160 ft playing area plus a 10 ft border all round (380 × 180 ft). */
const FOOTBALL = rect(380 * FT, 180 * FT);
/** Lacrosse, 110 × 60 yd. */
const LACROSSE = rect(110 * YD, 60 * YD);
/** Field hockey, 91.4 × 55 m. */
const FIELD_HOCKEY = rect(91.4, 55);
/** Baseball, 325 ft foul lines, 400 ft to centre. */
const BASEBALL = { kind: 'fan', foulLineM: 325 * FT, centerFieldM: 400 * FT } as const satisfies ShapeSpec;
/** Park baseball, 325 ft foul lines, 370 ft to centre. */
const BASEBALL_PARK = { kind: 'fan', foulLineM: 325 * FT, centerFieldM: 370 * FT } as const satisfies ShapeSpec;
/** Softball, a 220 ft fence all round. */
const SOFTBALL = { kind: 'fan', foulLineM: 220 * FT, centerFieldM: 220 * FT } as const satisfies ShapeSpec;
const lawn = (hectares: number, aspect: number): ShapeSpec => ({ kind: 'lawn', areaM2: hectares * 10_000, aspect });

interface FieldSpec {
  name: string;
  sport: Sport;
  shape: ShapeSpec;
  grass: Grass;
  rootzone?: Rootzone;
  irrigation: IrrigationKind;
  level: Level;
  hocMm?: number;
  clippings?: Clippings;
  status?: FieldStatus;
  statusNote?: string;
  useH: number;
}

interface SiteSpec {
  key: string;
  district: string;
  name: string;
  kind: SiteKind;
  /** Site point, km east/north of the city centre (the middle of a street block). */
  at: [number, number];
  /** Bearing of the fields' long axes, degrees clockwise from north. */
  bearing: number;
  notes: string;
  fields: FieldSpec[];
}

const SCHOOL_NOTE = `Campus of the ${DEMO_SCHOOL_DISTRICT_NAME}; the city keeps the fields under the joint-use agreement.`;

/** One site a row: key, district, name, kind, place (km E, km N), fields' bearing (°), notes, its fields. */
const site = (key: string, district: string, name: string, kind: SiteKind, at: [number, number], bearing: number, notes: string, fields: FieldSpec[]): SiteSpec => ({ key, district, name, kind, at, bearing, notes, fields });

const SITE_SPECS: SiteSpec[] = [
  // ----- North Ridge ------------------------------------------------------------------------
  site('north-ridge-complex', 'north', 'North Ridge Athletic Complex', 'complex', [-2.8, 2.8], 6, 'Tournament complex; league permits every evening and weekend from March to November.', [
    { name: 'Field 1', sport: 'soccer', shape: SOCCER_FULL, grass: 'kentucky_bluegrass', rootzone: 'sand_capped', irrigation: 'automatic', level: 2, clippings: 'removed', useH: 22 },
    { name: 'Field 2', sport: 'soccer', shape: SOCCER_FULL, grass: 'kentucky_bluegrass', irrigation: 'automatic', level: 2, useH: 20 },
    { name: 'Field 3', sport: 'soccer', shape: SOCCER_FULL, grass: 'tall_fescue', irrigation: 'automatic', level: 2, useH: 24, status: 'restricted', statusNote: 'Goalmouths overseeded; both goals moved 5 m sideways, no play in the goal areas until they fill in.' },
    { name: 'Field 4', sport: 'soccer', shape: SOCCER_FULL, grass: 'tall_fescue', irrigation: 'automatic', level: 2, useH: 18 },
    { name: 'Lacrosse field', sport: 'lacrosse', shape: LACROSSE, grass: 'kentucky_bluegrass', irrigation: 'automatic', level: 2, useH: 16 },
  ]),
  site('kestrel-hill-hs', 'north', 'Kestrel Hill High School', 'school', [0.4, 2.8], 354, `${SCHOOL_NOTE} Varsity football on Friday nights in the autumn.`, [
    { name: 'Stadium field', sport: 'football', shape: FOOTBALL, grass: 'bermudagrass', rootzone: 'sand_capped', irrigation: 'automatic', level: 2, useH: 14 },
    { name: 'Baseball diamond', sport: 'baseball', shape: BASEBALL, grass: 'bermudagrass', irrigation: 'quick_coupler', level: 2, useH: 12 },
    { name: 'Softball diamond', sport: 'softball', shape: SOFTBALL, grass: 'tall_fescue', irrigation: 'quick_coupler', level: 2, useH: 10, status: 'closed', statusNote: 'Outfield drainage repair; sod going down — closed until the new sod has rooted.' },
    { name: 'Practice field', sport: 'multi_use', shape: rect(100, 60), grass: 'tall_fescue', irrigation: 'none', level: 3, useH: 20 },
  ]),
  site('alder-run-park', 'north', 'Alder Run Park', 'park', [-4.4, 2.0], 12, 'Neighbourhood park with youth soccer on Saturdays; picnic lawn by the creek.', [
    { name: 'Youth pitch A', sport: 'soccer', shape: SOCCER_9V9, grass: 'tall_fescue', irrigation: 'quick_coupler', level: 3, useH: 12 },
    { name: 'Youth pitch B', sport: 'soccer', shape: SOCCER_9V9, grass: 'tall_fescue', irrigation: 'quick_coupler', level: 3, useH: 12 },
    { name: 'Creekside lawn', sport: 'lawn', shape: lawn(1.1, 1.4), grass: 'tall_fescue', irrigation: 'none', level: 4, useH: 4 },
  ]),
  site('quarry-knoll-park', 'north', 'Quarry Knoll Park', 'park', [-1.2, 3.6], 20, 'Adult softball league on weeknights; open lawn on the knoll.', [
    { name: 'Softball field', sport: 'softball', shape: SOFTBALL, grass: 'tall_fescue', irrigation: 'quick_coupler', level: 3, useH: 14 },
    { name: 'Knoll lawn', sport: 'lawn', shape: lawn(1.6, 1.2), grass: 'tall_fescue', irrigation: 'none', level: 4, useH: 3 },
  ]),
  site('wren-meadow-ms', 'north', 'Wren Meadow Middle School', 'school', [2.0, 2.8], 3, `${SCHOOL_NOTE} Physical-education classes on school days.`, [
    { name: 'Athletic field', sport: 'multi_use', shape: rect(90, 55), grass: 'tall_fescue', irrigation: 'quick_coupler', level: 3, useH: 18 },
    { name: 'Softball field', sport: 'softball', shape: SOFTBALL, grass: 'tall_fescue', irrigation: 'none', level: 3, useH: 8 },
  ]),
  site('lindenfold-es', 'north', 'Lindenfold Elementary School', 'school', [3.6, 3.6], 358, `${SCHOOL_NOTE} Recess field and a shaded front lawn.`, [
    { name: 'Play field', sport: 'multi_use', shape: rect(70, 45), grass: 'tall_fescue', irrigation: 'none', level: 3, useH: 15 },
    { name: 'Front lawn', sport: 'lawn', shape: lawn(0.4, 1.6), grass: 'tall_fescue', irrigation: 'none', level: 4, useH: 2 },
  ]),
  site('hilltop-commons', 'north', 'Hilltop Commons', 'park', [-3.6, 3.6], 350, 'Open parkland for walking and kite flying; cut high and rarely.', [
    { name: 'Upper meadow lawn', sport: 'lawn', shape: lawn(1.9, 1.3), grass: 'tall_fescue', irrigation: 'none', level: 4, hocMm: 90, useH: 2 },
    { name: 'Picnic lawn', sport: 'lawn', shape: lawn(0.7, 1.5), grass: 'kentucky_bluegrass', irrigation: 'quick_coupler', level: 4, useH: 5 },
  ]),
  site('bramble-gate-park', 'north', 'Bramble Gate Park', 'park', [4.4, 2.8], 88, 'Fields run east–west here because of the lot shape; evening glare on the west goal.', [
    { name: 'Hockey pitch', sport: 'field_hockey', shape: FIELD_HOCKEY, grass: 'perennial_ryegrass', irrigation: 'automatic', level: 3, useH: 10 },
    { name: 'Youth pitch', sport: 'soccer', shape: SOCCER_9V9, grass: 'tall_fescue', irrigation: 'quick_coupler', level: 3, useH: 9 },
  ]),

  // ----- Riverbend --------------------------------------------------------------------------
  site('civic-stadium', 'central', 'Sallowmere Civic Stadium', 'complex', [-0.4, 1.2], 2, 'The city stadium: semi-professional soccer, cup finals and the spring festival.', [
    { name: 'Stadium pitch', sport: 'soccer', shape: SOCCER_FULL, grass: 'bermudagrass', rootzone: 'sand_based', irrigation: 'automatic', level: 1, hocMm: 22, useH: 8 },
    { name: 'Practice pitch', sport: 'soccer', shape: SOCCER_FULL, grass: 'kentucky_bluegrass', rootzone: 'sand_capped', irrigation: 'automatic', level: 2, clippings: 'removed', useH: 20 },
  ]),
  site('riverbend-hs', 'central', 'Riverbend High School', 'school', [2.8, 1.2], 350, `${SCHOOL_NOTE} Home of the district field hockey final.`, [
    { name: 'Stadium field', sport: 'football', shape: FOOTBALL, grass: 'tall_fescue', irrigation: 'automatic', level: 2, useH: 16 },
    { name: 'Hockey field', sport: 'field_hockey', shape: FIELD_HOCKEY, grass: 'kentucky_bluegrass', irrigation: 'automatic', level: 2, useH: 14 },
    { name: 'Baseball field', sport: 'baseball', shape: BASEBALL, grass: 'perennial_ryegrass', irrigation: 'quick_coupler', level: 3, useH: 10 },
  ]),
  site('millrace-park', 'central', 'Millrace Park', 'park', [-3.6, 1.2], 8, 'Busy community park by the old mill race; youth soccer league base.', [
    { name: 'Main pitch', sport: 'soccer', shape: SOCCER_FULL, grass: 'tall_fescue', irrigation: 'quick_coupler', level: 3, useH: 18 },
    { name: 'Youth pitch', sport: 'soccer', shape: SOCCER_7V7, grass: 'tall_fescue', irrigation: 'none', level: 3, useH: 10, status: 'restricted', statusNote: 'Worn centre reseeded — training only, no matches until it is mowed three times.' },
    { name: 'Mill lawn', sport: 'lawn', shape: lawn(0.8, 1.3), grass: 'kentucky_bluegrass', irrigation: 'none', level: 4, useH: 4 },
  ]),
  site('heronwood-ballpark', 'central', 'Heronwood Ballpark', 'complex', [-2.0, -1.2], 52, 'Baseball and softball complex; the main ballpark hosts the summer collegiate league.', [
    { name: 'Ballpark field', sport: 'baseball', shape: BASEBALL, grass: 'bermudagrass', rootzone: 'sand_capped', irrigation: 'automatic', level: 1, hocMm: 19, useH: 10 },
    { name: 'Diamond 2', sport: 'baseball', shape: BASEBALL_PARK, grass: 'bermudagrass', irrigation: 'automatic', level: 2, useH: 16 },
    { name: 'Softball 1', sport: 'softball', shape: SOFTBALL, grass: 'bermudagrass', irrigation: 'automatic', level: 2, useH: 15 },
  ]),
  site('tannery-green', 'central', 'Tannery Green', 'park', [1.2, -0.4], 95, 'Riverside green laid out east–west along the old tannery lot.', [
    { name: 'Riverside lawn', sport: 'lawn', shape: lawn(0.9, 1.6), grass: 'zoysiagrass', irrigation: 'none', level: 4, useH: 6 },
    { name: 'Green field', sport: 'multi_use', shape: rect(80, 50), grass: 'tall_fescue', irrigation: 'quick_coupler', level: 3, useH: 12 },
  ]),
  site('copperbeech-ms', 'central', 'Copperbeech Middle School', 'school', [4.4, 2.0], 4, `${SCHOOL_NOTE} Community soccer rents the field on Sundays.`, [
    { name: 'Athletic field', sport: 'multi_use', shape: rect(90, 55), grass: 'perennial_ryegrass', irrigation: 'quick_coupler', level: 3, useH: 20 },
    { name: 'Softball field', sport: 'softball', shape: SOFTBALL, grass: 'tall_fescue', irrigation: 'none', level: 3, useH: 8 },
  ]),
  site('oriole-street-es', 'central', 'Oriole Street Elementary School', 'school', [-4.4, -0.4], 0, `${SCHOOL_NOTE} Small play field; lawn along the drop-off loop.`, [
    { name: 'Play field', sport: 'multi_use', shape: rect(70, 45), grass: 'tall_fescue', irrigation: 'none', level: 3, useH: 14 },
    { name: 'Loop lawn', sport: 'lawn', shape: lawn(0.35, 1.8), grass: 'tall_fescue', irrigation: 'none', level: 4, useH: 1 },
  ]),
  site('lantern-square', 'central', 'Lantern Square', 'park', [0.4, 0.4], 15, 'Downtown square; concerts and the farmers market on the lawn.', [
    { name: 'Square lawn', sport: 'lawn', shape: lawn(0.55, 1.3), grass: 'kentucky_bluegrass', irrigation: 'automatic', level: 4, useH: 8 },
  ]),
  site('sycamore-flats-park', 'central', 'Sycamore Flats Park', 'park', [3.6, -0.4], 92, 'Flat riverside park; the pitches run east–west between the levee and the road.', [
    { name: 'Youth pitch 1', sport: 'soccer', shape: SOCCER_9V9, grass: 'bermudagrass', irrigation: 'quick_coupler', level: 3, useH: 12 },
    { name: 'Youth pitch 2', sport: 'soccer', shape: SOCCER_9V9, grass: 'bermudagrass', irrigation: 'quick_coupler', level: 3, useH: 11 },
    { name: 'Levee lawn', sport: 'lawn', shape: lawn(0.6, 1.7), grass: 'bermudagrass', irrigation: 'none', level: 4, useH: 3 },
  ]),

  // ----- South Meadows ----------------------------------------------------------------------
  site('south-meadows-sports-park', 'south', 'South Meadows Sports Park', 'complex', [0.4, -2.8], 358, 'Warm-season complex for summer leagues and the autumn soccer tournament.', [
    { name: 'Pitch 1', sport: 'soccer', shape: SOCCER_FULL, grass: 'bermudagrass', rootzone: 'sand_capped', irrigation: 'automatic', level: 2, useH: 22 },
    { name: 'Pitch 2', sport: 'soccer', shape: SOCCER_FULL, grass: 'bermudagrass', irrigation: 'automatic', level: 2, useH: 20 },
    { name: 'Pitch 3', sport: 'soccer', shape: SOCCER_FULL, grass: 'zoysiagrass', irrigation: 'automatic', level: 2, useH: 14 },
    { name: 'Lacrosse field', sport: 'lacrosse', shape: LACROSSE, grass: 'bermudagrass', irrigation: 'automatic', level: 2, useH: 15 },
  ]),
  site('marsh-hollow-hs', 'south', 'Marsh Hollow High School', 'school', [-2.8, -2.8], 5, `${SCHOOL_NOTE} Football, baseball, softball and field hockey programmes.`, [
    { name: 'Stadium field', sport: 'football', shape: FOOTBALL, grass: 'bermudagrass', irrigation: 'automatic', level: 2, useH: 15 },
    { name: 'Baseball field', sport: 'baseball', shape: BASEBALL, grass: 'bermudagrass', irrigation: 'automatic', level: 2, useH: 12 },
    { name: 'Softball field', sport: 'softball', shape: SOFTBALL, grass: 'bermudagrass', irrigation: 'quick_coupler', level: 2, useH: 10 },
    { name: 'Hockey field', sport: 'field_hockey', shape: FIELD_HOCKEY, grass: 'perennial_ryegrass', irrigation: 'quick_coupler', level: 3, useH: 12 },
  ]),
  site('mere-shore-park', 'south', 'Mere Shore Park', 'park', [2.8, -2.8], 10, 'Lakeside park east of the mere; keep a no-spray buffer along the shore.', [
    { name: 'Shore lawn', sport: 'lawn', shape: lawn(1.2, 1.5), grass: 'zoysiagrass', irrigation: 'none', level: 4, useH: 6 },
    { name: 'Boathouse lawn', sport: 'lawn', shape: lawn(0.5, 1.4), grass: 'tall_fescue', irrigation: 'quick_coupler', level: 4, useH: 4 },
    { name: 'Youth pitch', sport: 'soccer', shape: SOCCER_9V9, grass: 'tall_fescue', irrigation: 'quick_coupler', level: 3, useH: 10 },
  ]),
  site('cattail-creek-ms', 'south', 'Cattail Creek Middle School', 'school', [4.4, -2.0], 10, `${SCHOOL_NOTE} Low corner floods after heavy rain.`, [
    { name: 'Athletic field', sport: 'multi_use', shape: rect(100, 60), grass: 'bermudagrass', irrigation: 'none', level: 3, useH: 18, status: 'restricted', statusNote: 'South end waterlogged after heavy rain — keep play on the north half.' },
    { name: 'Softball field', sport: 'softball', shape: SOFTBALL, grass: 'bermudagrass', irrigation: 'none', level: 3, useH: 8 },
  ]),
  site('juniper-row-es', 'south', 'Juniper Row Elementary School', 'school', [-4.4, -2.0], 0, `${SCHOOL_NOTE} Play field shared with the after-school programme.`, [
    { name: 'Play field', sport: 'multi_use', shape: rect(80, 50), grass: 'tall_fescue', irrigation: 'none', level: 3, useH: 15 },
    { name: 'Garden lawn', sport: 'lawn', shape: lawn(0.3, 1.5), grass: 'zoysiagrass', irrigation: 'none', level: 4, useH: 1 },
  ]),
  site('foxglove-park', 'south', 'Foxglove Park', 'park', [-1.2, -3.6], 40, 'Youth and adult ball fields with lights.', [
    { name: 'Baseball field', sport: 'baseball', shape: BASEBALL_PARK, grass: 'bermudagrass', irrigation: 'quick_coupler', level: 3, useH: 14 },
    { name: 'Softball field', sport: 'softball', shape: SOFTBALL, grass: 'bermudagrass', irrigation: 'quick_coupler', level: 3, useH: 12, status: 'closed', statusNote: 'Closed for the herbicide re-entry interval after broadleaf weed control; the posted sign gives the reopening time.' },
  ]),
  site('thistlewick-park', 'south', 'Thistlewick Park', 'park', [2.0, -1.2], 0, 'Quiet pocket park; lawn only.', [
    { name: 'Park lawn', sport: 'lawn', shape: lawn(0.9, 1.2), grass: 'tall_fescue', irrigation: 'none', level: 4, useH: 3 },
  ]),
  site('orchard-terrace-park', 'south', 'Orchard Terrace Park', 'park', [-4.4, -3.6], 6, 'Terraced park on the old orchard; youth soccer on the lower terrace.', [
    { name: 'Lower terrace pitch', sport: 'soccer', shape: SOCCER_9V9, grass: 'perennial_ryegrass', irrigation: 'quick_coupler', level: 3, useH: 10 },
    { name: 'Upper terrace lawn', sport: 'lawn', shape: lawn(1.3, 1.4), grass: 'tall_fescue', irrigation: 'none', level: 4, useH: 3 },
  ]),
];

// ---------------------------------------------------------------------------------------------
// Crews, users, weather stations
// ---------------------------------------------------------------------------------------------

const CREW_SPECS: { slug: string; districtCode: string; name: string; hoursPerDay: number; members: string[] }[] = [
  { slug: 'north-ridge-a', districtCode: 'north', name: 'North Ridge Crew A', hoursPerDay: 9, members: ['Tomas Velloway', 'Kira Ambersley', 'Joel Pennrick'] },
  { slug: 'north-ridge-b', districtCode: 'north', name: 'North Ridge Crew B', hoursPerDay: 8, members: ['Priya Castelmoor', 'Owen Hartsmere', 'Lucia Marrowby', 'Dario Fenchley'] },
  { slug: 'riverbend-a', districtCode: 'central', name: 'Riverbend Crew A', hoursPerDay: 10, members: ['Hollis Quarrington', 'Mina Sorrelby', 'Eli Dunhaven'] },
  { slug: 'riverbend-b', districtCode: 'central', name: 'Riverbend Crew B', hoursPerDay: 8, members: ['Noor Ellisford', 'Caleb Wrenfield'] },
  { slug: 'south-meadows-a', districtCode: 'south', name: 'South Meadows Crew A', hoursPerDay: 9, members: ['Sunniva Brackwater', 'Mateo Ollerby', 'Ida Tamsworth'] },
  { slug: 'south-meadows-b', districtCode: 'south', name: 'South Meadows Crew B', hoursPerDay: 10, members: ['Femi Hollowcroft', 'Greta Vandersloot', 'Arlo Pinchbeck', 'Rosa Kettleby'] },
];

const email = (local: string) => `${local}@${DEMO_EMAIL_DOMAIN}`;

function buildUsers(): DemoUser[] {
  const user = (role: Role, local: string, name: string, scope: Partial<Pick<DemoUser, 'districtCode' | 'crewName' | 'siteKeys'>> = {}): DemoUser => ({
    email: email(local),
    name,
    role,
    districtCode: scope.districtCode ?? null,
    crewName: scope.crewName ?? null,
    siteKeys: scope.siteKeys ?? [],
    password: DEMO_PASSWORDS[role],
  });
  return [
    user('admin', 'admin', 'Ines Marlowby'),
    user('head', 'head', 'Theodora Quillfeather'),
    user('foreman', 'foreman.north', 'Marguerite Fenwold', { districtCode: 'north' }),
    user('foreman', 'foreman.central', 'Desmond Arkwell', { districtCode: 'central' }),
    user('foreman', 'foreman.south', 'Yolanda Brisbourne', { districtCode: 'south' }),
    // Each crew lead is the first member of the crew.
    ...CREW_SPECS.map((c) => user('crew', `crew.${c.slug}`, c.members[0]!, { districtCode: c.districtCode, crewName: c.name })),
    // Partners: the athletic directors of two high schools and a youth league's field contact.
    user('partner', 'partner.kestrel-hill', 'Renata Solvik', {
      siteKeys: ['kestrel-hill-hs', 'wren-meadow-ms'],
    }),
    user('partner', 'partner.marsh-hollow', 'Gideon Thwaitely', {
      siteKeys: ['marsh-hollow-hs', 'cattail-creek-ms', 'juniper-row-es'],
    }),
    user('partner', 'partner.youth-soccer', 'Anneliese Corrowby', {
      siteKeys: ['millrace-park', 'sycamore-flats-park', 'alder-run-park'],
    }),
  ];
}

const STATION_SPECS: { code: string; name: string; at: [number, number]; elevationM: number; climate: StationClimate }[] = [
  {
    code: 'SLW-NR',
    name: 'North Ridge Yard weather station',
    at: [-0.3, 2.1],
    elevationM: 46,
    climate: { tempOffsetC: 0, rangeOffsetC: 0, rhOffsetPct: 0, windOffsetMs: 0 },
  },
  {
    code: 'SLW-MS',
    name: 'Mere Shore weather station',
    at: [1.7, -2.5],
    elevationM: 7,
    climate: { tempOffsetC: 0.4, rangeOffsetC: -0.8, rhOffsetPct: 3, windOffsetMs: 0.3 },
  },
];

// ---------------------------------------------------------------------------------------------
// Assembly
// ---------------------------------------------------------------------------------------------

function shapeRing(shape: ShapeSpec, key: string): Vec[] {
  switch (shape.kind) {
    case 'rect':
      return rectangleShape(shape.lengthM, shape.widthM);
    case 'fan':
      return fanShape(shape.foulLineM, shape.centerFieldM);
    case 'lawn':
      return lawnShape(rngFor(`lawn:${key}`), shape.areaM2, shape.aspect);
  }
}

/** House number and street for a site point: the block's south street (north one by the river). */
function addressOf(at: [number, number]): string {
  const [x, y] = at;
  const west = NS_STREETS.filter((s) => s.x < x).at(-1);
  const south = EW_STREETS.find((s) => Math.abs(s.y - (y - 0.4)) < 1e-9);
  const north = EW_STREETS.find((s) => Math.abs(s.y - (y + 0.4)) < 1e-9);
  const street = south ?? north ?? west;
  const number = Math.round(((street === west ? y + 4 : x + 5) * 1000) / 10) * 10;
  return `${number} ${street?.name ?? 'Ridge Avenue'}, ${DEMO_CITY_NAME}`;
}

function lineFeature(points: [number, number][], properties: Record<string, string>): Feature<LineString> {
  return {
    type: 'Feature',
    properties,
    geometry: { type: 'LineString', coordinates: points.map(([x, y]) => offsetPosition(CENTER, x * 1000, y * 1000)) },
  };
}

function polygonFeature(polygon: Polygon, properties: Record<string, string>): Feature<GeoPolygon> {
  return { type: 'Feature', properties, geometry: polygon as GeoPolygon };
}

function buildBasemap(parkOutlines: { siteKey: string; name: string; outline: Polygon }[]): FeatureCollection {
  const features: Feature[] = [];
  for (const s of NS_STREETS)
    features.push(
      lineFeature(
        [
          [s.x, -4],
          [s.x, 4],
        ],
        { kind: s.kind, name: s.name },
      ),
    );
  for (const s of EW_STREETS)
    features.push(
      lineFeature(
        [
          [-5, s.y],
          [5, s.y],
        ],
        { kind: s.kind, name: s.name },
      ),
    );
  features.push(lineFeature(HIGHWAY.points, { kind: 'highway', name: HIGHWAY.name }));

  const river: [number, number][] = [];
  for (let i = 0; i <= 56; i++) {
    const x = -5.6 + i * 0.2;
    river.push([x, riverY(x)]);
  }
  features.push(lineFeature(river, { kind: 'river', name: RIVER_NAME }));

  const rng = rngFor('lake');
  const lakeRing: Vec[] = [];
  for (let i = 0; i < 20; i++) {
    const t = (i / 20) * 2 * Math.PI;
    const r = uniform(rng, 250, 330);
    lakeRing.push([LAKE.center[0] * 1000 + r * 1.15 * Math.cos(t), LAKE.center[1] * 1000 + r * 0.9 * Math.sin(t)]);
  }
  features.push(polygonFeature(ringToPolygon(CENTER, lakeRing), { kind: 'lake', name: LAKE.name }));

  for (const p of parkOutlines) features.push(polygonFeature(p.outline, { kind: 'park', siteKey: p.siteKey, name: p.name }));
  return { type: 'FeatureCollection', features };
}

/** Builds the whole invented demo city. Pure: equal calls give equal results. */
export function buildDemoCity(): DemoCity {
  const districts: DemoDistrict[] = DISTRICT_SPECS.map((d) => {
    const yard = km(d.yard.at[0], d.yard.at[1]);
    return { code: d.code, name: d.name, boundary: kmRing(d.ring), yard: { name: d.yard.name, lat: yard.lat, lng: yard.lng } };
  });

  const sites: DemoSite[] = [];
  const fields: DemoField[] = [];
  const parkOutlines: { siteKey: string; name: string; outline: Polygon }[] = [];
  for (const spec of SITE_SPECS) {
    const point = km(spec.at[0], spec.at[1]);
    sites.push({
      key: spec.key,
      districtCode: spec.district,
      name: spec.name,
      kind: spec.kind,
      owner: spec.kind === 'school' ? 'school_district' : 'city',
      address: addressOf(spec.at),
      lat: point.lat,
      lng: point.lng,
      notes: spec.notes,
    });

    const rng = rngFor(`site:${spec.key}`);
    const layout = layoutSite(
      spec.fields.map((f) => ({ ring: shapeRing(f.shape, `${spec.key}/${f.name}`), jitterDeg: Math.round(uniform(rng, -2.5, 2.5) * 10) / 10 })),
      spec.bearing,
    );
    spec.fields.forEach((f, i) => {
      const rootzone = f.rootzone ?? 'native_soil';
      fields.push({
        siteKey: spec.key,
        name: f.name,
        sport: f.sport,
        grass: f.grass,
        rootzone,
        irrigation: f.irrigation,
        maintenanceLevel: f.level,
        hocOverrideMm: f.hocMm ?? null,
        clippings: f.clippings ?? (f.level === 1 || rootzone === 'sand_based' ? 'removed' : 'returned'),
        status: f.status ?? 'open',
        statusNote: f.statusNote ?? '',
        weeklyUseHours: f.useH,
        geometry: ringToPolygon(point, layout.rings[i]!),
      });
    });
    parkOutlines.push({ siteKey: spec.key, name: spec.name, outline: ringToPolygon(point, layout.outline) });
  }

  const crews: DemoCrew[] = CREW_SPECS.map((c) => ({ districtCode: c.districtCode, name: c.name, hoursPerDay: c.hoursPerDay, members: [...c.members] }));

  const weatherStations = demoWeatherStations();
  const weather = STATION_SPECS.flatMap((s, i) => stationSeason(weatherStations[i]!, s.climate));

  return {
    city: { name: DEMO_CITY_NAME, center: { ...CENTER }, note: CITY_NOTE },
    districts,
    sites,
    fields,
    crews,
    users: buildUsers(),
    weatherStations,
    weather,
    basemap: buildBasemap(parkOutlines),
  };
}

/** The demo city's weather stations. */
export function demoWeatherStations(): DemoWeatherStation[] {
  return STATION_SPECS.map((s) => {
    const p = km(s.at[0], s.at[1]);
    return { code: s.code, name: s.name, lat: p.lat, lng: p.lng, elevationM: s.elevationM };
  });
}

/**
 * Every demo station's invented weather from `from` to `to` (inclusive), whatever the dates:
 * a day gets the same weather in every window (see `stationWeather`).
 */
export function demoCityWeather(from: string, to: string): DemoWeatherDay[] {
  const stations = demoWeatherStations();
  return STATION_SPECS.flatMap((s, i) => stationWeather(stations[i]!, s.climate, from, to));
}
