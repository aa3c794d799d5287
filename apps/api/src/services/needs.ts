/**
 * What a field needs for a week: every figure comes from the turf engine, fed with the
 * field, its level's Standards (from the `standards` table), the department parameters and
 * the daily weather of the nearest station. Each block carries the inputs it used, a short
 * note on how it is worked out, and the cautions that apply. The cards are worked out in
 * `needs/`; this assembles the answer.
 */
import { weatherGapUntil, type FieldNeeds, type NeedInput } from '@swardwise/domain';
import { cachedAnswer } from './answer-cache.ts';
import type { Ctx } from './context.ts';
import { loadNeedsBasis, r, type NeedsBasis } from './needs/basis.ts';
import { feedCard } from './needs/feed.ts';
import { levelCard } from './needs/level.ts';
import { fieldWork } from './needs/work.ts';
import { linesCard } from './needs/lines.ts';
import { growthCard, hocCard, labourCard, mowingCard } from './needs/mowing.ts';
import { waterCard } from './needs/water.ts';

export type { FieldNeeds, NeedInput };

/** The day-by-day season the chart draws. */
function seasonBlock(b: NeedsBasis, seasonMowings: { date: string }[], feedApplications: { date: string; nGPerM2: number }[]) {
  const { station, prepared, daily } = b;
  return {
    stationId: station.id,
    start: prepared.startDate,
    end: prepared.dates[prepared.dates.length - 1]!,
    dates: prepared.dates,
    gp: Array.from(daily.gp, (v) => r(v)),
    growthMm: daily.growthMm.map((v) => r(v, 2)),
    waterNeedMm: Array.from(daily.grossNeedMm, (v) => r(v, 2)),
    mowings: seasonMowings.map((m) => m.date),
    feedApplications: feedApplications.map((a) => ({ date: a.date, nGPerM2: a.nGPerM2 })),
  };
}

export async function fieldNeeds(ctx: Ctx, fieldId: number, date?: string): Promise<FieldNeeds> {
  const b = await loadNeedsBasis(ctx, fieldId, date);
  const { field, level, std, station, prepared, versions, missing } = b;
  const { hoc, hocMm, mower } = hocCard(b);
  const work = await fieldWork(ctx, b);
  const { mowing, seasonMowings } = mowingCard(b, hocMm, work.plannedThisWeek);
  const water = waterCard(b);
  const feed = feedCard(b, water.irrigated);
  return {
    fieldId: field.id,
    requestedDate: b.requested,
    week: { start: b.weekStart, end: b.weekEnd, days: b.weekDays, fallback: b.weatherNote !== null },
    weatherNote: b.weatherNote,
    weatherGap: weatherGapUntil(b.lastWeatherDate, ctx.clock.today()),
    station: { id: station.id, code: station.code, name: station.name, distanceKm: station.distanceKm, hargreavesDays: prepared.hargreavesDays },
    standards: { level, name: std.name, version: versions[level], missingLevels: missing },
    hoc,
    growth: growthCard(b),
    mowing,
    labour: labourCard(b, mower, mowing.mowingsPerWeek, seasonMowings.length),
    water,
    feed,
    lines: linesCard(b),
    level: await levelCard(ctx, b, work.compliance),
    season: seasonBlock(b, seasonMowings, feed.applications),
  };
}

/**
 * The needs answer as JSON, cached per scope, field, week asked and today (the fingerprint
 * covers every table it reads: field, site, Standards, parameters, weather, checks, work
 * orders): the engine's season runs once per change, not once per request. A field the caller
 * may not read is refused on the build, so no scope ever holds an entry for it.
 */
export async function fieldNeedsJson(ctx: Ctx, fieldId: number, date?: string): Promise<string> {
  const key = `${fieldId}|${date ?? ''}|${ctx.clock.today()}`;
  return cachedAnswer(ctx, 'needs', key, async () => JSON.stringify({ needs: await fieldNeeds(ctx, fieldId, date) }));
}
