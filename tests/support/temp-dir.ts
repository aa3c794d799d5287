/**
 * A temporary folder for the tests around the call (a file or a describe block), made at once
 * so its path can go into the API's settings, and removed with all it holds after them.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll } from 'vitest';

export function useTempDir(prefix: string): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), prefix));
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));
  return dir;
}
