/**
 * The CASE_FOLDER argument that the reviewer commands (override, sign-off) share: a case
 * folder, or the twofold-case.json inside it.
 */
import { basename, dirname, resolve } from 'node:path';
import { CASE_FILE_NAME } from '../host/case-folder';
import { UsageError } from './io';

export function caseFolderOf(arg: string, cwd: string): string {
  const path = resolve(cwd, arg);
  if (!/\.json$/i.test(path)) return path;
  if (basename(path) !== CASE_FILE_NAME) throw new UsageError(`a case file is always named ${CASE_FILE_NAME} inside its case folder; give the folder`);
  return dirname(path);
}
