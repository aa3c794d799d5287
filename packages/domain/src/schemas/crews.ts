import { z } from 'zod';
import { EQUIPMENT_KINDS, MOWER_KINDS } from '../vocabulary.ts';
import { WEEKDAYS } from '../engine/dates.ts';
import { changeOf, idSchema } from './common.ts';

const crewFields = {
  districtId: idSchema,
  name: z.string().trim().min(2, 'enter a crew name').max(80),
  hoursPerDay: z.number({ error: 'hours per day is required' }).min(0.5, 'at least half an hour a day').max(16, 'more than 16 hours a day is not a shift'),
  members: z.array(z.string().trim().min(1).max(80)).max(20, 'at most 20 members'),
  workDays: z
    .array(z.enum(WEEKDAYS, { error: `a working day is one of ${WEEKDAYS.join(', ')}` }))
    .min(1, 'a crew works at least one day a week')
    .max(7)
    .refine((d) => new Set(d).size === d.length, 'a day is listed twice'),
};

// Defaults belong to creation only: an update that leaves a key out leaves it as it is.
export const createCrewSchema = z.object({ ...crewFields, members: crewFields.members.default([]), workDays: crewFields.workDays.default(['mon', 'tue', 'wed', 'thu', 'fri']) });
export type CreateCrewInput = z.infer<typeof createCrewSchema>;
export const updateCrewSchema = changeOf(crewFields);
export type UpdateCrewInput = z.infer<typeof updateCrewSchema>;

const equipmentFields = {
  districtId: idSchema,
  crewId: idSchema.nullable(),
  kind: z.enum(EQUIPMENT_KINDS, { error: `kind must be one of ${EQUIPMENT_KINDS.join(', ')}` }),
  name: z.string().trim().min(2, 'enter a name or fleet number').max(80),
  cuttingWidthM: z.number().min(0.3, 'a cutting width under 0.3 m is not a mower').max(10, 'wider than 10 m is not a mower').nullable(),
  speedKmh: z.number().min(1, 'working speed is at least 1 km/h').max(25, 'mowing above 25 km/h is not a working speed').nullable(),
  fieldEfficiency: z.number().min(0.4, 'field efficiency is a share between 0.4 and 1').max(1, 'field efficiency is a share between 0.4 and 1').nullable(),
  hocMinMm: z.number().min(3).max(150).nullable(),
  hocMaxMm: z.number().min(3).max(150).nullable(),
  hourMeterH: z.number().min(0, 'the hour meter cannot be negative').max(100_000),
  sharpenIntervalH: z.number().min(1).max(1000).nullable(),
  lastSharpenedAtH: z.number().min(0).max(100_000).nullable(),
  notes: z.string().max(1000),
  active: z.boolean(),
};

const equipmentDefaults = {
  crewId: equipmentFields.crewId.default(null),
  cuttingWidthM: equipmentFields.cuttingWidthM.default(null),
  speedKmh: equipmentFields.speedKmh.default(null),
  fieldEfficiency: equipmentFields.fieldEfficiency.default(null),
  hocMinMm: equipmentFields.hocMinMm.default(null),
  hocMaxMm: equipmentFields.hocMaxMm.default(null),
  hourMeterH: equipmentFields.hourMeterH.default(0),
  sharpenIntervalH: equipmentFields.sharpenIntervalH.default(null),
  lastSharpenedAtH: equipmentFields.lastSharpenedAtH.default(null),
  notes: equipmentFields.notes.default(''),
  active: equipmentFields.active.default(true),
};

type EquipmentShape = {
  kind?: string;
  cuttingWidthM?: number | null;
  speedKmh?: number | null;
  fieldEfficiency?: number | null;
  hocMinMm?: number | null;
  hocMaxMm?: number | null;
  hourMeterH?: number;
  lastSharpenedAtH?: number | null;
};

/** A mower needs width, speed, efficiency and its HOC range; ranges must run low to high. */
function checkEquipment(v: EquipmentShape, ctx: z.RefinementCtx, partial: boolean) {
  if (v.kind && MOWER_KINDS.includes(v.kind as never) && !partial) {
    for (const key of ['cuttingWidthM', 'speedKmh', 'fieldEfficiency', 'hocMinMm', 'hocMaxMm'] as const) {
      if (v[key] == null) ctx.addIssue({ code: 'custom', path: [key], message: 'a mower needs this to plan its hours and heights of cut' });
    }
  }
  if (v.hocMinMm != null && v.hocMaxMm != null && v.hocMinMm > v.hocMaxMm) {
    ctx.addIssue({ code: 'custom', path: ['hocMaxMm'], message: 'the highest HOC is below the lowest' });
  }
  if (v.lastSharpenedAtH != null && v.hourMeterH != null && v.lastSharpenedAtH > v.hourMeterH) {
    ctx.addIssue({ code: 'custom', path: ['lastSharpenedAtH'], message: 'the last sharpening cannot be after the hour meter reading' });
  }
}

export const createEquipmentSchema = z.object({ ...equipmentFields, ...equipmentDefaults }).superRefine((v, ctx) => checkEquipment(v, ctx, false));
export type CreateEquipmentInput = z.infer<typeof createEquipmentSchema>;
export const updateEquipmentSchema = changeOf(equipmentFields).superRefine((v, ctx) => checkEquipment(v, ctx, true));
export type UpdateEquipmentInput = z.infer<typeof updateEquipmentSchema>;
