/**
 * Before PGlite opens its folder, a small file is written, flushed to disk and removed, so a
 * folder the server may not write or a full disk stops the start with one sentence naming
 * the folder and what to do, instead of a stack trace from inside the database engine.
 */
import fs from 'node:fs';
import path from 'node:path';
import { StartupError } from '../startup-error.ts';

/** Bigger than one PGlite page write, so a disk with a few bytes left is caught too. */
const PROBE_BYTES = 256 * 1024;

/** The file system calls the check makes; tests swap one to stand for a full disk. */
export interface ProbeFs {
  mkdirSync: typeof fs.mkdirSync;
  openSync: typeof fs.openSync;
  writeSync: (fd: number, buffer: Buffer) => number;
  fsyncSync: typeof fs.fsyncSync;
  closeSync: typeof fs.closeSync;
  rmSync: typeof fs.rmSync;
}

/** Throws a `StartupError` when `dir` cannot be created, written or has no room left. */
export function checkDataFolder(dir: string, io: ProbeFs = fs): void {
  const probe = path.join(dir, `.write-check-${process.pid}`);
  let fd: number | null = null;
  try {
    io.mkdirSync(dir, { recursive: true });
    fd = io.openSync(probe, 'w');
    io.writeSync(fd, Buffer.alloc(PROBE_BYTES));
    io.fsyncSync(fd);
  } catch (err) {
    throw dataFolderError(dir, err);
  } finally {
    if (fd !== null) {
      try {
        io.closeSync(fd);
      } catch {
        // the write error above is the one worth telling
      }
    }
    try {
      io.rmSync(probe, { force: true });
    } catch {
      // a folder we cannot write to may not let us remove either; the error above says why
    }
  }
}

/** The one-line reason for a file-system failure on the data folder, or the error itself when it is something else. */
export function dataFolderError(dir: string, err: unknown): Error {
  const code = (err as NodeJS.ErrnoException | null)?.code;
  switch (code) {
    case 'EACCES':
    case 'EPERM':
    case 'EROFS':
      return new StartupError(`the data folder ${dir} is read-only (${code}). Give the user running Swardwise write access to it, or set PGLITE_DIR to a folder it may write.`);
    case 'ENOSPC':
    case 'EDQUOT':
      return new StartupError(`the disk holding the data folder ${dir} is full (${code}). Free some space on it, or set PGLITE_DIR to a folder on a disk with room, then start again.`);
    case 'ENOTDIR':
    case 'EEXIST':
      return new StartupError(`the data folder ${dir} is not a folder (${code}). Set PGLITE_DIR to a folder.`);
    default:
      return err instanceof Error ? err : new Error(String(err));
  }
}
