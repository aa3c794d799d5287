/**
 * The built portal: each file in the brotli or gzip copy written beside it at build time,
 * as the request's Accept-Encoding allows; hashed assets cached for a year, everything else
 * (index.html, the service worker, the icon) asked again on every use, since it names the
 * current hashes. The single-page app's routes are answered by index.html.
 */
import path from 'node:path';
import express, { type Router } from 'express';
import expressStaticGzip from 'express-static-gzip';

/** A hashed asset's name changes with its content: it never needs asking again. */
export const IMMUTABLE = 'public, max-age=31536000, immutable';
/** Kept, but checked with the server (a cheap 304) before each use. */
export const REVALIDATE = 'no-cache';

export function portalRouter(dist: string): Router {
  const router = express.Router();
  const index = path.join(dist, 'index.html');
  const assets = path.join(dist, 'assets') + path.sep;
  router.use(
    expressStaticGzip(dist, {
      enableBrotli: true,
      orderPreference: ['br', 'gzip'],
      index: false,
      serveStatic: {
        index: false,
        cacheControl: false,
        setHeaders: (res, file) => res.setHeader('Cache-Control', file.startsWith(assets) ? IMMUTABLE : REVALIDATE),
      },
    }),
  );
  // An asset of another build (a page left open across a deploy) is missing, not the app's
  // index.html under a script's name.
  router.use('/assets', (_req, res) => {
    res.status(404).type('text/plain').send('Not found');
  });
  router.get('/{*splat}', (_req, res) => {
    res.setHeader('Cache-Control', REVALIDATE);
    res.sendFile(index, { cacheControl: false });
  });
  return router;
}
