// No certificate password is written to disk (issue: a lab certificate's password sat in a
// plain file beside the .p12). Every file under the folders a job writes (the demo's output,
// a report's case folder, the workbench's data folder) is read back byte by byte and
// searched for the password, in UTF-8 and UTF-16LE; no file may be named like a password
// file, and the demo may leave no private key or PKCS#12 container behind. The lab
// certificate is made by openssl with a random password that only this test knows.
import { execFileSync, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { dispatch } from '../../host/workbench/api';
import { openDemoCase } from './workbench/demo-case';
import { createWiredService } from '../../host/workbench/wiring';
import { DEMO_FOLDER, DEMO_PAIR } from '../../host/demo-job';
import { io } from '../cli/capture-io';

const ROOT = join(__dirname, '..', '..');
const day1 = join(DEMO_FOLDER, DEMO_PAIR.day1);
const day2 = join(DEMO_FOLDER, DEMO_PAIR.day2);
const PASSWORD_NAME = /pass(word|phrase)?|secret|\.pwd$/i;

/** Every regular file below `dir`. */
function filesUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const path = join(dir, e.name);
    return e.isDirectory() ? filesUnder(path) : e.isFile() ? [path] : [];
  });
}

/** The files below `dir` that hold `password` (UTF-8 or UTF-16LE) or are named like a password file. */
function leaks(dir: string, password: string): string[] {
  const needles = [Buffer.from(password, 'utf8'), Buffer.from(password, 'utf16le')];
  return filesUnder(dir).filter((f) => PASSWORD_NAME.test(f.slice(dir.length)) || needles.some((n) => readFileSync(f).includes(n)));
}

/** A lab certificate from openssl; the password travels in openssl's environment, not its arguments. */
function labCertificate() {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-pwcert-'));
  const password = `pw-${randomBytes(12).toString('hex')}`;
  execFileSync('openssl', ['req', '-x509', '-newkey', 'rsa:2048', '-nodes', '-keyout', join(dir, 'key.pem'), '-out', join(dir, 'cert.pem'), '-days', '2', '-subj', '/CN=Password Test Signer/O=Test Lab'], { stdio: 'pipe' });
  execFileSync('openssl', ['pkcs12', '-export', '-inkey', join(dir, 'key.pem'), '-in', join(dir, 'cert.pem'), '-out', join(dir, 'lab.p12'), '-passout', 'env:TWOFOLD_TEST_PASS'], { stdio: 'pipe', env: { ...process.env, TWOFOLD_TEST_PASS: password } });
  return { p12: join(dir, 'lab.p12'), password };
}

const cert = labCertificate();

