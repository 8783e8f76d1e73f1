/**
 * Intake: open a recent case, or start one from the day-1 and day-2 files (chosen or
 * dropped) with what the lab recorded beside them; answer the column questions when the
 * importer was unsure of a file's layout.
 */
import { useEffect, useState, type RefObject } from 'react';
import type { CaseSummary, FilePayload, HostClient } from '../../../host/workbench/api';
import type { ClinicalInputs } from '../../../core/model/analysis';
import type { LocatedError } from '../../../core/model/errors';
import type { MappingQuestion } from '../engine/protocol';
import { toBase64 } from '../ui/files';
import { when } from '../ui/format';
import { MappingStep } from './MappingStep';
import { Caution } from '../ui/notices';

interface Props {
  readonly host: HostClient;
  readonly chooseRef: RefObject<HTMLInputElement | null>;
  readonly question: MappingQuestion | null;
  readonly onStart: (title: string, day1: FilePayload, day2: FilePayload, clinical: { day1: ClinicalInputs; day2: ClinicalInputs }) => Promise<void>;
  readonly onOpen: (caseId: string) => Promise<unknown>;
  readonly onAnswerMapping: (layoutKey: string, mappingJson: string) => Promise<void>;
  readonly onError: (error: LocatedError) => void;
}

type ClinicalText = Record<keyof ClinicalInputs, string>;
const EMPTY: ClinicalText = { peakRpe: '', lactateMmolL: '', fev1L: '', mvvLMin: '', restingHrBpm: '' };

const CLINICAL_FIELDS: readonly { key: keyof ClinicalInputs; label: string; unit: string; min: number; max: number }[] = [
  { key: 'peakRpe', label: 'Peak RPE', unit: 'Borg 6–20', min: 6, max: 20 },
  { key: 'lactateMmolL', label: 'Peak lactate', unit: 'mmol/L', min: 0, max: 40 },
  { key: 'restingHrBpm', label: 'Resting HR', unit: 'bpm', min: 20, max: 200 },
  { key: 'fev1L', label: 'FEV₁', unit: 'L', min: 0.2, max: 9 },
  { key: 'mvvLMin', label: 'MVV (measured)', unit: 'L/min', min: 5, max: 400 },
];

function parseClinical(text: ClinicalText, day: 1 | 2): { ok: true; value: ClinicalInputs } | { ok: false; error: LocatedError } {
  const out: Record<string, number | null> = {};
  for (const field of CLINICAL_FIELDS) {
    const raw = text[field.key].trim().replace(',', '.');
    if (raw === '') {
      out[field.key] = null;
      continue;
    }
    const value = Number(raw);
    if (!Number.isFinite(value) || value < field.min || value > field.max) {
      return { ok: false, error: { code: 'clinical-out-of-range', file: `day ${day} details`, line: null, column: null, message: `${field.label} must be a number from ${field.min} to ${field.max} ${field.unit}; '${text[field.key]}' is not.` } };
    }
    out[field.key] = value;
  }
  return { ok: true, value: out as unknown as ClinicalInputs };
}

