/**
 * FAO-56 reference evapotranspiration. Every equation is from Allen, Pereira, Raes & Smith
 * (1998), *Crop evapotranspiration — Guidelines for computing crop water requirements*,
 * FAO Irrigation and Drainage Paper 56; the equation number is in each name's JSDoc.
 * Units: °C, kPa, MJ m⁻² d⁻¹, m/s at 2 m, mm/day, m above sea level, radians for angles.
 */
import { fail, requireFinite, requireHumidity, requireNonNegative, requirePositive, requireRange, requireTemperature, requireTmaxTmin } from './check.ts';

/** Solar constant Gsc, MJ m⁻² min⁻¹ (FAO-56 eq. 21). */
export const SOLAR_CONSTANT = 0.082;
/** Stefan–Boltzmann constant, MJ K⁻⁴ m⁻² d⁻¹ (FAO-56 eq. 39). */
export const STEFAN_BOLTZMANN = 4.903e-9;
/** Albedo of the grass reference crop (FAO-56 eq. 38). */
export const REFERENCE_ALBEDO = 0.23;
/** MJ m⁻² d⁻¹ → mm/day of evaporation, 1/λ with λ = 2.45 MJ kg⁻¹ (FAO-56 eq. 20). */
export const MJ_TO_MM = 0.408;

/** Degrees → radians (FAO-56 eq. 22). */
export function degToRad(deg: number): number {
  return (Math.PI / 180) * deg;
}

/** Atmospheric pressure P (kPa) from elevation z (m) (FAO-56 eq. 7). */
export function atmosphericPressure(elevationM: number): number {
  requireRange(elevationM, -500, 9000, 'invalid_elevation', 'elevation (m)');
  // A station's elevation is the same every day: keep the last answer rather than a power per day.
  if (elevationM !== lastElevationM) {
    lastElevationM = elevationM;
    lastPressureKPa = 101.3 * ((293 - 0.0065 * elevationM) / 293) ** 5.26;
  }
  return lastPressureKPa;
}
let lastElevationM = Number.NaN;
let lastPressureKPa = Number.NaN;

/** Psychrometric constant γ (kPa °C⁻¹) from pressure P (kPa) (FAO-56 eq. 8). */
export function psychrometricConstant(pressureKPa: number): number {
  requirePositive(pressureKPa, 'invalid_pressure', 'atmospheric pressure (kPa)');
  return 0.665e-3 * pressureKPa;
}

/** Saturation vapour pressure e°(T) (kPa) at air temperature T (°C) (FAO-56 eq. 11). */
export function saturationVapourPressure(tC: number): number {
  requireTemperature(tC);
  return 0.6108 * Math.exp((17.27 * tC) / (tC + 237.3));
}

/** Mean saturation vapour pressure es = (e°(Tmax) + e°(Tmin)) / 2 (kPa) (FAO-56 eq. 12). */
export function meanSaturationVapourPressure(tmaxC: number, tminC: number): number {
  requireTmaxTmin(tmaxC, tminC);
  return (saturationVapourPressure(tmaxC) + saturationVapourPressure(tminC)) / 2;
}

/** Slope of the saturation vapour pressure curve Δ (kPa °C⁻¹) at T (°C) (FAO-56 eq. 13). */
export function vapourPressureSlope(tC: number): number {
  requireTemperature(tC);
  return (4098 * saturationVapourPressure(tC)) / (tC + 237.3) ** 2;
}

/** Actual vapour pressure ea (kPa) from dewpoint (FAO-56 eq. 14). */
export function actualVapourPressureFromDewpoint(tdewC: number): number {
  return saturationVapourPressure(tdewC);
}

