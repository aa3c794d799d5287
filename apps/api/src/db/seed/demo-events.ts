/**
 * Invented bookings of the demo city's sports fields: league games every week or two in each
 * sport's season, a tournament or two, some practices, and a few bookings in the weeks around
 * the day of seeding so the line plan and the week plan have games to prepare for.
 * Deterministic: the same city and seeding date give the same bookings.
 */
import { addDaysIso, type FieldEventKind, type Sport } from '@swardwise/domain';
import type { DemoCity } from './demo-city.ts';
import { DEMO_SEASON } from './demo-weather.ts';
import { rngFor, type Rng } from './prng.ts';

export interface DemoFieldEvent {
  /** Index of the field in `city.fields`. */
  fieldIndex: number;
  kind: FieldEventKind;
  title: string;
  startsOn: string;
  startTime: string | null;
  notes: string;
}

/** A sport's playing seasons in the demo year, as month-day ranges (demo choice, common practice). */
const SEASONS: Record<Exclude<Sport, 'lawn'>, [string, string][]> = {
  soccer: [
    ['03-14', '06-06'],
    ['08-29', '11-21'],
  ],
  football: [['08-28', '11-20']],
  baseball: [['03-21', '07-25']],
  softball: [['03-21', '07-18']],
  lacrosse: [['03-07', '05-30']],
  field_hockey: [['09-04', '11-13']],
  multi_use: [
    ['04-04', '06-06'],
    ['09-12', '11-07'],
  ],
};

/** Invented leagues and teams of Sallowmere. */
const LEAGUE: Record<Exclude<Sport, 'lawn'>, string> = {
  soccer: 'Sallowmere Youth Soccer',
  football: 'Unified schools football',
  baseball: 'City baseball league',
  softball: 'Rec softball league',
  lacrosse: 'Youth lacrosse',
  field_hockey: 'Unified schools field hockey',
  multi_use: 'Small-sided youth soccer',
};
const TEAMS = [
  'North Ridge Hawks',
  'Riverbend Otters',
  'South Meadows Larks',
  'Kestrel Hill Falcons',
  'Copperbeech Owls',
  'Millrace Herons',
  'Tannery Foxes',
  'Sallow Valley Badgers',
  'Lantern Square Comets',
  'Quarry Knoll Rams',
];
/** Kick-off times of a weekend or a weekday evening game. */
const WEEKEND_TIMES = ['09:00', '10:30', '12:00', '14:00'];
const EVENING_TIMES = ['17:30', '18:00', '18:30', '19:00'];

const weekday = (iso: string) => new Date(`${iso}T00:00:00Z`).getUTCDay(); // 0 = Sunday
const pick = <T>(rng: Rng, list: readonly T[]): T => list[Math.floor(rng() * list.length)]!;

/** The first date on or after `iso` that falls on `day` (0 = Sunday). */
function onOrAfter(iso: string, day: number): string {
  return addDaysIso(iso, (day - weekday(iso) + 7) % 7);
}

function matchup(rng: Rng): string {
  const home = pick(rng, TEAMS);
  let away = pick(rng, TEAMS);
  while (away === home) away = pick(rng, TEAMS);
  return `${home} v ${away}`;
}

/**
 * What the seed knows of the season when it books: its years and whether a field's turf can be
 * played on a day (`DemoSeason.playable`, from the engine's growth potential). Without it the
 * bookings are the 2026 season's, whatever the weather.
 */
export interface BookingSeason {
  window: { start: string; today: string };
  playable: (fieldIndex: number, date: string) => boolean;
}

