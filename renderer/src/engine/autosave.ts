/**
 * Autosave in revision order. One save is in flight at a time; a record that arrives
 * meanwhile waits, and a newer record of the same case replaces a waiting older one. A record
 * older than one already accepted for its case is refused, so a slow save or a late message
 * never puts an older case text over a newer one, and the newest is always written (the log
 * only grows, so the newest case text holds every earlier change). Each write is the host's
 * atomic replace.
 *
 * Example: offer revisions 4, 5, 6 while 3 is being written → 3 finishes, then 6 is written;
 * 4 and 5 were replaced while waiting, and a late 5 is refused.
 */
import type { CaseRecord } from './protocol';

/** Writes one record; true when it was saved. Failures are the writer's to report. */
export type RecordWriter = (record: CaseRecord) => Promise<boolean>;

export function createAutosave(write: RecordWriter) {
  const accepted = new Map<string, number>();
  const waiting = new Map<string, CaseRecord>();
  let writing = false;
  let idleWaiters: (() => void)[] = [];

  async function drain(): Promise<void> {
    if (writing) return;
    writing = true;
    for (let next = waiting.values().next(); !next.done; next = waiting.values().next()) {
      const record = next.value;
      waiting.delete(record.caseId);
      try {
        await write(record);
      } catch {
        // The writer reports its own failures; a throw must not stop later saves.
      }
    }
    writing = false;
    const waiters = idleWaiters;
    idleWaiters = [];
    for (const resolve of waiters) resolve();
  }

  return {
    /**
     * Queues a record for saving. `again` saves a revision already accepted once more (the
     * reviewer's "Save now", or a retry after a failed save). False when refused as older.
     */
    offer(record: CaseRecord, again = false): boolean {
      const newest = accepted.get(record.caseId) ?? -Infinity;
      if (record.revision < newest || (record.revision === newest && !again)) return false;
      accepted.set(record.caseId, record.revision);
      waiting.set(record.caseId, record);
      void drain();
      return true;
    },
    /** Settles when nothing is waiting or being written. */
    idle(): Promise<void> {
      if (!writing && waiting.size === 0) return Promise.resolve();
      return new Promise((resolve) => idleWaiters.push(resolve));
    },
  };
}

export type Autosave = ReturnType<typeof createAutosave>;