/** ea (kPa) from RHmax and RHmin (%) (FAO-56 eq. 17). */
export function actualVapourPressureFromRhMaxMin(tminC: number, tmaxC: number, rhMaxPct: number, rhMinPct: number): number {
  requireTmaxTmin(tmaxC, tminC);
  requireHumidity(rhMaxPct, 'RHmax');
  requireHumidity(rhMinPct, 'RHmin');
  if (rhMinPct > rhMaxPct) fail('invalid_humidity', `RHmin (${rhMinPct} %) must not be above RHmax (${rhMaxPct} %)`);
  return (saturationVapourPressure(tminC) * (rhMaxPct / 100) + saturationVapourPressure(tmaxC) * (rhMinPct / 100)) / 2;
}

/** ea (kPa) from RHmax (%) only (FAO-56 eq. 18). */
export function actualVapourPressureFromRhMax(tminC: number, rhMaxPct: number): number {
  requireHumidity(rhMaxPct, 'RHmax');
  return saturationVapourPressure(tminC) * (rhMaxPct / 100);
}

/** ea (kPa) from RHmean (%) (FAO-56 eq. 19). */
export function actualVapourPressureFromRhMean(tmaxC: number, tminC: number, rhMeanPct: number): number {
  requireHumidity(rhMeanPct, 'RHmean');
  return (rhMeanPct / 100) * meanSaturationVapourPressure(tmaxC, tminC);
}

/** Radiation MJ m⁻² d⁻¹ → equivalent evaporation mm/day (FAO-56 eq. 20). */
export function radiationToEvaporationMm(mj: number): number {
  return MJ_TO_MM * mj;
}

/** Inverse relative distance Earth–Sun dr for day of year J (FAO-56 eq. 23). */
export function inverseRelativeDistance(doy: number): number {
  requireDoy(doy);
  return 1 + 0.033 * Math.cos(((2 * Math.PI) / 365) * doy);
}

/** Solar declination δ (rad) for day of year J (FAO-56 eq. 24). */
export function solarDeclination(doy: number): number {
  requireDoy(doy);
  return 0.409 * Math.sin(((2 * Math.PI) / 365) * doy - 1.39);
}

/**
 * Sunset hour angle ωs (rad) (FAO-56 eq. 25). The argument is clamped to [−1, 1] so polar
 * day and polar night give π and 0 rather than NaN.
 */
export function sunsetHourAngle(latRad: number, declinationRad: number): number {
  requireRange(latRad, -Math.PI / 2, Math.PI / 2, 'invalid_latitude', 'latitude (rad)');
  const x = -Math.tan(latRad) * Math.tan(declinationRad);
  return Math.acos(Math.min(1, Math.max(-1, x)));
}

/** Extraterrestrial radiation Ra (MJ m⁻² d⁻¹) for latitude (rad) and day of year (FAO-56 eq. 21). */
export function extraterrestrialRadiation(latRad: number, doy: number): number {
  const d = solarDeclination(doy);
  return raFromTerms(latRad, inverseRelativeDistance(doy), d, sunsetHourAngle(latRad, d));
}

/** FAO-56 eq. 21 from its terms dr, δ and ωs (computed once per day by `et0PenmanMonteith`). */
function raFromTerms(latRad: number, dr: number, d: number, ws: number): number {
  return ((24 * 60) / Math.PI) * SOLAR_CONSTANT * dr * (ws * Math.sin(latRad) * Math.sin(d) + Math.cos(latRad) * Math.cos(d) * Math.sin(ws));
}

/** Daylight hours N = 24 ωs / π (FAO-56 eq. 34). */
export function daylightHours(sunsetHourAngleRad: number): number {
  return (24 / Math.PI) * sunsetHourAngleRad;
}

/**
 * Solar radiation Rs (MJ m⁻² d⁻¹) from sunshine hours n, daylight hours N and Ra
 * (Ångström, FAO-56 eq. 35; as = 0.25, bs = 0.50 where no calibration exists). In polar
 * night (N = 0, so Ra = 0) there is no sun: Rs = 0, and any sunshine hours are refused.
 */
