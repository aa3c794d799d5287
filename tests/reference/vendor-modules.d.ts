// Minimal typings for the two untyped cross-check libraries used by the reference tests.
declare module 'convert-units' {
  interface Converter {
    from(unit: string): { to(unit: string): number };
  }
  function convert(value?: number): Converter;
  export default convert;
}

declare module 'suncalc' {
  interface SunTimes {
    sunrise: Date;
    sunset: Date;
  }
  const SunCalc: { getTimes(date: Date, lat: number, lng: number): SunTimes };
  export default SunCalc;
}