function DayDrop({ day, file, onFile, inputRef }: { day: 1 | 2; file: FilePayload | null; onFile: (f: File) => void; inputRef?: RefObject<HTMLInputElement | null> }) {
  const [over, setOver] = useState(false);
  return (
    <label
      className={`drop day${day}${over ? ' over' : ''}`}
      onDragOver={(e) => {
        e.preventDefault();
        setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(e) => {
        e.preventDefault();
        setOver(false);
        const f = e.dataTransfer.files[0];
        if (f) onFile(f);
      }}
    >
      <span className="drop-title">Day {day} breath file</span>
      <span className="drop-name">{file ? file.name : 'Drop a file here or click to choose (CSV, TSV, TXT, XLSX)'}</span>
      <input ref={inputRef} type="file" data-testid={`day${day}-file`} accept=".csv,.tsv,.txt,.xlsx,.dat" onChange={(e) => e.target.files?.[0] && onFile(e.target.files[0])} />
    </label>
  );
}

export function Intake({ host, chooseRef, question, onStart, onOpen, onAnswerMapping, onError }: Props) {
  const [recent, setRecent] = useState<CaseSummary[]>([]);
  const [title, setTitle] = useState('');
  const [files, setFiles] = useState<{ 1: FilePayload | null; 2: FilePayload | null }>({ 1: null, 2: null });
  const [clinical, setClinical] = useState<{ 1: ClinicalText; 2: ClinicalText }>({ 1: EMPTY, 2: EMPTY });

  useEffect(() => {
    void host.call('listCases', {}).then((reply) => (reply.ok ? setRecent(reply.value.cases) : onError(reply.error)));
  }, [host, onError]);

  const take = async (day: 1 | 2, file: File) => {
    const payload = { name: file.name.replace(/[\\/]/g, '_').slice(0, 200), base64: await toBase64(file) };
    setFiles((f) => ({ ...f, [day]: payload }));
  };

  const start = async () => {
    if (!files[1] || !files[2]) return onError({ code: 'files-missing', file: 'new case', line: null, column: null, message: 'Choose both the day-1 and the day-2 breath file.' });
    const c1 = parseClinical(clinical[1], 1);
    if (!c1.ok) return onError(c1.error);
    const c2 = parseClinical(clinical[2], 2);
    if (!c2.ok) return onError(c2.error);
    await onStart(title.trim() || `${files[1].name} / ${files[2].name}`, files[1], files[2], { day1: c1.value, day2: c2.value });
  };

  if (question) return <MappingStep question={question} onAnswer={onAnswerMapping} />;

  return (
    <div className="intake">
      <Caution />
      <section className="panel">
        <h2>Start a case</h2>
        <label className="field">
          Case title <input value={title} onChange={(e) => setTitle(e.target.value)} placeholder="e.g. subject code and test dates" />
        </label>
        <div className="drops">
          <DayDrop day={1} file={files[1]} onFile={(f) => void take(1, f)} inputRef={chooseRef} />
          <DayDrop day={2} file={files[2]} onFile={(f) => void take(2, f)} />
        </div>
        <button
          type="button"
          data-testid="swap-days"
          disabled={!files[1] && !files[2]}
          title="Day 2 must start after day 1 (a pair in the wrong order is refused): swap the two files and their clinical inputs"
          onClick={() => {
            setFiles((f) => ({ 1: f[2], 2: f[1] }));
            setClinical((c) => ({ 1: c[2], 2: c[1] }));
          }}
        >
          Swap day 1 and day 2
        </button>
        <table className="clinical">
          <caption>Recorded beside the breath file (leave blank when not measured)</caption>
          <thead>
            <tr>
              <th scope="col">Measure</th>
              <th scope="col">Day 1</th>
              <th scope="col">Day 2</th>
            </tr>
          </thead>
          <tbody>
            {CLINICAL_FIELDS.map((f) => (
              <tr key={f.key}>
                <th scope="row">
                  {f.label} <span className="unit">({f.unit})</span>
                </th>
                {([1, 2] as const).map((d) => (
                  <td key={d}>
                    <input aria-label={`${f.label} day ${d}`} inputMode="decimal" value={clinical[d][f.key]} onChange={(e) => setClinical((c) => ({ ...c, [d]: { ...c[d], [f.key]: e.target.value } }))} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        <p className="hint">Age, sex, height and weight are read from each file&apos;s header block; they appear on the Breakpoints screen.</p>
        <button type="button" className="primary" onClick={() => void start()}>
          Start case
        </button>
      </section>
      <section className="panel">
        <h2>Recent cases</h2>
        {recent.length === 0 ? (
          <p className="hint">No saved cases yet. Try “Load demo pair” in the toolbar.</p>
        ) : (
          <ul className="recent">
            {recent.map((c) => (
              <li key={c.caseId}>
                <button type="button" className="link" onClick={() => void onOpen(c.caseId)}>
                  {c.title}
                </button>
                <span className="meta">
                  {c.day1Name} · {c.day2Name} · saved {when(c.savedAt)}
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