export function solarRadiationFromSunshine(sunshineH: number, daylightH: number, ra: number, as = 0.25, bs = 0.5): number {
  requireNonNegative(sunshineH, 'invalid_sunshine', 'sunshine hours');
  requireNonNegative(daylightH, 'invalid_sunshine', 'daylight hours');
  if (sunshineH > daylightH + 1e-9) fail('invalid_sunshine', `sunshine hours (${sunshineH}) exceed daylight hours (${daylightH.toFixed(2)})`);
  if (daylightH === 0) return 0;
  return (as + bs * (sunshineH / daylightH)) * ra;
}

/** Clear-sky radiation Rso = (as + bs) Ra where as and bs are calibrated (FAO-56 eq. 36). */
export function clearSkyRadiationCalibrated(ra: number, as = 0.25, bs = 0.5): number {
  return (as + bs) * ra;
}

/** Clear-sky radiation Rso = (0.75 + 2·10⁻⁵ z) Ra (FAO-56 eq. 37). */
export function clearSkyRadiation(ra: number, elevationM: number): number {
  return (0.75 + 2e-5 * elevationM) * ra;
}

/** Net shortwave radiation Rns = (1 − α) Rs, α = 0.23 for the reference grass (FAO-56 eq. 38). */
export function netShortwaveRadiation(rs: number, albedo = REFERENCE_ALBEDO): number {
  requireNonNegative(rs, 'invalid_radiation', 'solar radiation (MJ m⁻² d⁻¹)');
  return (1 - albedo) * rs;
}

/**
 * Net outgoing longwave radiation Rnl (MJ m⁻² d⁻¹) (FAO-56 eq. 39): σ = 4.903·10⁻⁹,
 * K = °C + 273.16, Rs/Rso limited to ≤ 1.
 */
export function netLongwaveRadiation(tmaxC: number, tminC: number, ea: number, rs: number, rso: number): number {
  requireTmaxTmin(tmaxC, tminC);
  requireNonNegative(ea, 'invalid_vapour_pressure', 'actual vapour pressure (kPa)');
  requirePositive(rso, 'invalid_radiation', 'clear-sky radiation (MJ m⁻² d⁻¹)');
  const tmaxK = tmaxC + 273.16;
  const tminK = tminC + 273.16;
  const ratio = Math.min(1, rs / rso);
  return STEFAN_BOLTZMANN * ((tmaxK ** 4 + tminK ** 4) / 2) * (0.34 - 0.14 * Math.sqrt(ea)) * (1.35 * ratio - 0.35);
}

/** Net radiation Rn = Rns − Rnl (FAO-56 eq. 40). */
export function netRadiation(rns: number, rnl: number): number {
  return rns - rnl;
}

/** Soil heat flux for a day or ten-day period: G ≈ 0 (FAO-56 eq. 42). */
export function soilHeatFluxDaily(): number {
  return 0;
}

/**
 * Monthly soil heat flux G (MJ m⁻² d⁻¹): 0.07 (T next − T previous) (FAO-56 eq. 43) when the
 * next month's mean is known, else 0.14 (T this − T previous) (FAO-56 eq. 44).
 */
export function soilHeatFluxMonthly(tMonthC: number, tPrevMonthC: number, tNextMonthC?: number): number {
  requireTemperature(tMonthC, 'monthly mean temperature');
  requireTemperature(tPrevMonthC, 'previous monthly mean temperature');
  if (tNextMonthC !== undefined) return 0.07 * (requireTemperature(tNextMonthC, 'next monthly mean temperature') - tPrevMonthC);
  return 0.14 * (tMonthC - tPrevMonthC);
}

/** Wind speed at 2 m from a measurement uz (m/s) at height z (m) (FAO-56 eq. 47). */
export function windSpeedAt2m(uzMs: number, heightM: number): number {
  requireNonNegative(uzMs, 'invalid_wind', 'wind speed (m/s)');
  requireRange(heightM, 0.5, 100, 'invalid_wind', 'anemometer height (m)');
  return (uzMs * 4.87) / Math.log(67.8 * heightM - 5.42);
}

