// What the server keeps on disk (the database, received mail, uploads, the signing secret) is for
// the server's own user only: folders 0700, files 0600. main.ts also sets the umask to 077 so
// that files made by libraries (SQLite's -wal and -shm, multer's uploads) are born private.
import { chmodSync, existsSync, mkdirSync, writeFileSync } from 'node:fs';

export const privateDirMode = 0o700;
export const privateFileMode = 0o600;

/** Creates the folder if needed and makes it private (also one made earlier with looser rights). */
export function privateDir(dir: string): void {
  mkdirSync(dir, { recursive: true, mode: privateDirMode });
  chmodSync(dir, privateDirMode);
}

/** Makes existing files private; missing ones are skipped. */
export function makePrivate(...files: string[]): void {
  for (const file of files) if (existsSync(file)) chmodSync(file, privateFileMode);
}

/** Writes a file that only the server's user may read. */
export function writePrivateFile(file: string, data: string | Buffer): void {
  writeFileSync(file, data, { mode: privateFileMode });
  chmodSync(file, privateFileMode);
}
