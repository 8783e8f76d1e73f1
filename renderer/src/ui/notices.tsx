/** Cautions, located errors in plain words, and progress: shared by every screen. */
import type { LocatedError } from '../../../core/model/errors';

export function Caution() {
  return (
    <aside className="caution" role="note" aria-label="Clinical caution">
      <strong>Caution.</strong> Twofold supports licensed clinicians; it does not diagnose. Two-day maximal testing can provoke symptom flares
      lasting days or weeks: screening, consent and supervision are the lab&apos;s responsibility. Follow local regulations and licensed practice.
    </aside>
  );
}

/**
 * The place first, then the sentence: "In day2.csv, line 14, column 3: …" for a file;
 * for anything else the subject alone, "Reviewer: …", "New case: …".
 */
export function placeOf(error: LocatedError): string {
  const isFile = error.line !== null || /\.[A-Za-z0-9]{1,5}$/.test(error.file);
  if (!isFile) return error.file.charAt(0).toUpperCase() + error.file.slice(1);
  const parts = [`In ${error.file}`];
  if (error.line !== null) parts.push(`line ${error.line}`);
  if (error.column !== null) parts.push(`column ${error.column}`);
  return parts.join(', ');
}

export function ErrorNotice({ error, onDismiss }: { error: LocatedError; onDismiss?: () => void }) {
  return (
    <div className="error-notice" role="alert">
      <div>
        <span className="error-place">{placeOf(error)}:</span> {error.message}
      </div>
      {onDismiss && (
        <button type="button" className="quiet" onClick={onDismiss}>
          Dismiss
        </button>
      )}
    </div>
  );
}

export function ProgressStrip({ stage, fraction }: { stage: string; fraction: number }) {
  return (
    <div className="progress" role="status" aria-live="polite">
      <span>{stage}</span>
      <progress max={1} value={fraction} />
    </div>
  );
}
