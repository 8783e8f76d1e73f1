/**
 * The workbench's cases on disk, one folder per case under `<dataDir>/cases/<caseId>/`:
 *
 *     twofold-case.json      the case file with its reviewer log (host/case-folder.ts)
 *     raw/<sha256>.<ext>     each day's breath file, copied verbatim (host/case-folder.ts)
 *     case-info.json         the workbench's own note: title, last save time and the head of
 *                            the reviewer log it last saved (entry count, last hash)
 *     reports/               exported reports
 *
 * A new case is made by core (`newCase`) from the bytes the user chose, so the folder is
 * self-contained from the first moment. Every save parses and checks the case text
 * (schema and hash chain) before it replaces the file atomically: a damaged or forged case
 * never reaches the disk, and a kill mid-save leaves the previous version intact. A save must
 * continue the log on disk (nothing removed or rewritten), and a case whose log no longer
 * continues the head the workbench last saved is refused on opening: the log cannot be cut
 * short behind the workbench's back without it saying so.
 */
import { readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import type { BridgeError, CaseSummary, FilePayload } from './api';
import type { ClinicalInputs } from '../../core/model/analysis';
import type { Settings } from '../../core/model/settings';
import type { CaseFile } from '../../core/case/case-file';
import { newCase } from '../../core/case/new-case';
import { sha256Hex } from '../../core/case/sha256';
import { caseFromText, caseToText } from '../../core/case/case-text';
import { reviewerEntries } from '../../core/case/opening';
import { logHeadOf, logShortenedFrom, type LogHead } from '../../core/report/build-record';
import { loadCase, privateFolder, saveCase } from '../case-folder';
import { writeFileAtomic } from '../atomic-write';

export interface CaseStoreDeps {
  readonly dataDir: string;
  readonly now: () => Date;
  /** Six lowercase hex digits, fresh on each call. */
  readonly randomHex6: () => string;
}

interface CaseInfo {
  readonly title: string;
  readonly savedAt: string;
  /** The reviewer log's head at the last save; absent in notes written before it was kept. */
  readonly logHead?: LogHead;
}

type Outcome<T> = { ok: true; value: T } | { ok: false; error: BridgeError };

const CASE_ID = /^case-[0-9]{8}-[0-9]{6}-[0-9a-f]{6}$/;

/**
 * Why `log` does not continue `head`, or null. While the head is the opening entry alone, that
 * entry may be made again for new column maps or clinical inputs (core/case/opening.ts
 * `resealOpening`; its chain to the new inputs is checked on reading), so only a later head's
 * last hash must match.
 */
function cutFrom(log: CaseFile['log'], head: LogHead): string | null {
  return head.entries <= 1 ? (log.length === 0 ? logShortenedFrom({ log }, head) : null) : logShortenedFrom({ log }, head);
}

export function newCaseId(now: Date, hex6: string): string {
  const iso = now.toISOString();
  return `case-${iso.slice(0, 10).replace(/-/g, '')}-${iso.slice(11, 19).replace(/:/g, '')}-${hex6}`;
}

const bytesOf = (file: FilePayload) => new Uint8Array(Buffer.from(file.base64, 'base64'));
const payloadOf = (name: string, bytes: Uint8Array): FilePayload => ({ name, base64: Buffer.from(bytes).toString('base64') });

export function createCaseStore(deps: CaseStoreDeps) {
  const casesDir = join(deps.dataDir, 'cases');
  const folderOf = (caseId: string): string => {
    if (!CASE_ID.test(caseId)) throw new Error(`'${caseId}' is not a case id`);
    return join(casesDir, caseId);
  };
  const infoPath = (caseId: string) => join(folderOf(caseId), 'case-info.json');
  const writeInfo = (caseId: string, info: CaseInfo) => writeFileAtomic(infoPath(caseId), `${JSON.stringify(info, null, 2)}\n`);

  /** Why the log no longer continues the head the workbench last saved, or null (also when no head was kept). */
  function shortenedSinceLastSave(caseId: string, log: CaseFile['log']): string | null {
    let info: CaseInfo;
    try {
      info = JSON.parse(readFileSync(infoPath(caseId), 'utf8')) as CaseInfo;
    } catch {
      return null; // an unreadable note is listed as such (list()); the case file's own checks still ran
    }
    return info.logHead ? cutFrom(log, info.logHead) : null;
  }

  function summaryOf(caseId: string): CaseSummary {
    const info = JSON.parse(readFileSync(infoPath(caseId), 'utf8')) as CaseInfo;
    const loaded = loadCase(folderOf(caseId));
    const names = loaded.ok ? loaded.value.caseFile.inputs : null;
    return { caseId, title: info.title, savedAt: info.savedAt, day1Name: names?.day1.name ?? '', day2Name: names?.day2.name ?? '' };
  }

  return {
    folderOf,
    reportsDir: (caseId: string) => join(folderOf(caseId), 'reports'),

    create(title: string, day1: FilePayload, day2: FilePayload, settings: Settings, clinical: { day1: ClinicalInputs; day2: ClinicalInputs }): Outcome<CaseSummary> {
      const now = deps.now();
      const caseId = newCaseId(now, deps.randomHex6());
      const folder = folderOf(caseId);
      const raw = { day1: bytesOf(day1), day2: bytesOf(day2) };
      const caseFile = newCase(now.toISOString(), { name: day1.name, bytes: raw.day1 }, { name: day2.name, bytes: raw.day2 }, settings, clinical);
      privateFolder(join(folder, 'reports'));
      const saved = saveCase(folder, caseFile, raw);
      if (!saved.ok) return saved;
      writeInfo(caseId, { title, savedAt: now.toISOString(), logHead: logHeadOf(caseFile) });
      return { ok: true, value: { caseId, title, savedAt: now.toISOString(), day1Name: day1.name, day2Name: day2.name } };
    },

    open(caseId: string): Outcome<{ summary: CaseSummary; day1: FilePayload; day2: FilePayload; caseJson: string }> {
      const loaded = loadCase(folderOf(caseId));
      if (!loaded.ok) return loaded;
      const { caseFile, raw, path } = loaded.value;
      const cut = shortenedSinceLastSave(caseId, caseFile.log);
      if (cut) return { ok: false, error: { code: 'log-shortened', file: path, line: null, column: null, message: `${cut} The case was not opened; restore it from a backup or an exported report.` } };
      return {
        ok: true,
        value: {
          summary: summaryOf(caseId),
          day1: payloadOf(caseFile.inputs.day1.name, raw.day1),
          day2: payloadOf(caseFile.inputs.day2.name, raw.day2),
          caseJson: readFileSync(path, 'utf8'),
        },
      };
    },

    /** Checks the text as a case of this folder, then replaces the case file atomically. */
    save(caseId: string, caseJson: string): Outcome<{ savedAt: string; bytes: number }> {
      const folder = folderOf(caseId);
      const current = loadCase(folder);
      if (!current.ok) return current;
      const parsed = caseFromText(caseJson, 'case sent by the workbench');
      if (!parsed.ok) return parsed;
      const before = current.value.caseFile.inputs;
      const after = parsed.value.inputs;
      if (before.day1.sha256 !== after.day1.sha256 || before.day2.sha256 !== after.day2.sha256) {
        return { ok: false, error: { code: 'case-inputs-differ', file: current.value.path, line: null, column: null, message: 'The case to save names different breath files from the ones in its folder, so it was not saved.' } };
      }
      const dropped = cutFrom(parsed.value.log, logHeadOf(current.value.caseFile));
      if (dropped) return { ok: false, error: { code: 'log-shortened', file: current.value.path, line: null, column: null, message: `The case to save does not continue the reviewer log on disk, so it was not saved: ${dropped}` } };
      const text = caseToText(parsed.value);
      const saved = saveCase(folder, parsed.value, current.value.raw);
      if (!saved.ok) return saved;
      const info = JSON.parse(readFileSync(infoPath(caseId), 'utf8')) as CaseInfo;
      const savedAt = deps.now().toISOString();
      writeInfo(caseId, { ...info, savedAt, logHead: logHeadOf(parsed.value) });
      return { ok: true, value: { savedAt, bytes: Buffer.byteLength(text, 'utf8') } };
    },

    /** The most recently saved case with this title and these exact two files (by SHA-256), if any. */
    findSame(title: string, day1: FilePayload, day2: FilePayload): string | null {
      const want = { day1: sha256Hex(bytesOf(day1)), day2: sha256Hex(bytesOf(day2)) };
      for (const summary of this.list()) {
        if (summary.title !== title) continue;
        const loaded = loadCase(folderOf(summary.caseId));
        if (loaded.ok && loaded.value.caseFile.inputs.day1.sha256 === want.day1 && loaded.value.caseFile.inputs.day2.sha256 === want.day2) return summary.caseId;
      }
      return null;
    },

    /**
     * Removes a case that holds no work: used when a new case's files could not be analysed,
     * so a failed try leaves nothing in Recent cases. A case with any reviewer log entry or
     * any exported report is refused and kept; the opening entry (entry 0, written by
     * Twofold when the case is made, core/case/opening.ts) is not a reviewer's work.
     */
    discardUnreviewed(caseId: string): Outcome<{ discarded: true }> {
      const folder = folderOf(caseId);
      const loaded = loadCase(folder);
      if (!loaded.ok) return loaded;
      let reports: string[] = [];
      try {
        reports = readdirSync(join(folder, 'reports'));
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code !== 'ENOENT') throw error;
      }
      if (reviewerEntries(loaded.value.caseFile.log).length > 0 || reports.length > 0) {
        return { ok: false, error: { code: 'case-has-work', file: loaded.value.path, line: null, column: null, message: 'The case holds reviewer log entries or reports, so it was kept.' } };
      }
      rmSync(folder, { recursive: true, force: true });
      return { ok: true, value: { discarded: true } };
    },

    /** Most recently saved first. A folder whose files cannot be read is listed with a note. */
    list(): CaseSummary[] {
      let names: string[];
      try {
        names = readdirSync(casesDir);
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
        throw error;
      }
      const cases: CaseSummary[] = [];
      for (const name of names.filter((n) => CASE_ID.test(n))) {
        try {
          cases.push(summaryOf(name));
        } catch {
          cases.push({ caseId: name, title: `${name} (its case-info.json cannot be read)`, savedAt: '', day1Name: '', day2Name: '' });
        }
      }
      return cases.sort((a, b) => b.savedAt.localeCompare(a.savedAt));
    },
  };
}

export type CaseStore = ReturnType<typeof createCaseStore>;
