/**
 * Zod compiles fast parsers with `new Function` and first probes whether it may; under the
 * portal's content security policy (script-src 'self', no 'unsafe-eval') the probe is refused
 * and the browser reports a violation on every page. Parsing without the compiled path is fast
 * enough for forms. Imported first in main.ts: zod reads the setting when a schema is made.
 */
import { z } from 'zod';

z.config({ jitless: true });
