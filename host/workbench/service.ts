/**
 * The host service both shells serve: case folders, mappings, demo files, report export
 * and verification. It composes the stores with a report port (building, signing and
 * verifying belong to core/report and host/, wired in `wiring.ts`) and turns every failure
 * into a located error value for the renderer.
 */
import { readFileSync } from 'node:fs';
import { privateFolder } from '../case-folder';
import { join } from 'node:path';
import type { BridgeError, FilePayload, HostReply, HostService, SignerInfo } from './api';
import { createCaseStore } from './case-store';
import { createMappingStore } from './mapping-store';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { withCaseLock } from '../case-lock';

export interface VerificationOutcome {
  readonly valid: boolean;
  readonly summary: string;
  readonly checks: readonly { name: string; passed: boolean; detail: string }[];
}

export interface ReportRequest {
  /** The case folder (twofold-case.json and raw/). */
  readonly folder: string;
  /** Where the signed PDF is written (atomically). */
  readonly outPath: string;
  readonly signerId: string;
  /** The certificate's password as the user typed it for this export, if they did. */
  readonly password?: string;
  readonly reviewer: string;
  readonly now: Date;
  /** The number and date format the report is written in (core/locale/); absent keeps the case's. */
  readonly locale?: string;
}

/** What the service needs from the report side (core/report, host signing). */
export interface ReportPort {
  signers(): Promise<SignerInfo[]>;
  build(input: ReportRequest): Promise<{ ok: true; bytes: number; demonstration: boolean } | { ok: false; error: BridgeError }>;
  verify(bytes: Uint8Array, fileName: string): Promise<VerificationOutcome>;
  /** The unsigned report of the case, built the same way, not written anywhere it stays. */
  preview(input: { readonly folder: string; readonly reviewer: string | null; readonly now: Date; readonly locale?: string }): Promise<{ ok: true; bytes: Uint8Array } | { ok: false; error: BridgeError }>;
}

export interface ServiceDeps {
  readonly dataDir: string;
  readonly now: () => Date;
  readonly randomHex6: () => string;
  readonly demoPair: () => Promise<{ day1: FilePayload; day2: FilePayload; title: string }>;
  readonly report: ReportPort;
}

const ok = <T>(value: T) => ({ ok: true as const, value });

/** A missing file becomes a sentence instead of an exception. */
async function guard<R>(file: string, body: () => Promise<R> | R): Promise<R | { ok: false; error: BridgeError }> {
  try {
    return await body();
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') {
      return { ok: false, error: { code: 'not-found', file, line: null, column: null, message: `Twofold could not find ${file}; it may have been moved or deleted.` } };
    }
    throw error;
  }
}

export function createWorkbenchService(deps: ServiceDeps): HostService {
  const cases = createCaseStore(deps);
  const mappings = createMappingStore(deps.dataDir);

  const service: HostService = {
    demoPair: async () => {
      const pair = await deps.demoPair();
      return ok({ ...pair, existingCaseId: cases.findSame(pair.title, pair.day1, pair.day2) });
    },
    discardCase: (r) => guard(`case ${r.caseId}`, () => cases.discardUnreviewed(r.caseId)),
    createCase: async (r) => cases.create(r.title, r.day1, r.day2, DEFAULT_SETTINGS, r.clinical),
    openCase: (r) => guard(`case ${r.caseId}`, () => cases.open(r.caseId)),
    // Under the case's lock (host/case-lock.ts), so a save never interleaves with another writer's.
    saveCase: (r) => guard(`case ${r.caseId}`, () => withCaseLock(cases.folderOf(r.caseId), () => cases.save(r.caseId, r.caseJson))),
    listCases: async () => ok({ cases: cases.list() }),
    listMappings: async () => ok({ mappings: mappings.list() }),
    saveMapping: async (r) => {
      mappings.save(r.layoutKey, r.mappingJson);
      return ok({ saved: true as const });
    },
    listSigners: async () => ok({ signers: await deps.report.signers() }),
    previewReport: (r) =>
      guard(`case ${r.caseId}`, async () => {
        const built = await deps.report.preview({ folder: cases.folderOf(r.caseId), reviewer: r.reviewer.trim() || null, now: deps.now(), locale: r.locale });
        return built.ok ? ok({ base64: Buffer.from(built.bytes).toString('base64') }) : built;
      }),
    exportReport: (r) =>
      guard(`case ${r.caseId}`, async () => {
        const now = deps.now();
        const signers = await deps.report.signers();
        const demonstration = signers.find((s) => s.id === r.signerId)?.demonstration ?? false;
        const stamp = now.toISOString().slice(0, 19).replace(/[-:]/g, '').replace('T', '-');
        const fileName = `twofold-report-${stamp}${demonstration ? '-DEMONSTRATION' : ''}.pdf`;
        const dir = cases.reportsDir(r.caseId);
        privateFolder(dir);
        const path = join(dir, fileName);
        const built = await deps.report.build({ folder: cases.folderOf(r.caseId), outPath: path, signerId: r.signerId, password: r.password, reviewer: r.reviewer, now, locale: r.locale });
        if (!built.ok) return built;
        return ok({ fileName, path, bytes: built.bytes, demonstration: built.demonstration });
      }),
    verifyReport: (r) =>
      guard(r.fileName, async () => {
        const bytes = 'caseId' in r ? new Uint8Array(readFileSync(join(cases.reportsDir(r.caseId), r.fileName))) : new Uint8Array(Buffer.from(r.base64, 'base64'));
        const outcome = await deps.report.verify(bytes, r.fileName);
        return ok({ valid: outcome.valid, summary: outcome.summary, checks: [...outcome.checks] });
      }),
  };
  return service;
}

export type { HostReply };
