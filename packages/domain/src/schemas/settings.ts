/** Department settings an administrator changes through the API. */
import { z } from 'zod';
import { isTimeZone } from '../clock.ts';
import { versionSchema } from './common.ts';

/** An IANA time-zone name, stored as the runtime spells it (`us/central` → `America/Chicago`). */
export const timeZoneSchema = z
  .string({ error: 'the time zone is a name such as America/Chicago' })
  .trim()
  .refine(isTimeZone, 'use an IANA time zone such as America/Chicago or America/New_York')
  // `overwrite` keeps the input type (the OpenAPI document describes it as a plain string); it
  // runs even after a failed check, so an unknown name is passed through for the refine to report.
  .overwrite((name) => (isTimeZone(name) ? new Intl.DateTimeFormat('en-US', { timeZone: name }).resolvedOptions().timeZone : name));

export const updateDepartmentSettingsSchema = z.object({
  timeZone: timeZoneSchema,
  version: versionSchema,
});
export type UpdateDepartmentSettingsInput = z.infer<typeof updateDepartmentSettingsSchema>;
