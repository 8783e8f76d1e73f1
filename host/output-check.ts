/**
 * Checks an output path before anything is written, so a command that cannot write its
 * result stops with a sentence and leaves no half of its work (a case folder without its
 * report) behind: the path must not be a folder, and its folder must exist and be writable.
 */
import { accessSync, constants, statSync } from 'node:fs';
import { dirname } from 'node:path';

export function outputFileProblem(path: string): string | null {
  try {
    if (statSync(path).isDirectory()) return 'This output path is a folder; give a file name.';
  } catch {
    // Not there yet: the usual case.
  }
  const folder = dirname(path);
  try {
    if (!statSync(folder).isDirectory()) return `The folder of this output, ${folder}, is not a folder.`;
    accessSync(folder, constants.W_OK);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') return `The folder of this output, ${folder}, does not exist.`;
    if (code === 'ENOTDIR') return `The folder of this output, ${folder}, runs through a file that is not a folder.`;
    return `The folder of this output, ${folder}, cannot be written (no permission).`;
  }
  return null;
}

/** An output folder: a file in its place, or an unwritable parent, is a problem; a missing folder is made later. */
export function outputFolderProblem(path: string): string | null {
  try {
    const s = statSync(path);
    if (!s.isDirectory()) return 'This output path is a file, not a folder.';
    accessSync(path, constants.W_OK);
    return null;
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOTDIR') return 'This output folder runs through a file that is not a folder.';
    if (code !== 'ENOENT') return 'This output folder cannot be written (no permission).';
  }
  return outputFileProblem(path);
}