export function demoFieldEvents(city: DemoCity, seededOn: string, season?: BookingSeason): DemoFieldEvent[] {
  const first = Number((season?.window.start ?? DEMO_SEASON.start).slice(0, 4));
  const last = Number((season?.window.today ?? DEMO_SEASON.start).slice(0, 4));
  const years: string[] = [];
  for (let y = first; y <= last; y++) years.push(String(y));
  const siteKind = new Map(city.sites.map((s) => [s.key, s.kind]));
  const events: DemoFieldEvent[] = [];
  const taken = new Set<string>();
  const add = (e: DemoFieldEvent) => {
    const key = `${e.fieldIndex}:${e.startsOn}`;
    if (taken.has(key)) return;
    // No game on dormant or frozen turf: the booking is not made (the league plays elsewhere).
    if (season && !season.playable(e.fieldIndex, e.startsOn)) return;
    taken.add(key);
    events.push(e);
  };

  city.fields.forEach((field, fieldIndex) => {
    if (field.sport === 'lawn') return;
    const sport = field.sport;
    const rng = rngFor(`events:${field.siteKey}:${field.name}`);
    const school = siteKind.get(field.siteKey) === 'school';
    // Schools play on weekday evenings (football on Fridays); parks on Saturdays.
    const day = sport === 'football' ? 5 : school ? pick(rng, [2, 3, 4]) : 6;
    const times = school ? EVENING_TIMES : WEEKEND_TIMES;
    // Better-kept fields host more: every week at levels 1–2, every fortnight below.
    const everyDays = field.maintenanceLevel <= 2 ? 7 : 14;

    for (const year of years) {
      for (const [start, end] of SEASONS[sport]) {
        const last = `${year}-${end}`;
        for (let d = onOrAfter(`${year}-${start}`, day); d <= last; d = addDaysIso(d, everyDays)) {
          // A bye week now and then.
          if (rng() < 0.15) continue;
          add({ fieldIndex, kind: 'game', title: `${LEAGUE[sport]}: ${matchup(rng)}`, startsOn: d, startTime: pick(rng, times), notes: '' });
        }
        // Weekly practices for the first month of the season on the school and complex fields.
        if (field.maintenanceLevel <= 3 && rng() < 0.35) {
          const practiceDay = onOrAfter(`${year}-${start}`, day === 2 ? 4 : 2);
          for (let w = 0; w < 4; w++) {
            add({ fieldIndex, kind: 'practice', title: `${pick(rng, TEAMS)} practice`, startsOn: addDaysIso(practiceDay, w * 7), startTime: '16:30', notes: '' });
          }
        }
      }
    }
  });

  // Two tournaments on the best fields: a spring cup and a fall showcase.
  const showcase = city.fields
    .map((f, i) => ({ f, i }))
    .filter(({ f }) => f.sport !== 'lawn' && f.status === 'open' && f.maintenanceLevel <= 2)
    .sort((a, b) => a.f.maintenanceLevel - b.f.maintenanceLevel || a.f.siteKey.localeCompare(b.f.siteKey) || a.f.name.localeCompare(b.f.name));
  const tournaments: [string, string][] = years.flatMap((year): [string, string][] => [
    [`${year}-06-13`, 'Sallowmere Spring Cup'],
    [`${year}-10-17`, 'Riverbend Fall Showcase'],
  ]);
  tournaments.forEach(([from, name], t) => {
    const host = showcase[(t % 2) * 2];
    if (!host) return;
    for (let d = 0; d < 2; d++) {
      add({
        fieldIndex: host.i,
        kind: 'tournament',
        title: `${name}, day ${d + 1}`,
        startsOn: addDaysIso(onOrAfter(from, 6), d),
        startTime: '08:00',
        notes: 'Lines fresh for day 1, touched up overnight',
      });
    }
  });

  // Bookings in the weeks around the day of seeding, whatever the season, so the demo's week
  // plan has line painting and pre-game mowing to schedule.
  const near = city.fields
    .map((f, i) => ({ f, i }))
    .filter(({ f }) => f.sport !== 'lawn' && f.status !== 'closed');
  near.forEach(({ f, i }, n) => {
    // About one sports field in three, spread over the city.
    if (n % 3 !== 0) return;
    const rng = rngFor(`events-near:${f.siteKey}:${f.name}`);
    const sport = f.sport as Exclude<Sport, 'lawn'>;
    for (let offset = -7 + Math.floor(rng() * 4); offset <= 21; offset += 7 + Math.floor(rng() * 7)) {
      const startsOn = addDaysIso(seededOn, offset);
      const kind: FieldEventKind = rng() < 0.15 ? 'ceremony' : 'game';
      // Out of the league's season a booking is a friendly, not a league game.
      const inSeason = SEASONS[sport].some(([a, b]) => startsOn.slice(5) >= a && startsOn.slice(5) <= b);
      const game = inSeason || !season ? `${LEAGUE[sport]}: ${matchup(rng)}` : `Off-season friendly: ${matchup(rng)}`;
      const title = kind === 'ceremony' ? pick(rng, ['Community day', 'Season awards', 'School field day']) : game;
      add({ fieldIndex: i, kind, title, startsOn, startTime: pick(rng, weekday(startsOn) % 6 === 0 ? WEEKEND_TIMES : EVENING_TIMES), notes: '' });
    }
  });

  return events.sort((a, b) => a.startsOn.localeCompare(b.startsOn) || a.fieldIndex - b.fieldIndex);
}
