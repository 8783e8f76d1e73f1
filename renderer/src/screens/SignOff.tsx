/**
 * Sign-off: what the report will state (the summary, the thresholds as used and the reviewer
 * log), the certificate and reviewer identity, the export of the signed PDF, and the
 * verification of an exported or chosen report.
 */
import type { SignerInfo } from '../../../host/workbench/api';
import type { Comparison } from '../../../core/compare/compare-tests';
import type { EngineView, Reviewer } from '../engine/protocol';
import { Caution } from '../ui/notices';
import { clock, fmt, when } from '../ui/format';
import { describeFollowUpAction } from '../../../core/followup/describe';
import { SignOffEntry } from './SignOffEntry';

export interface ExportState {
  readonly signers: readonly SignerInfo[];
  readonly signerId: string | null;
  readonly result: { fileName: string; path: string; bytes: number; demonstration: boolean } | null;
  readonly verification: { fileName: string; valid: boolean; summary: string; checks: readonly { name: string; passed: boolean; detail: string }[] } | null;
}

interface Props {
  readonly view: EngineView<Comparison>;
  /** The digest recorded for this view, or null while the worker is still recording it. */
  readonly digest: string | null;
  readonly state: ExportState;
  readonly reviewer: Reviewer;
  readonly onSigner: (id: string) => void;
  readonly onExport: () => void;
  /**
   * The lab certificate's password as typed, when the host asked for it (the signer's
   * needsPassword). It stays in the page's memory until the export sends it, then only in
   * the host's; nothing writes it down.
   */
  readonly password: string;
  readonly onPassword: (password: string) => void;
  readonly onVerifyExported: (fileName: string) => void;
  readonly onChooseReport: () => void;
  readonly onPreview: () => void;
  /** A blob: URL of the unsigned preview PDF, once built. */
  readonly previewUrl: string | null;
  /** Records a sign-off entry in the reviewer log. */
  readonly onSignOff: (reviewer: Reviewer, statement: string) => Promise<void>;
}

function describe(action: EngineView['log'][number]['action']): string {
  switch (action.kind) {
    case 'set-threshold':
      return `Day ${action.day} ${action.threshold.toUpperCase()} set to ${clock(action.after.timeS)}, ${fmt(action.after.vo2MlMin, 0, 'mL/min')} (given as ${action.givenAs === 'time' ? 'a time' : 'a VO₂'}; before: ${action.before ? `${clock(action.before.timeS)}, ${fmt(action.before.vo2MlMin, 0, 'mL/min')}` : 'none'})`;
    case 'withdraw':
      return `Withdrew entry ${action.withdraws} (day ${action.day} ${action.threshold.toUpperCase()}); now ${action.after ? `${clock(action.after.timeS)}, ${fmt(action.after.vo2MlMin, 0, 'mL/min')}` : 'none'}`;
    case 'sign-off':
      return `Signed off: ${action.statement}`;
    case 'follow-up':
    case 'follow-up-correction':
      return describeFollowUpAction(action);
    case 'case-opened':
      return action.migrated ? 'Case opened (opening entry added when an older case file was read)' : 'Case opened: raw files, column maps, settings and clinical inputs chained';
  }
}

