import { chmodSync, closeSync, existsSync, mkdirSync, openSync, statSync } from 'node:fs';
import { dirname } from 'node:path';

/** Only the account the server runs as may list or enter the data directory. */
export const DATA_DIR_MODE = 0o700;
/** Only the account the server runs as may read or write the database files. */
export const DATA_FILE_MODE = 0o600;

/** The database file and the write-ahead log and shared-memory files SQLite keeps beside it. */
export function databaseFiles(databaseFile: string): string[] {
  return [databaseFile, `${databaseFile}-wal`, `${databaseFile}-shm`];
}

/**
 * Run before the database opens. Creates the data directory with mode 0700 and the database file
 * with mode 0600; SQLite gives the -wal and -shm files it creates the database file's mode. Files
 * (and a directory owned by this account) left with wider modes by an earlier version are
 * narrowed. Returns what it changed or could not change, for the log.
 */
export function prepareDataFiles(databaseFile: string): string[] {
  const notes: string[] = [];
  const dir = dirname(databaseFile);
  if (!existsSync(dir)) {
    mkdirSync(dir, { recursive: true, mode: DATA_DIR_MODE });
  } else {
    const st = statSync(dir);
    if ((st.mode & 0o077) !== 0) {
      // A shared, sticky directory (such as /tmp) is never narrowed: only our own data directory.
      const own = typeof process.getuid === 'function' && st.uid === process.getuid();
      if (own && (st.mode & 0o1000) === 0) {
        chmodSync(dir, DATA_DIR_MODE);
        notes.push(`Data directory ${dir} narrowed to mode 0700`);
      } else {
        notes.push(`Data directory ${dir} is readable by other accounts: give it mode 0700`);
      }
    }
  }
  if (!existsSync(databaseFile)) closeSync(openSync(databaseFile, 'a', DATA_FILE_MODE));
  notes.push(...narrowDataFileModes(databaseFile));
  return notes;
}

/** Sets mode 0600 on the database files that exist and have another mode; returns what it changed. */
export function narrowDataFileModes(databaseFile: string): string[] {
  const notes: string[] = [];
  for (const file of databaseFiles(databaseFile)) {
    if (!existsSync(file)) continue;
    if ((statSync(file).mode & 0o777) !== DATA_FILE_MODE) {
      chmodSync(file, DATA_FILE_MODE);
      notes.push(`${file} narrowed to mode 0600`);
    }
  }
  return notes;
}
