// Loaded by the service worker (vite.config.ts, workbox importScripts). Writes never pass
// through the worker: the browser sends them straight to the network (static routing), so
// no write can be answered from a copy or wait for the worker to start. Only reads reach
// its handlers. A browser without static routing runs the handlers, which pass writes on.
self.addEventListener('install', (event) => {
  if (typeof event.addRoutes !== 'function') return;
  const writes = ['POST', 'PUT', 'PATCH', 'DELETE'].map((method) => ({ condition: { requestMethod: method }, source: 'network' }));
  event.waitUntil(event.addRoutes(writes).catch(() => undefined));
});
