// `twofold demo` end to end, checked with poppler-utils: the signed demo report verifies in
// pdfsig (whole document), says plainly it is a demonstration, and `twofold verify` accepts it.
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { io } from './capture-io';


describe('twofold demo', () => {
  it('builds, signs and verifies the demo report', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'twofold-demo-'));
    const t = io();
    expect(await main(['demo', '--out', dir], t.io)).toBe(0);
    const pdf = join(dir, 'twofold-demo-report.pdf');
    expect(t.out()).toContain(pdf);
    const sig = spawnSync('pdfsig', [pdf], { encoding: 'utf8' }).stdout;
    expect(sig).toContain('Signature is Valid');
    expect(sig).toContain('Total document signed');
    expect(sig).toContain('DEMONSTRATION');
    const text = spawnSync('pdftotext', [pdf, '-'], { encoding: 'utf8' }).stdout;
    expect(text).toContain('not a clinical signature');
    expect(text).toContain('Used: set by the reviewer');
    // The demo's invented follow-ups (sample-tests/scenario/demo-follow-ups.ts): back to usual state at the 288 h call after day 2, not yet at 168 h.
    expect(text).toContain('Recovery after each test, as reported');
    expect(text.replace(/\s+/g, ' ')).toContain("not a diagnosis. Interpreting them is the clinician's task.");
    expect(text.replace(/\s+/g, ' ')).toContain('after the day 2 test, reported back to usual state by 288 h (12 days), not yet at 168 h (7 days)');
    // The demonstration certificate is trusted only when named.
    const v = io();
    expect(await main(['verify', pdf, '--trust', join(dir, 'demo-certificate.pem')], v.io)).toBe(0);
    expect(v.out()).toContain('numbers and pages reproduce');
    const untrusted = io();
    expect(await main(['verify', pdf], untrusted.io)).toBe(3);
    expect(untrusted.out()).toContain('No trust list was given');
  }, 180_000); // The whole job plus pdfsig, pdftotext and verify: over a minute on a loaded 2-core machine.
});
