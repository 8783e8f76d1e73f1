/**
 * The workbench service as both shells run it: the real clock and random source, the demo
 * pair from sample-tests/demo, and the report port over host/report-job.ts (build, sign,
 * write) and the report verifier. The shells differ only in how requests reach `dispatch`.
 *
 * Certificates: the demonstration certificate is made fresh for each run (host/
 * demo-certificate.ts) and its PEM written to `<dataDir>/certificates/demo-certificate.pem`
 * so a report can be checked against it (`twofold verify --trust` that file). Verifying in the
 * workbench trusts the certificates in `<dataDir>/trust/*.pem` (the lab's CA or its own
 * certificates, placed there by the lab) and this session's demonstration certificate, and
 * nothing else. A lab certificate is a PKCS#12 file `<dataDir>/certificates/<id>.p12`. Its
 * password is never on disk: the renderer asks for it once, and the host keeps it in this
 * process's memory (a Map, gone when the workbench closes) after it has signed with it. A
 * password file an older version kept beside the certificate (`<id>.passphrase`) is refused:
 * never read, and named in the signer's label so the lab deletes it (docs/workbench.md).
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BridgeError, FilePayload, HostService, SignerInfo } from './api';
import { createWorkbenchService, type ReportPort } from './service';
import type { Certificate } from '../report-job';
import { demoCertificate, type DemoCertificate } from '../demo-certificate';
import { DEMO_FOLDER, DEMO_PAIR } from '../demo-job';
import { verifyReportBytes } from './verify-port';
import { runOffThread } from './off-thread';
import { parseTrustFile, type TrustAnchor } from '../../core/report/trust';

const DEMO_ID = 'demonstration';

export interface WiringOptions {
  readonly dataDir: string;
  readonly now?: () => Date;
  /** Time limit of one report verification or build, ms (off-thread.ts). */
  readonly verifyLimitMs?: number;
}

function readPayload(folder: string, name: string): FilePayload {
  return { name, base64: readFileSync(join(folder, name)).toString('base64') };
}

const stopped = (folder: string, why: string) => ({ ok: false as const, error: { code: 'job-stopped', file: folder, line: null, column: null, message: `The report job ${why}.` } });

export function createReportPort(dataDir: string, now: () => Date, limitMs?: number): ReportPort {
  const certDir = join(dataDir, 'certificates');
  let demo: Promise<DemoCertificate> | null = null;
  const demoCert = (): Promise<DemoCertificate> => {
    demo ??= demoCertificate(now()).then((made) => {
      mkdirSync(certDir, { recursive: true, mode: 0o700 });
      writeFileSync(join(certDir, 'demo-certificate.pem'), made.certificatePem);
      return made;
    });
    return demo;
  };
  const labIds = (): string[] => {
    if (!existsSync(certDir)) return [];
    return readdirSync(certDir)
      .filter((n) => n.endsWith('.p12') && /^[a-z0-9-]{1,60}\.p12$/.test(n) && n !== `${DEMO_ID}.p12`)
      .map((n) => n.slice(0, -4));
  };
  /** Passwords the user typed, by certificate id: memory only, for as long as the workbench runs. */
  const passwords = new Map<string, string>();
  const storedPasswordFile = (id: string) => existsSync(join(certDir, `${id}.passphrase`));
  const certificate = async (id: string, typed: string | undefined): Promise<Certificate | BridgeError> => {
    if (id === DEMO_ID) {
      const c = await demoCert();
      return { p12: c.p12, passphrase: c.passphrase, name: 'demonstration certificate', kind: 'demonstration' };
    }
    const file = join(certDir, `${id}.p12`);
    if (!labIds().includes(id)) return { code: 'no-certificate', file, line: null, column: null, message: `There is no certificate '${id}'.` };
    const passphrase = typed ?? passwords.get(id);
    if (passphrase === undefined) {
      const old = storedPasswordFile(id) ? ` The password file ${id}.passphrase beside it is no longer read (a password is never kept on disk): delete it.` : '';
      return { code: 'password-needed', file, line: null, column: null, message: `Enter the password of certificate '${id}'. The workbench keeps it in memory until it closes and never writes it to disk.${old}` };
    }
    return { p12: new Uint8Array(readFileSync(file)), passphrase, name: id, kind: 'lab' };
  };

  return {
    async signers(): Promise<SignerInfo[]> {
      return [
        ...labIds().map((id) => ({
          id,
          label: `Lab certificate ${id}${storedPasswordFile(id) ? ` (its old password file ${id}.passphrase is not read: delete it)` : ''}`,
          demonstration: false,
          needsPassword: !passwords.has(id),
        })),
        { id: DEMO_ID, label: 'Twofold demonstration certificate (made for this session)', demonstration: true, needsPassword: false },
      ];
    },
    async build(input) {
      const cert = await certificate(input.signerId, input.password);
      if (!('p12' in cert)) return { ok: false, error: cert };
      const run = await runOffThread('report', { folder: input.folder, outPath: input.outPath, reviewer: input.reviewer, certificate: cert, nowIso: input.now.toISOString(), locale: input.locale }, limitMs);
      if (!run.done) return stopped(input.folder, run.why);
      if (!run.value.ok) {
        // A password that did not open the certificate is not kept.
        if (cert.kind === 'lab' && run.value.error.code === 'sign-failed') passwords.delete(input.signerId);
        return run.value;
      }
      if (cert.kind === 'lab') passwords.set(input.signerId, cert.passphrase);
      return { ok: true, bytes: run.value.value.bytes, demonstration: cert.kind === 'demonstration' };
    },
    async verify(bytes, fileName) {
      const trust: TrustAnchor[] = [];
      const trustDir = join(dataDir, 'trust');
      if (existsSync(trustDir)) {
        for (const name of readdirSync(trustDir).filter((n) => n.endsWith('.pem')).sort()) {
          const parsed = parseTrustFile(readFileSync(join(trustDir, name), 'latin1'), join(trustDir, name));
          if (parsed.ok) trust.push(...parsed.value);
        }
      }
      if (demo) trust.push({ pem: (await demo).certificatePem, source: "this session's demonstration certificate (not clinical)" });
      return verifyReportBytes(bytes, fileName, trust, limitMs);
    },
    async preview(input) {
      const run = await runOffThread('report', { folder: input.folder, outPath: null, reviewer: input.reviewer, certificate: null, nowIso: input.now.toISOString(), locale: input.locale }, limitMs);
      if (!run.done) return stopped(input.folder, run.why);
      if (!run.value.ok) return run.value;
      return { ok: true, bytes: new Uint8Array(run.value.value.pdf ?? []) };
    },
  };
}

export function createWiredService(options: WiringOptions): HostService {
  const now = options.now ?? (() => new Date());
  return createWorkbenchService({
    dataDir: options.dataDir,
    now,
    randomHex6: () => randomBytes(3).toString('hex'),
    demoPair: async () => ({
      title: 'Demo pair QH-0417 (invented scenario, cycle ramp)',
      day1: readPayload(DEMO_FOLDER, DEMO_PAIR.day1),
      day2: readPayload(DEMO_FOLDER, DEMO_PAIR.day2),
    }),
    report: createReportPort(options.dataDir, now, options.verifyLimitMs),
  });
}

/** A per-run access token for the HTTP bridge: 32 random bytes as hex. */
export function newToken(): string {
  return randomBytes(32).toString('hex');
}