/**
 * Solar radiation from the temperature range, Rs = kRs √(Tmax − Tmin) Ra (FAO-56 eq. 50);
 * kRs 0.16 interior, 0.19 coastal locations.
 */
export function solarRadiationFromTemperature(ra: number, tmaxC: number, tminC: number, kRs = 0.16): number {
  requireTmaxTmin(tmaxC, tminC);
  requireRange(kRs, 0.1, 0.3, 'invalid_coefficient', 'kRs');
  return kRs * Math.sqrt(tmaxC - tminC) * ra;
}

/** Hargreaves ET0 (mm/day) = 0.0023 (Tmean + 17.8) √(Tmax − Tmin) Ra, Ra in mm/day (FAO-56 eq. 52). */
export function hargreavesEt0(tmaxC: number, tminC: number, raMJ: number): number {
  requireTmaxTmin(tmaxC, tminC);
  const tmean = (tmaxC + tminC) / 2;
  return Math.max(0, 0.0023 * (tmean + 17.8) * Math.sqrt(tmaxC - tminC) * radiationToEvaporationMm(raMJ));
}

/** Inputs to the FAO Penman–Monteith equation, each already computed. */
export interface PenmanMonteithTerms {
  /** Δ, kPa °C⁻¹ */ delta: number;
  /** Rn, MJ m⁻² d⁻¹ */ rn: number;
  /** G, MJ m⁻² d⁻¹ */ g: number;
  /** γ, kPa °C⁻¹ */ gamma: number;
  /** mean daily air temperature at 2 m, °C */ tMeanC: number;
  /** wind speed at 2 m, m/s */ u2: number;
  /** es, kPa */ es: number;
  /** ea, kPa */ ea: number;
}

/** FAO Penman–Monteith reference ET0 (mm/day) (FAO-56 eq. 6); negative results are returned as computed. */
export function penmanMonteithEt0(t: PenmanMonteithTerms): number {
  const num = 0.408 * t.delta * (t.rn - t.g) + t.gamma * (900 / (t.tMeanC + 273)) * t.u2 * (t.es - t.ea);
  return num / (t.delta + t.gamma * (1 + 0.34 * t.u2));
}

/** One day (or month) of weather for ET0. Optional fields fall back as FAO-56 chapter 3 recommends. */
export interface Et0Input {
  tmaxC: number;
  tminC: number;
  /** Latitude in degrees, north positive. */
  latDeg: number;
  elevationM: number;
  /** Day of year J (1–366). */
  doy: number;
  tdewC?: number;
  rhMaxPct?: number;
  rhMinPct?: number;
  rhMeanPct?: number;
  /** Actual vapour pressure if known (kPa). */
  eaKPa?: number;
  /** Wind speed in m/s at windHeightM (default 2 m). */
  windMs?: number;
  windHeightM?: number;
  sunshineH?: number;
  /** Measured solar radiation Rs, MJ m⁻² d⁻¹. */
  solarMJ?: number;
  /** Soil heat flux G (MJ m⁻² d⁻¹); 0 for daily steps (eq. 42). */
  soilHeatFluxMJ?: number;
  /** Use kRs 0.19 (coastal) rather than 0.16 (interior) when Rs comes from temperature. */
  coastal?: boolean;
}

/** ET0 and every intermediate value, with the methods used. */
export interface Et0Result {
  et0Mm: number;
  tMeanC: number;
  pressureKPa: number;
  gamma: number;
  delta: number;
  es: number;
  ea: number;
  u2: number;
  dr: number;
  declination: number;
  sunsetHourAngle: number;
  daylightH: number;
  ra: number;
  rs: number;
  rso: number;
  rns: number;
  rnl: number;
  rn: number;
  g: number;
  eaMethod: 'given' | 'dewpoint' | 'rh_max_min' | 'rh_max' | 'rh_mean' | 'tmin_as_dewpoint';
  rsMethod: 'measured' | 'sunshine' | 'temperature';
  windAssumed: boolean;
}

