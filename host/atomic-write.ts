/**
 * Atomic replacement of a file: write a temporary file in the same folder, fsync it, rename
 * it over the target, then fsync the folder so the rename itself is durable. A reader (or a
 * crash, or SIGKILL) sees either the old file or the new one, never a half-written one,
 * because rename(2) within one file system is atomic (POSIX). The temporary file is removed
 * if anything fails before the rename.
 */
import { closeSync, fsyncSync, openSync, renameSync, unlinkSync, writeSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { basename, dirname, join } from 'node:path';

/** `mode`: permission bits of the new file; 0600 (only this user) unless a caller needs more. */
export function writeFileAtomic(path: string, data: Uint8Array | string, mode = 0o600): void {
  const folder = dirname(path);
  const temporary = join(folder, `.${basename(path)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
  const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
  let renamed = false;
  try {
    const fd = openSync(temporary, 'wx', mode);
    try {
      let written = 0;
      while (written < bytes.length) written += writeSync(fd, bytes, written, bytes.length - written);
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
    renameSync(temporary, path);
    renamed = true;
    syncFolder(folder);
  } finally {
    if (!renamed) {
      try {
        unlinkSync(temporary);
      } catch {
        // Already gone or never created; nothing to clean up.
      }
    }
  }
}

function syncFolder(folder: string): void {
  const fd = openSync(folder, 'r');
  try {
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}
