/**
 * The built portal: each file in the brotli or gzip copy written beside it at build time,
 * as the request's Accept-Encoding allows; hashed assets cached for a year, everything else
 * (index.html, the service worker, the icon) asked again on every use, since it names the
 * current hashes. The single-page app's routes are answered by index.html, or by the page's
 * own copy of it when the build wrote one (`today.html` for `/today`: index.html that also
 * names the page's files, so a phone asks for them at once; apps/portal/build/todayChunks.ts).
 */
import fs from 'node:fs';
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
  /** `/today` → today.html: the top-level pages the build wrote an HTML file of its own for. */
  const pages = new Map(
    fs
      .readdirSync(dist)
      .filter((f) => f.endsWith('.html') && f !== 'index.html')
      .map((f) => [`/${f.slice(0, -'.html'.length)}`, path.join(dist, f)]),
  );
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
  router.get('/{*splat}', (req, res) => {
    res.setHeader('Cache-Control', REVALIDATE);
    res.sendFile(pages.get(req.path) ?? index, { cacheControl: false });
  });
  return router;
}