/**
 * Daily (or monthly, with `soilHeatFluxMJ`) ET0 by FAO Penman–Monteith (FAO-56 eq. 6),
 * computing each term from eq. 7, 8, 11–13, 14/17/18/19, 21–25, 34/35 or 50, 37–40, 47.
 * Missing humidity: Tdew ≈ Tmin (FAO-56 eq. 48 with Ko = 0); missing wind: u2 = 2 m/s
 * (FAO-56 chapter 3, "missing wind speed data"); missing radiation: eq. 50.
 */
export function et0PenmanMonteith(input: Et0Input): Et0Result {
  const { tmaxC, tminC } = input;
  requireTmaxTmin(tmaxC, tminC);
  requireRange(input.latDeg, -90, 90, 'invalid_latitude', 'latitude (°)');
  const tMeanC = (tmaxC + tminC) / 2;
  const pressureKPa = atmosphericPressure(input.elevationM);
  const gamma = psychrometricConstant(pressureKPa);
  const delta = vapourPressureSlope(tMeanC);
  const es = meanSaturationVapourPressure(tmaxC, tminC);

  let ea: number;
  let eaMethod: Et0Result['eaMethod'];
  if (input.eaKPa !== undefined) {
    ea = requireNonNegative(input.eaKPa, 'invalid_vapour_pressure', 'actual vapour pressure (kPa)');
    eaMethod = 'given';
  } else if (input.tdewC !== undefined) {
    if (input.tdewC > tmaxC) fail('invalid_temperature', `dewpoint (${input.tdewC} °C) must not be above Tmax (${tmaxC} °C)`);
    ea = actualVapourPressureFromDewpoint(input.tdewC);
    eaMethod = 'dewpoint';
  } else if (input.rhMaxPct !== undefined && input.rhMinPct !== undefined) {
    ea = actualVapourPressureFromRhMaxMin(tminC, tmaxC, input.rhMaxPct, input.rhMinPct);
    eaMethod = 'rh_max_min';
  } else if (input.rhMaxPct !== undefined) {
    ea = actualVapourPressureFromRhMax(tminC, input.rhMaxPct);
    eaMethod = 'rh_max';
  } else if (input.rhMeanPct !== undefined) {
    ea = actualVapourPressureFromRhMean(tmaxC, tminC, input.rhMeanPct);
    eaMethod = 'rh_mean';
  } else {
    ea = saturationVapourPressure(tminC);
    eaMethod = 'tmin_as_dewpoint';
  }

  const windAssumed = input.windMs === undefined;
  const u2 = windAssumed ? 2 : windSpeedAt2m(input.windMs as number, input.windHeightM ?? 2);

  const latRad = degToRad(input.latDeg);
  const dr = inverseRelativeDistance(input.doy);
  const declination = solarDeclination(input.doy);
  const ws = sunsetHourAngle(latRad, declination);
  const daylightH = daylightHours(ws);
  const ra = raFromTerms(latRad, dr, declination, ws);
  const rso = clearSkyRadiation(ra, input.elevationM);

  let rs: number;
  let rsMethod: Et0Result['rsMethod'];
  if (input.solarMJ !== undefined) {
    rs = requireNonNegative(input.solarMJ, 'invalid_radiation', 'solar radiation (MJ m⁻² d⁻¹)');
    rsMethod = 'measured';
  } else if (input.sunshineH !== undefined) {
    rs = solarRadiationFromSunshine(input.sunshineH, daylightH, ra);
    rsMethod = 'sunshine';
  } else {
    rs = solarRadiationFromTemperature(ra, tmaxC, tminC, input.coastal ? 0.19 : 0.16);
    rsMethod = 'temperature';
  }

  const rns = netShortwaveRadiation(rs);
  // Polar night: no clear-sky radiation, so no longwave term from the cloudiness ratio.
  const rnl = rso > 0 ? netLongwaveRadiation(tmaxC, tminC, ea, rs, rso) : 0;
  const rn = netRadiation(rns, rnl);
  const g = input.soilHeatFluxMJ === undefined ? soilHeatFluxDaily() : requireFinite(input.soilHeatFluxMJ, 'invalid_radiation', 'soil heat flux');
  const et0Mm = penmanMonteithEt0({ delta, rn, g, gamma, tMeanC, u2, es, ea });
  return {
    et0Mm,
    tMeanC,
    pressureKPa,
    gamma,
    delta,
    es,
    ea,
    u2,
    dr,
    declination,
    sunsetHourAngle: ws,
    daylightH,
    ra,
    rs,
    rso,
    rns,
    rnl,
    rn,
    g,
    eaMethod,
    rsMethod,
    windAssumed,
  };
}

