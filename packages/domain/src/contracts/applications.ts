/** Application records: what was put on a field, by whom, in what weather. */
import type { ApplicationRateUnit, ApplicationTask } from '../schemas/work.ts';
import type { Instant } from './common.ts';

/** The station's day when the application was made (what is on file; wind only where the station reports it). */
export interface ApplicationWeather {
  stationName: string;
  date: string;
  tmaxC: number;
  tminC: number;
  rainMm: number;
  windMs: number | null;
  kind: 'observed' | 'forecast';
}

export interface ApplicationRow<At extends Instant = string> {
  id: number;
  fieldId: number;
  fieldName: string;
  siteName: string;
  districtId: number;
  workOrderId: number | null;
  task: ApplicationTask;
  product: string;
  rate: number;
  rateUnit: ApplicationRateUnit;
  areaM2: number;
  appliedOn: string;
  applicator: string;
  licenceNumber: string | null;
  weather: ApplicationWeather | null;
  notes: string;
  createdByName: string | null;
  createdAt: At;
}

export interface ApplicationsAnswer<At extends Instant = string> {
  applications: ApplicationRow<At>[];
}
