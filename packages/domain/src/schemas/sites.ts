import { z } from 'zod';
import { SITE_KINDS, SITE_OWNERS } from '../vocabulary.ts';
import { changeOf, idSchema } from './common.ts';

const siteFields = {
  districtId: idSchema,
  name: z.string().trim().min(2, 'enter a site name of at least 2 characters').max(120),
  kind: z.enum(SITE_KINDS, { error: `kind must be one of ${SITE_KINDS.join(', ')}` }),
  owner: z.enum(SITE_OWNERS, { error: `owner must be one of ${SITE_OWNERS.join(', ')}` }),
  address: z.string().trim().max(200),
  lat: z.number({ error: 'latitude is required' }).min(-90).max(90),
  lng: z.number({ error: 'longitude is required' }).min(-180).max(180),
  notes: z.string().max(2000),
};

// Defaults belong to creation only: an update that leaves a key out leaves it as it is.
export const createSiteSchema = z.object({ ...siteFields, address: siteFields.address.default(''), notes: siteFields.notes.default('') });
export type CreateSiteInput = z.infer<typeof createSiteSchema>;

export const updateSiteSchema = changeOf(siteFields);
export type UpdateSiteInput = z.infer<typeof updateSiteSchema>;
