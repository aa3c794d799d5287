/** Department settings an administrator changes through the API. */
import { z } from 'zod';
import { isTimeZone } from '../clock.ts';
import { versionSchema } from './common.ts';

/** An IANA time-zone name, stored as the runtime spells it (`us/central` → `America/Chicago`). */
export const timeZoneSchema = z
  .string({ error: 'the time zone is a name such as America/Chicago' })
  .trim()
  .refine(isTimeZone, 'use an IANA time zone such as America/Chicago or America/New_York')
  .transform((name) => new Intl.DateTimeFormat('en-US', { timeZone: name }).resolvedOptions().timeZone);

export const updateDepartmentSettingsSchema = z.object({
  timeZone: timeZoneSchema,
  version: versionSchema,
});
export type UpdateDepartmentSettingsInput = z.infer<typeof updateDepartmentSettingsSchema>;
