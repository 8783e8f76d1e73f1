/**
 * Reads the lab's trust list: one or more PEM files, each with one or more certificates
 * (a CA, an intermediate, or a lab's own self-signed certificate). A file that is missing,
 * a folder, unreadable or holds no certificate is a located error.
 */
import { readFileSync } from 'node:fs';
import { fail, locatedError, ok, type Result } from '../core/model/errors';
import { parseTrustFile, type TrustAnchor } from '../core/report/trust';
import { readProblem } from './read-problem';

export function readTrustFiles(paths: readonly string[]): Result<TrustAnchor[]> {
  const out: TrustAnchor[] = [];
  for (const path of paths) {
    let text: string;
    try {
      text = readFileSync(path, 'latin1');
    } catch (error) {
      return fail(locatedError('trust-unreadable', path, null, null, readProblem(error, 'trust file')));
    }
    const parsed = parseTrustFile(text, path);
    if (!parsed.ok) return parsed;
    out.push(...parsed.value);
  }
  return ok(out);
}