/** The terms of a station that do not change from day to day, for `et0PenmanMonteithDay`. */
export interface Et0Station {
  latDeg: number;
  latRad: number;
  elevationM: number;
  /** γ from the station's pressure (FAO-56 eq. 7 and 8). */
  gamma: number;
  coastal: boolean;
}

/** A station's fixed terms: latitude in radians, γ from its elevation. */
export function et0Station(latDeg: number, elevationM: number, coastal = false): Et0Station {
  requireRange(latDeg, -90, 90, 'invalid_latitude', 'latitude (°)');
  return { latDeg, latRad: degToRad(latDeg), elevationM, gamma: psychrometricConstant(atmosphericPressure(elevationM)), coastal };
}

/** One day of a station's weather for `et0PenmanMonteithDay` (the optional inputs of `Et0Input`). */
export type Et0Day = Pick<Et0Input, 'tmaxC' | 'tminC' | 'tdewC' | 'rhMaxPct' | 'rhMinPct' | 'rhMeanPct' | 'windMs' | 'windHeightM' | 'sunshineH' | 'solarMJ'>;

const inRange = (v: number | undefined, lo: number, hi: number) => v === undefined || (v >= lo && v <= hi);
/** e°(T), FAO-56 eq. 11, for temperatures already checked. */
const e0 = (t: number) => 0.6108 * Math.exp((17.27 * t) / (t + 237.3));
/** A day `et0PenmanMonteithDay` does not take: the full function gives the answer or the error. */
function et0Refused(station: Et0Station, doy: number, d: Et0Day): number {
  return et0PenmanMonteith({ ...d, latDeg: station.latDeg, elevationM: station.elevationM, doy, coastal: station.coastal }).et0Mm;
}

/**
 * Daily ET0 (mm/day) by FAO Penman–Monteith for a prepared station: the same equations, in
 * the same order, as `et0PenmanMonteith` (eq. 6, 7, 8, 11–14, 17–19, 21–25, 34, 35, 37–39,
 * 47, 50), without the intermediate results, so that a season of weather for many stations
 * costs no allocation per day. A day the checks of `et0PenmanMonteith` would refuse is passed
 * to it, so it fails with the same message.
 */