export function SignOff({ view, digest, state, reviewer, onSigner, onExport, password, onPassword, onVerifyExported, onChooseReport, onPreview, previewUrl, onSignOff }: Props) {
  const signer = state.signers.find((s) => s.id === state.signerId) ?? null;
  const askPassword = signer !== null && signer.needsPassword;
  return (
    <div className="signoff">
      <Caution />
      <div className="two-col">
        <section className="panel preview" aria-label="Report preview">
          <h2>What the report will state</h2>
          <p>{view.comparison.summary}</p>
          <table className="values">
            <thead>
              <tr>
                <th>Day</th>
                <th>VT1</th>
                <th>VT2</th>
                <th>VO₂ peak</th>
                <th>Effort</th>
              </tr>
            </thead>
            <tbody>
              {[view.day1, view.day2].map((d) => (
                <tr key={d.day}>
                  <th scope="row">
                    Day {d.day}: {d.analysis.sourceName}
                  </th>
                  <td>
                    {fmt(d.analysis.vt1.at?.vo2MlMin, 0, 'mL/min')} at {clock(d.analysis.vt1.at?.timeS)} {d.vt1.override ? `(reviewer, entry ${d.vt1.override.seq})` : '(automatic)'}
                  </td>
                  <td>
                    {fmt(d.analysis.vt2.at?.vo2MlMin, 0, 'mL/min')} {d.vt2.override ? `(reviewer, entry ${d.vt2.override.seq})` : '(automatic)'}
                  </td>
                  <td>{fmt(d.analysis.peak.vo2MlMin, 0, 'mL/min')}</td>
                  <td>{d.analysis.effort.verdict}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <h3>Reviewer log ({view.log.length} entries, hash-chained)</h3>
          {view.log.length === 0 ? (
            <p className="hint">No reviewer actions: every threshold is the automatic estimate.</p>
          ) : (
            <ol className="log" data-testid="review-log" start={view.log[0]?.seq ?? 1}>
              {view.log.map((e) => (
                <li key={e.seq}>
                  <span className="meta">
                    {when(e.at)} · {e.who} ({e.role})
                  </span>{' '}
                  {describe(e.action)} — “{e.reason}”
                </li>
              ))}
            </ol>
          )}
          <p className="hint">Record digest {digest ? `${digest.slice(0, 16)}…` : '(being computed)'} (SHA-256 of every recomputed number).</p>
          <button type="button" data-testid="preview" onClick={onPreview}>
            {previewUrl ? 'Rebuild the preview' : 'Preview the report (unsigned)'}
          </button>
          {previewUrl && <iframe className="preview-frame" title="Report preview (unsigned)" src={previewUrl} data-testid="preview-frame" />}
        </section>
        <div>
        <SignOffEntry log={view.log} reviewer={reviewer} onRecord={onSignOff} />
        <section className="panel export" aria-label="Export and verify">
          <h2>Sign and export</h2>
          <label className="field">
            Certificate
            <select data-testid="signer" value={state.signerId ?? ''} onChange={(e) => onSigner(e.target.value)}>
              {state.signers.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.label}
                  {s.demonstration ? ' — DEMONSTRATION ONLY' : ''}
                </option>
              ))}
            </select>
          </label>
          {askPassword && (
            <label className="field">
              Certificate password
              <input type="password" data-testid="certificate-password" autoComplete="off" value={password} onChange={(e) => onPassword(e.target.value)} />
              <span className="hint">Asked once; kept in memory while the workbench is open, never written to disk.</span>
            </label>
          )}
          {signer?.demonstration && <p className="demo-note">This certificate is for demonstration: the report will say so on every page and must not be filed as evidence.</p>}
          <p>
            Reviewer: <strong>{reviewer.who || '(enter your name at the top right)'}</strong> {reviewer.role && `(${reviewer.role})`}
          </p>
          <button type="button" className="primary" data-testid="export" onClick={onExport}>
            Export signed report
          </button>
          {state.result && (
            <div className="result" data-testid="export-result">
              <p>
                Written <code>{state.result.fileName}</code> ({fmt(state.result.bytes / 1024, 0, 'KiB')}) to the case folder:
                <br />
                <code className="path" data-testid="export-path">{state.result.path}</code>
              </p>
              <button type="button" onClick={() => onVerifyExported(state.result!.fileName)}>
                Verify this report
              </button>
            </div>
          )}
          <h2>Verify a report</h2>
          <button type="button" onClick={onChooseReport}>
            Choose a PDF report…
          </button>
          {state.verification && (
            <div className={state.verification.valid ? 'verdict-box valid' : 'verdict-box invalid'} data-testid="verification">
              <p>
                <strong>{state.verification.valid ? '✔ Valid' : '✘ Not valid'}</strong>: {state.verification.fileName} — {state.verification.summary}
              </p>
              <ul>
                {state.verification.checks.map((c) => (
                  <li key={c.name}>
                    {c.passed ? '✔ passed' : '✘ failed'} — {c.name}: {c.detail}
                  </li>
                ))}
              </ul>
            </div>
          )}
        </section>
        </div>
      </div>
    </div>
  );
}
