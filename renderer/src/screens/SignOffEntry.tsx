/**
 * Recording a sign-off: who signs, in what role, and the statement they sign. All three are
 * required. The entry goes into the case's hash-chained reviewer log (core/case/review.ts
 * `recordSignOff`); a later threshold change ends its cover (core/case/overrides.ts
 * `currentSignOff`), and a report without a sign-off in force is a draft.
 */
import { useEffect, useState } from 'react';
import { currentSignOff } from '../../../core/case/overrides';
import type { AuditEntry } from '../../../core/case/case-file';
import type { Reviewer } from '../engine/protocol';

interface Props {
  readonly log: readonly AuditEntry[];
  readonly reviewer: Reviewer;
  readonly onRecord: (reviewer: Reviewer, statement: string) => Promise<void>;
}

export function SignOffEntry({ log, reviewer, onRecord }: Props) {
  const [who, setWho] = useState(reviewer.who);
  const [role, setRole] = useState(reviewer.role);
  const [statement, setStatement] = useState('');
  useEffect(() => {
    setWho((w) => w || reviewer.who);
    setRole((r) => r || reviewer.role);
  }, [reviewer.who, reviewer.role]);
  const current = currentSignOff(log);
  const ready = who.trim() !== '' && role.trim() !== '' && statement.trim() !== '';
  const record = async () => {
    if (!ready) return;
    await onRecord({ who: who.trim(), role: role.trim() }, statement.trim());
    setStatement('');
  };
  return (
    <section className="panel signoff-entry" aria-label="Record a sign-off">
      <h2>Sign-off</h2>
      {current && current.action.kind === 'sign-off' ? (
        <p className="status" data-testid="signoff-status">
          Signed off by {current.who} ({current.role}), {new Date(current.at).toLocaleString('en-GB')}, reviewer log entry {current.seq}: “{current.action.statement}”
        </p>
      ) : (
        <p className="status draft" data-testid="signoff-status">
          No sign-off in force: the report is marked as a draft. {log.some((e) => e.action.kind === 'sign-off') ? 'A threshold was changed after the last sign-off, so it no longer covers what is shown.' : ''}
        </p>
      )}
      <label className="field">
        Reviewer (required)
        <input data-testid="signoff-who" value={who} onChange={(e) => setWho(e.target.value)} />
      </label>
      <label className="field">
        Role (required)
        <input data-testid="signoff-role" value={role} onChange={(e) => setRole(e.target.value)} />
      </label>
      <label className="field">
        Statement (required)
        <textarea data-testid="signoff-statement" rows={3} value={statement} placeholder="e.g. Reviewed both tests; thresholds accepted as shown." onChange={(e) => setStatement(e.target.value)} />
      </label>
      <button type="button" className="primary" data-testid="signoff-record" disabled={!ready} onClick={() => void record()}>
        Record sign-off in the reviewer log
      </button>
    </section>
  );
}
