/**
 * A data folder the server may not write, or a disk with no room, stops the start with one
 * line naming the folder and what to do, not a stack trace from inside PGlite.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { runUntilExit, SERVER_COMMAND } from '../support/server-exit.ts';
import { checkDataFolder } from '../../apps/api/src/db/data-folder.ts';
import { StartupError } from '../../apps/api/src/services/first-run.ts';

const errno = (code: string) => Object.assign(new Error(`${code}: simulated`), { code });

describe('data folder check', () => {
  test('should name the folder and say to free space when the disk is full, and leave no probe file', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-full-'));
    try {
      // The write is where a full disk fails (ENOSPC); the rest is the real file system.
      const full = { ...fs, writeSync: () => { throw errno('ENOSPC'); } };
      expect(() => checkDataFolder(dir, full)).toThrow(StartupError);
      expect(() => checkDataFolder(dir, full)).toThrow(
        expect.objectContaining({ message: `the disk holding the data folder ${dir} is full (ENOSPC). Free some space on it, or set PGLITE_DIR to a folder on a disk with room, then start again.` }),
      );
      expect(fs.readdirSync(dir)).toEqual([]);
      expect(() => checkDataFolder(dir)).not.toThrow();
      expect(fs.readdirSync(dir)).toEqual([]);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('the server process', () => {
  test('should exit with status 1 and one line naming a read-only data folder', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-ro-'));
    const readOnly = path.join(dir, 'data');
    fs.mkdirSync(readOnly, { mode: 0o555 });
    fs.chmodSync(readOnly, 0o555);
    fs.chmodSync(dir, 0o755);
    try {
      const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: 'production', PORT: '0', HOST: '127.0.0.1', PGLITE_DIR: path.join(readOnly, 'pglite'), LOG_LEVEL: 'warn' };
      for (const name of ['DEMO', 'SEED_DEMO', 'DATABASE_URL']) delete env[name];
      // root writes anywhere: the server then runs as root without capabilities, for whom the
      // folder is read-only. (Not as nobody, who may not be able to read a clone under a private
      // folder such as one from mktemp.)
      const asRoot = process.getuid?.() === 0;
      const { code, output } = await runUntilExit(env, asRoot ? ['setpriv', ['--bounding-set=-all', '--inh-caps=-all', SERVER_COMMAND[0], ...SERVER_COMMAND[1]]] : SERVER_COMMAND);
      expect(code).toBe(1);
      expect(output.trim()).toMatch(new RegExp(`^Swardwise cannot start: the data folder ${readOnly}/pglite is read-only \\((EACCES|EPERM|EROFS)\\)\\. Give the user running Swardwise write access to it, or set PGLITE_DIR to a folder it may write\\.$`));
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  }, 180_000);
});
