/**
 * One writer at a time on a case folder: every read-modify-write of `twofold-case.json`
 * (a reviewer override, a report that records its numbers, a save from the workbench) runs
 * inside `withCaseLock`, which holds a lock made by proper-lockfile (an atomic mkdir of
 * `twofold-case.json.lock`, whose mtime the holder refreshes; a lock left by a killed
 * process is taken over once stale). A second writer waits for its turn (up to about two
 * minutes) and then reads the case as the first one left it, so no entry is lost; if the
 * wait runs out it fails with a sentence and writes nothing. Independently of the lock,
 * `saveCase` refuses any save whose reviewer log does not continue the log on disk.
 */
import { mkdirSync } from 'node:fs';
import lockfile from 'proper-lockfile';
import { fail, locatedError, type Result } from '../core/model/errors';
import { caseFilePath } from './case-folder';

/** A killed holder's lock is taken over after this long, ms; a holder refreshes it every half of this. */
const STALE_MS = 60_000;

export async function withCaseLock<T>(folder: string, body: () => Promise<Result<T>> | Result<T>): Promise<Result<T>> {
  const path = caseFilePath(folder);
  mkdirSync(folder, { recursive: true, mode: 0o700 });
  let release: () => Promise<void>;
  try {
    release = await lockfile.lock(path, {
      realpath: false,
      stale: STALE_MS,
      retries: { retries: 400, factor: 1.1, minTimeout: 25, maxTimeout: 400, randomize: true },
      // A lock found compromised (its file removed by hand) no longer protects anything;
      // the log check in saveCase still refuses a save that would drop entries.
      onCompromised: () => undefined,
    });
  } catch (error) {
    return fail(locatedError('case-locked', path, null, null, `Another Twofold is still writing this case (${(error as Error).message}); nothing was written. Try again when it has finished.`));
  }
  try {
    return await body();
  } finally {
    await release().catch(() => undefined);
  }
}
