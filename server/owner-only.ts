import { chmodSync, closeSync, existsSync, mkdirSync, openSync } from 'node:fs'

/*
 * The data folder holds password hashes, sessions' secret and every team's data: only the
 * account that runs Loudhour may read it (0700 folder, 0600 files). Modes are set explicitly,
 * whatever the umask, and tightened on files an older version left readable.
 */
export const ownerOnlyDirMode = 0o700
export const ownerOnlyFileMode = 0o600

/** Creates the folder (and missing parents) and makes it the owner's alone. */
export function ownerOnlyDir(path: string): void {
  mkdirSync(path, { recursive: true, mode: ownerOnlyDirMode })
  chmodSync(path, ownerOnlyDirMode)
}

/** Creates the file empty if missing (SQLite then keeps its mode) and makes it the owner's alone. */
export function ownerOnlyFile(path: string): void {
  closeSync(openSync(path, 'a', ownerOnlyFileMode))
  chmodSync(path, ownerOnlyFileMode)
}

/** Tightens a file if it exists (SQLite's -wal and -shm files come and go). */
export function tightenIfPresent(path: string): void {
  if (existsSync(path)) chmodSync(path, ownerOnlyFileMode)
}
