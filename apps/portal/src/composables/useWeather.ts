import { computed, type MaybeRefOrGetter, toValue } from 'vue';
import { addDaysIso, et0PenmanMonteith, type WeatherDayInput, type WeatherDayRow, type WeatherStationRow } from '@swardwise/domain';
import { queryKeys } from '../api/queryKeys.ts';
import { listStations, listWeatherDays } from '../api/weather.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useStations() {
  return useApiQuery(queryKeys.stations(), listStations);
}

export interface StationDay {
  date: string;
  day: WeatherDayRow | null;
  /** Reference ET0 (mm) by FAO Penman–Monteith from what the day has; null on a gap. */
  et0Mm: number | null;
}

const doy = (iso: string) => Math.round((Date.parse(`${iso}T00:00:00Z`) - Date.UTC(Number(iso.slice(0, 4)), 0, 1)) / 86_400_000) + 1;
const orUndefined = (v: number | null) => (v === null ? undefined : v);

/** ET0 of one day at a station (FAO-56 eq. 6 with the chapter 3 fall-backs for missing data). */
function dayEt0(day: Pick<WeatherDayInput, 'tmaxC' | 'tminC' | 'rhMaxPct' | 'rhMinPct' | 'windMs' | 'sunshineH' | 'solarMJ'> & { date: string }, station: Pick<WeatherStationRow, 'lat' | 'elevationM'>): number | null {
  try {
    const r = et0PenmanMonteith({
      tmaxC: day.tmaxC,
      tminC: day.tminC,
      latDeg: station.lat,
      elevationM: station.elevationM,
      doy: doy(day.date),
      rhMaxPct: orUndefined(day.rhMaxPct),
      rhMinPct: orUndefined(day.rhMinPct),
      windMs: orUndefined(day.windMs),
      sunshineH: orUndefined(day.sunshineH),
      solarMJ: orUndefined(day.solarMJ),
    });
    return Math.max(0, r.et0Mm);
  } catch {
    return null;
  }
}

/** Every date of a range at a station, the days on file and the gaps between them. */
export function useStationDays(query: MaybeRefOrGetter<{ station: WeatherStationRow; from: string; to: string } | null>) {
  const state = useApiQuery(
    () => {
      const q = toValue(query);
      return queryKeys.weatherDays(q?.station.id ?? null, q?.from ?? '', q?.to ?? '');
    },
    (signal) => {
      const q = toValue(query)!;
      return listWeatherDays(q.station.id, q.from, q.to, signal);
    },
    { enabled: () => toValue(query) !== null },
  );
  const dates = computed<StationDay[]>(() => {
    const q = toValue(query);
    const answer = state.data.value;
    if (!q || !answer) return [];
    const byDate = new Map(answer.days.map((d) => [d.date, d]));
    const out: StationDay[] = [];
    for (let date = q.from; date <= q.to; date = addDaysIso(date, 1)) {
      const day = byDate.get(date) ?? null;
      out.push({ date, day, et0Mm: day ? dayEt0(day, q.station) : null });
    }
    return out;
  });
  return { ...state, dates };
}
