/** The water budget card for the week. */
import { CAUTIONS, grossIrrigationMm, irrigationVolumeLitres, netIrrigationMm, runTimeMinutes, type WaterNeed } from '@swardwise/domain';
import type { WeatherRow } from '../stations.ts';
import { input, r, sum, type NeedsBasis } from './basis.ts';

/** Penman–Monteith needs more than temperatures; the engine takes Hargreaves otherwise. */
const hasMoreThanTemperatures = (row: WeatherRow) => row.rhMaxPct !== null || row.windMs !== null || row.sunshineH !== null || row.solarMJ !== null;

export function waterCard(b: NeedsBasis): WaterNeed {
  const { field, level, std, params, station, run, prepared, daily, w0, w1, weekDays, inWeek, season } = b;
  const weekRows = run.slice(w0, w1 + 1);
  const hargreavesDays = weekRows.filter((d) => !hasMoreThanTemperatures(d)).length;
  const et0Week = sum(inWeek(prepared.et0Mm));
  const etcWeek = sum(inWeek(daily.etcMm));
  const rainWeek = sum(inWeek(prepared.rainMm));
  const effWeek = sum(inWeek(prepared.effectiveRainMm));
  const irrigated = daily.share > 0;
  const netMm = irrigated ? netIrrigationMm(etcWeek, effWeek, daily.share) : 0;
  const grossMm = irrigated ? grossIrrigationMm(netMm, daily.du) : 0;
  return {
    irrigated,
    notIrrigatedReason: irrigated ? null : field.irrigation === 'none' ? 'The field has no irrigation.' : `Level ${level} (${std.name}) is not irrigated in the Standards.`,
    et0Method: hargreavesDays === 0 ? 'penman_monteith' : hargreavesDays === weekDays ? 'hargreaves' : 'mixed',
    et0Mm: et0Week,
    kc: daily.kc,
    etcMm: etcWeek,
    rainMm: rainWeek,
    effectiveRainMm: effWeek,
    shareOfEtc: daily.share,
    netMm,
    grossMm,
    runTimeMin: irrigated ? runTimeMinutes(grossMm, params.irrigation.precipRateMmPerH) : 0,
    volumeL: irrigated ? irrigationVolumeLitres(grossMm, field.areaM2) : 0,
    inputs: [
      input('station', 'Weather station', `${station.name} (${r(station.distanceKm, 1)} km)`),
      input('elevation', 'Station elevation', station.elevationM, 'm'),
      input('kc', `Kc (department's ${season}-season turf Kc${std.reducedKc ? `, less ${params.turfKc.reducedBy}` : ''})`, daily.kc),
      input('share', 'Standards: share of ETc replaced', std.irrigationShareOfEtc, '%'),
      input('du', 'Distribution uniformity (DU)', daily.du, '%'),
      input('precipRate', 'Precipitation rate', params.irrigation.precipRateMmPerH, 'mm/h'),
      input('area', 'Field area', field.areaM2, 'm2'),
    ],
    how: 'ET0 by FAO-56 Penman–Monteith from the station\u2019s daily temperature, humidity, wind and sunshine (Hargreaves on days with temperatures only). ETc = Kc × ET0, with the department\u2019s turf Kc (annual planning values for mowed turf, by default 0.8 cool-season and 0.6 warm-season: University of California ANR turfgrass water guidance). Effective rain: the first 0.1 in of each day is lost, the rest counts (TexasET rule). Net need = share × ETc − effective rain; gross need = net × SM, the scheduling multiplier SM = 1 ÷ (0.4 + 0.6 × DU) of the lower-quarter DU; run time = gross ÷ precipitation rate; volume = gross × area.',
    cautions: [CAUTIONS.water],
  };
}
