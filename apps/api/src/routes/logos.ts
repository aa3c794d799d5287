/** Logos on a field: list, upload, place, remove; the picture and the set-out sheet. */
import fs from 'node:fs/promises';
import { Router } from 'express';
import { appError, createLogoSchema, idParamSchema, logoParamsSchema, updateLogoSchema } from '@swardwise/domain';
import type { AppDeps } from '../app-deps.ts';
import { ctxAllowed, ctxOf } from '../http/auth.ts';
import { receiveUpload } from '../http/uploads.ts';
import { parse } from '../http/validate.ts';
import { authorizeFieldWrite } from '../services/field-write.ts';
import { LOGO_MAX_BYTES } from '../services/logo-files.ts';
import { logoGridPdf } from '../services/logo-pdf.ts';
import { addFieldLogo, getFieldLogo, listFieldLogos, logoRenderFile, removeFieldLogo, updateFieldLogo } from '../services/logos.ts';
import { versionQuerySchema } from './write-routes.ts';

const receiveLogo = receiveUpload({ field: 'logo', maxFileBytes: LOGO_MAX_BYTES, maxFields: 1, maxFieldBytes: 200, code: 'field_logo', what: 'The logo' });

export function logosRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/:id/logos', async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json({ logos: await listFieldLogos(ctxOf(db, req), id) });
  });

  router.post(
    '/:id/logos',
    // A caller who may not change the field is refused before the upload is read.
    async (req, _res, next) => {
      const ctx = ctxAllowed(db, req, 'update', 'Field');
      const { id } = parse(idParamSchema, req.params, 'params');
      await authorizeFieldWrite(ctx, id);
      next();
    },
    receiveLogo,
    async (req, res) => {
      const { id } = parse(idParamSchema, req.params, 'params');
      const input = parse(createLogoSchema, req.body ?? {}, 'body');
      if (!req.file) throw appError('field_logo/no_file', 'Choose an SVG or PNG logo to upload', { issues: [{ path: 'body.logo', message: 'choose a logo file' }] });
      res.status(201).json({ logo: await addFieldLogo(ctxOf(db, req), id, input, req.file.buffer, config.uploadsDir) });
    },
  );

  router.patch('/:id/logos/:logoId', async (req, res) => {
    const ctx = ctxAllowed(db, req, 'update', 'Field');
    const { id, logoId } = parse(logoParamsSchema, req.params, 'params');
    await authorizeFieldWrite(ctx, id);
    res.json({ logo: await updateFieldLogo(ctx, id, logoId, parse(updateLogoSchema, req.body, 'body')) });
  });

  router.delete('/:id/logos/:logoId', async (req, res) => {
    const ctx = ctxAllowed(db, req, 'update', 'Field');
    const { id, logoId } = parse(logoParamsSchema, req.params, 'params');
    await authorizeFieldWrite(ctx, id);
    await removeFieldLogo(ctx, id, logoId, parse(versionQuerySchema, req.query, 'query').version, config.uploadsDir);
    res.status(204).end();
  });

  router.get('/:id/logos/:logoId/image', async (req, res) => {
    const { id, logoId } = parse(logoParamsSchema, req.params, 'params');
    const file = await logoRenderFile(ctxOf(db, req), id, logoId, config.uploadsDir);
    res.setHeader('Cache-Control', 'private, max-age=86400');
    res.type('image/png').sendFile(file);
  });

  router.get('/:id/logos/:logoId/grid.pdf', async (req, res) => {
    const ctx = ctxOf(db, req);
    const { id, logoId } = parse(logoParamsSchema, req.params, 'params');
    const file = await logoRenderFile(ctx, id, logoId, config.uploadsDir);
    const { field, logo } = await getFieldLogo(ctx, id, logoId);
    const pdf = await logoGridPdf(field, logo, await fs.readFile(file), ctx.clock.today());
    res.setHeader('Content-Disposition', `attachment; filename="logo-${logoId}-set-out.pdf"`);
    res.type('application/pdf').send(pdf);
  });

  return router;
}