describe('no certificate password on disk', () => {
  it('the leak check itself finds a password written into a file, and a password-named file', () => {
    const dir = mkdtempSync(join(tmpdir(), 'twofold-pwcheck-'));
    writeFileSync(join(dir, 'notes.txt'), `x${cert.password}y`);
    writeFileSync(join(dir, 'lab.passphrase'), 'anything');
    expect(leaks(dir, cert.password).map((f) => f.slice(dir.length + 1)).sort()).toEqual(['lab.passphrase', 'notes.txt']);
  });

  it('twofold report --pass-env and --pass-stdin: the case folder and the report hold no password; case folder 0700, its files 0600', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'twofold-pwreport-'));
    const withEnv = io({ LAB_PASS: cert.password });
    expect(await main(['report', day1, day2, '--out', join(dir, 'env.pdf'), '--sign', cert.p12, '--pass-env', 'LAB_PASS'], withEnv.io), withEnv.err()).toBe(0);
    const piped = io();
    const stdinIo = { ...piped.io, stdinLine: async () => cert.password };
    expect(await main(['report', day1, day2, '--out', join(dir, 'stdin.pdf'), '--sign', cert.p12, '--pass-stdin'], stdinIo), piped.err()).toBe(0);
    expect(filesUnder(dir).length).toBeGreaterThan(4);
    expect(leaks(dir, cert.password)).toEqual([]);
    expect(readdirSync(dir).filter((n) => n.endsWith('-case')).sort()).toEqual(['env-case', 'stdin-case']);
    for (const caseDir of ['env-case', 'stdin-case']) {
      const folder = join(dir, caseDir);
      expect(statSync(folder).mode & 0o777).toBe(0o700);
      for (const f of filesUnder(folder)) expect([f, statSync(f).mode & 0o777]).toEqual([f, 0o600]);
    }
  }, 120_000);

  it('the built command reads --pass-stdin from a real pipe (first line only) and signs; an empty pipe is exit 2', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'twofold-pwpipe-'));
    const run = (stdin: string, out: string) =>
      new Promise<{ code: number | null; err: string }>((resolve) => {
        const child = spawn(process.execPath, [join(ROOT, 'bin', 'twofold.mjs'), 'report', day1, day2, '--out', join(dir, out), '--sign', cert.p12, '--pass-stdin'], { stdio: ['pipe', 'ignore', 'pipe'] });
        let err = '';
        child.stderr.on('data', (c: Buffer) => (err += c.toString()));
        child.on('exit', (code) => resolve({ code, err }));
        child.stdin.end(stdin);
      });
    const good = await run(`${cert.password}\nthis second line is not read\n`, 'piped.pdf');
    expect(good.code, good.err).toBe(0);
    expect(readFileSync(join(dir, 'piped.pdf')).includes(Buffer.from('/ByteRange'))).toBe(true);
    const empty = await run('', 'empty.pdf');
    expect(empty.code).toBe(2);
    expect(empty.err).toContain('standard input held no password line');
    expect(leaks(dir, cert.password)).toEqual([]);
  }, 120_000);

  it('twofold demo leaves no password, private key or PKCS#12 file in its output folder', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'twofold-pwdemo-'));
    const t = io();
    expect(await main(['demo', '--out', dir], t.io), t.err()).toBe(0);
    const files = filesUnder(dir);
    expect(files.some((f) => f.endsWith('.pdf'))).toBe(true);
    expect(files.filter((f) => PASSWORD_NAME.test(f.slice(dir.length)) || /\.(p12|pfx|key)$/i.test(f))).toEqual([]);
    expect(files.filter((f) => readFileSync(f).includes(Buffer.from('PRIVATE KEY')))).toEqual([]);
  }, 120_000);

  it('the workbench asks once, keeps the password in memory only, refuses an old password file, and forgets a wrong one', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'twofold-pwwb-'));
    mkdirSync(join(dataDir, 'certificates'));
    copyFileSync(cert.p12, join(dataDir, 'certificates', 'lab.p12'));
    // A password file as an older version kept it: never read.
    writeFileSync(join(dataDir, 'certificates', 'lab.passphrase'), `${cert.password}\n`);
    const service = createWiredService({ dataDir });
    const signer = async (s = service) => {
      const r = await dispatch(s, 'listSigners', {});
      if (!r.ok) throw new Error(r.error.message);
      return (r.value as { signers: { id: string; label: string; needsPassword: boolean }[] }).signers.find((x) => x.id === 'lab')!;
    };
    expect((await signer()).needsPassword).toBe(true);
    expect((await signer()).label).toContain('lab.passphrase is not read');
    const caseId = await openDemoCase(service);
    const exportWith = (password?: string, s = service) => dispatch(s, 'exportReport', { caseId, signerId: 'lab', reviewer: 'T. Tester (MSc)', ...(password ? { password } : {}) });

    const asked = await exportWith();
    expect(!asked.ok && asked.error.code).toBe('password-needed');
    expect(!asked.ok && asked.error.message).toContain('lab.passphrase beside it is no longer read');
    const wrong = await exportWith('not-the-password');
    expect(!wrong.ok && wrong.error.code).toBe('sign-failed');
    expect((await signer()).needsPassword).toBe(true);
    const first = await exportWith(cert.password);
    expect(first.ok, first.ok ? '' : first.error.message).toBe(true);
    expect((await signer()).needsPassword).toBe(false);
    // Asked once: the next export signs without it.
    const second = await exportWith();
    expect(second.ok, second.ok ? '' : second.error.message).toBe(true);
    // A new workbench run on the same data folder holds nothing: the password was not kept on disk.
    const restarted = createWiredService({ dataDir });
    expect((await signer(restarted)).needsPassword).toBe(true);
    const afterRestart = await exportWith(undefined, restarted);
    expect(!afterRestart.ok && afterRestart.error.code).toBe('password-needed');

    // The only file holding it is the old one the test itself wrote.
    expect(leaks(dataDir, cert.password).map((f) => f.slice(dataDir.length + 1))).toEqual([join('certificates', 'lab.passphrase')]);
    const reports = filesUnder(dataDir).filter((f) => f.endsWith('.pdf'));
    expect(reports.length).toBe(2);
    // The case folder and everything in it (raw copies, reports) only for this user.
    const caseFile = filesUnder(dataDir).find((f) => f.endsWith('twofold-case.json'))!;
    const caseFolder = caseFile.slice(0, -'/twofold-case.json'.length);
    const folders = [caseFolder, ...filesUnder(caseFolder).map((f) => f.slice(0, f.lastIndexOf('/')))];
    for (const d of new Set(folders)) expect([d, statSync(d).mode & 0o777]).toEqual([d, 0o700]);
    for (const f of filesUnder(caseFolder)) expect([f, statSync(f).mode & 0o777]).toEqual([f, 0o600]);
  }, 180_000);
});
