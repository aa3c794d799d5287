import { z } from 'zod';
import { isoDateSchema as isoDate } from './common.ts';

/** One day of weather from a station file or the hosted service. SI units. */
export const weatherDaySchema = z
  .object({
    date: isoDate,
    tmaxC: z.number({ error: 'maximum temperature (°C) is required' }).min(-60, 'below −60 °C is not a weather reading').max(60, 'above 60 °C is not a weather reading'),
    tminC: z.number({ error: 'minimum temperature (°C) is required' }).min(-60, 'below −60 °C is not a weather reading').max(60, 'above 60 °C is not a weather reading'),
    rhMaxPct: z.number().min(0, 'humidity is 0–100 %').max(100, 'humidity is 0–100 %').nullable().default(null),
    rhMinPct: z.number().min(0, 'humidity is 0–100 %').max(100, 'humidity is 0–100 %').nullable().default(null),
    windMs: z.number().min(0, 'wind speed cannot be negative').max(75, 'wind above 75 m/s is not a daily mean').nullable().default(null),
    sunshineH: z.number().min(0, 'sunshine hours cannot be negative').max(24, 'a day has 24 hours').nullable().default(null),
    solarMJ: z.number().min(0, 'solar radiation cannot be negative').max(50, 'above 50 MJ/m² a day is not on Earth').nullable().default(null),
    rainMm: z.number().min(0, 'rain cannot be negative').max(1000, 'more than 1,000 mm in a day is not a reading').default(0),
    kind: z.enum(['observed', 'forecast']).default('observed'),
  })
  .refine((d) => d.tminC <= d.tmaxC, { path: ['tminC'], message: 'the minimum temperature is above the maximum' })
  .refine((d) => d.rhMinPct === null || d.rhMaxPct === null || d.rhMinPct <= d.rhMaxPct, {
    path: ['rhMinPct'],
    message: 'the minimum humidity is above the maximum',
  });
export type WeatherDayInput = z.infer<typeof weatherDaySchema>;

export const weatherRangeSchema = z
  .object({ from: isoDate, to: isoDate })
  .refine((r) => r.from <= r.to, { path: ['to'], message: 'the end date is before the start date' })
  .refine((r) => (Date.parse(r.to) - Date.parse(r.from)) / 86_400_000 <= 400, { path: ['to'], message: 'ask for at most 400 days at a time' });