export function et0PenmanMonteithDay(station: Et0Station, doy: number, d: Et0Day): number {
  const { tmaxC, tminC } = d;
  const valid =
    tmaxC >= -60 && tmaxC <= 60 && tminC >= -60 && tminC <= tmaxC &&
    doy >= 1 && doy <= 366 && Number.isInteger(doy) &&
    (d.tdewC === undefined || (d.tdewC >= -60 && d.tdewC <= tmaxC)) &&
    inRange(d.rhMaxPct, 0, 100) && inRange(d.rhMinPct, 0, 100) && inRange(d.rhMeanPct, 0, 100) &&
    (d.rhMaxPct === undefined || d.rhMinPct === undefined || d.rhMinPct <= d.rhMaxPct) &&
    inRange(d.windMs, 0, Infinity) && d.windMs !== Infinity && inRange(d.windHeightM, 0.5, 100) &&
    inRange(d.sunshineH, 0, 24) && inRange(d.solarMJ, 0, Infinity) && d.solarMJ !== Infinity;
  // No closures in here (this runs for every day of every station).
  if (!valid) return et0Refused(station, doy, d);
  const tMeanC = (tmaxC + tminC) / 2;
  const delta = (4098 * e0(tMeanC)) / (tMeanC + 237.3) ** 2;
  const es = (e0(tmaxC) + e0(tminC)) / 2;
  let ea: number;
  if (d.tdewC !== undefined) ea = e0(d.tdewC);
  else if (d.rhMaxPct !== undefined && d.rhMinPct !== undefined) ea = (e0(tminC) * (d.rhMaxPct / 100) + e0(tmaxC) * (d.rhMinPct / 100)) / 2;
  else if (d.rhMaxPct !== undefined) ea = e0(tminC) * (d.rhMaxPct / 100);
  else if (d.rhMeanPct !== undefined) ea = (d.rhMeanPct / 100) * es;
  else ea = e0(tminC);
  const u2 = d.windMs === undefined ? 2 : (d.windMs * 4.87) / Math.log(67.8 * (d.windHeightM ?? 2) - 5.42);
  const dr = 1 + 0.033 * Math.cos(((2 * Math.PI) / 365) * doy);
  const declination = 0.409 * Math.sin(((2 * Math.PI) / 365) * doy - 1.39);
  const ws = Math.acos(Math.min(1, Math.max(-1, -Math.tan(station.latRad) * Math.tan(declination))));
  const daylightH = (24 / Math.PI) * ws;
  const ra = raFromTerms(station.latRad, dr, declination, ws);
  const rso = (0.75 + 2e-5 * station.elevationM) * ra;
  let rs: number;
  if (d.solarMJ !== undefined) rs = d.solarMJ;
  else if (d.sunshineH !== undefined) {
    if (d.sunshineH > daylightH + 1e-9) return et0Refused(station, doy, d);
    rs = daylightH === 0 ? 0 : (0.25 + 0.5 * (d.sunshineH / daylightH)) * ra;
  } else rs = (station.coastal ? 0.19 : 0.16) * Math.sqrt(tmaxC - tminC) * ra;
  const rns = (1 - REFERENCE_ALBEDO) * rs;
  let rnl = 0;
  if (rso > 0) {
    const tmaxK = tmaxC + 273.16;
    const tminK = tminC + 273.16;
    rnl = STEFAN_BOLTZMANN * ((tmaxK ** 4 + tminK ** 4) / 2) * (0.34 - 0.14 * Math.sqrt(ea)) * (1.35 * Math.min(1, rs / rso) - 0.35);
  }
  return penmanMonteithEt0({ delta, rn: rns - rnl, g: 0, gamma: station.gamma, tMeanC, u2, es, ea });
}

/** Hargreaves ET0 (mm/day) for a day at a latitude, Ra from eq. 21 (FAO-56 eq. 52). */
export function et0Hargreaves(tmaxC: number, tminC: number, latDeg: number, doy: number): number {
  requireRange(latDeg, -90, 90, 'invalid_latitude', 'latitude (°)');
  return hargreavesEt0(tmaxC, tminC, extraterrestrialRadiation(degToRad(latDeg), doy));
}

function requireDoy(doy: number): void {
  requireRange(doy, 1, 366, 'invalid_day_of_year', 'day of year');
  if (!Number.isInteger(doy)) fail('invalid_day_of_year', `day of year must be a whole number (got ${doy})`);
}
