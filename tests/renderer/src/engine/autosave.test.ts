// Autosave ordering, checked against sequences worked by hand: one write in flight, the
// newest waiting record per case replaces older ones, and a record older than one accepted
// is refused (last writer by sequence number wins, common practice for autosave).
import { describe, expect, it } from 'vitest';
import { createAutosave } from '../../../../renderer/src/engine/autosave';
import type { CaseRecord } from '../../../../renderer/src/engine/protocol';

const rec = (caseId: string, revision: number): CaseRecord => ({ caseId, revision, digest: 'd'.repeat(64), caseJson: `{"revision":${revision}}`, recordMs: 1 });

/** A writer whose saves finish only when the test says so, in order. */
function heldWriter(result = true) {
  const written: string[] = [];
  const holds: (() => void)[] = [];
  const write = (r: CaseRecord) =>
    new Promise<boolean>((resolve) => {
      holds.push(() => {
        written.push(`${r.caseId}#${r.revision}`);
        resolve(result);
      });
    });
  const release = async () => {
    holds.shift()?.();
    await new Promise((resolve) => setTimeout(resolve, 0));
  };
  return { written, holds, write, release };
}

describe('createAutosave', () => {
  it('writes the newest of the records that arrived during a save, and refuses a late older one', async () => {
    const w = heldWriter();
    const autosave = createAutosave(w.write);
    expect(autosave.offer(rec('a', 3))).toBe(true);
    expect(autosave.offer(rec('a', 4))).toBe(true);
    expect(autosave.offer(rec('a', 6))).toBe(true);
    // 5 arrives after 6: older than what was accepted, so refused.
    expect(autosave.offer(rec('a', 5))).toBe(false);
    await w.release();
    await w.release();
    await autosave.idle();
    // 3 was in flight; 4 was replaced by 6 while waiting.
    expect(w.written).toEqual(['a#3', 'a#6']);
    expect(w.holds).toEqual([]);
  });

  it('refuses the same revision twice unless asked again (Save now), and keeps cases apart', async () => {
    const w = heldWriter();
    const autosave = createAutosave(w.write);
    autosave.offer(rec('a', 7));
    expect(autosave.offer(rec('a', 7))).toBe(false);
    // Another case's older revision number is its own sequence.
    expect(autosave.offer(rec('b', 2))).toBe(true);
    await w.release();
    await w.release();
    expect(autosave.offer(rec('a', 7), true)).toBe(true);
    await w.release();
    await autosave.idle();
    expect(w.written).toEqual(['a#7', 'b#2', 'a#7']);
  });

  it('goes on after a writer that throws', async () => {
    const written: number[] = [];
    const autosave = createAutosave(async (r) => {
      if (r.revision === 1) throw new Error('host gone');
      written.push(r.revision);
      return true;
    });
    autosave.offer(rec('a', 1));
    autosave.offer(rec('a', 2));
    await autosave.idle();
    expect(written).toEqual([2]);
  });
});
