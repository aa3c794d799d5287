import { z } from 'zod';
import { idSchema, versionSchema } from './common.ts';

const metres = (what: string, min: number, max: number) =>
  z.coerce
    .number({ error: `${what} must be a number of metres` })
    .refine(Number.isFinite, { error: `${what} must be a number of metres` })
    .pipe(z.number().min(min, { error: `${what} must be at least ${min} m` }).max(max, { error: `${what} must be at most ${max} m` }));

/** Where a logo sits in the field frame (m from the end line and the side line), its width, turn and grid. */
export const logoPlacementShape = {
  centerXM: metres('Centre along the field', -50, 400),
  centerYM: metres('Centre across the field', -50, 300),
  widthM: metres('Logo width', 0.5, 100),
  rotationDeg: z.coerce
    .number({ error: 'Rotation must be a number of degrees' })
    .refine(Number.isFinite, { error: 'Rotation must be a number of degrees' })
    .pipe(z.number().min(-360, { error: 'Rotation must be between −360° and 360°' }).max(360, { error: 'Rotation must be between −360° and 360°' })),
  gridSpacingM: metres('Grid spacing', 0.1, 10),
};

const nameSchema = z.string().trim().min(1, { error: 'Give the logo a name' }).max(80, { error: 'A logo name is at most 80 characters' });

/** The text fields sent beside an uploaded logo (multipart): its name; placement defaults to the field's centre. */
export const createLogoSchema = z.object({ name: nameSchema });
export type CreateLogoInput = z.infer<typeof createLogoSchema>;

/** Moving, scaling or turning a placed logo, at the version read. */
export const updateLogoSchema = z.object({ name: nameSchema, ...logoPlacementShape }).partial().extend({ version: versionSchema });
export type UpdateLogoInput = z.infer<typeof updateLogoSchema>;

/** `/api/fields/:id/logos/:logoId`. */
export const logoParamsSchema = z.object({ id: idSchema, logoId: idSchema });
