/**
 * The workbench shell: one case at a time, four screens (Intake, Breakpoints, Day 2 vs Day 1,
 * Sign-off), a toolbar and keyboard shortcuts that both go through the command registry.
 * The analysis runs in the worker; the host keeps the files. A change's values are drawn the
 * moment the worker sends them; its record (digest and case text) follows, and is saved
 * atomically through the host, in revision order (engine/autosave.ts).
 */
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import type { CaseSummary, FilePayload, HostClient } from '../../host/workbench/api';
import type { LocatedError } from '../../core/model/errors';
import type { ThresholdId } from '../../core/model/analysis';
import type { Comparison } from '../../core/compare/compare-tests';
import type { ClinicalInputs } from '../../core/model/analysis';
import { activeOverrides } from '../../core/case/overrides';
import { commandForKeys, COMMAND_CATALOG, keysOf, type CommandId } from './command-catalog';
import { COMMANDS, keysLabel, runCommand, type CommandContext, type Screen } from './commands';
import { startEngine, type EngineClient, type Settled } from './engine/client';
import { createAutosave, type Autosave } from './engine/autosave';
import type { CaseRecord, EngineRequest, EngineView, MappingQuestion, Reviewer } from './engine/protocol';
import { ErrorNotice, ProgressStrip } from './ui/notices';
import { toBase64 } from './ui/files';
import { setDisplayLocale } from './ui/format';
import { initialLocale, LocalePicker, rememberLocale } from './ui/locale';
import { Intake } from './screens/Intake';
import { Breakpoints } from './screens/Breakpoints';
import { DayOver } from './screens/DayOver';
import { SignOff, type ExportState } from './screens/SignOff';
import { RecoveryCalls } from './screens/RecoveryCalls';

type View = EngineView<Comparison>;

/** Times of one change on screen, ms from its input; `startedAt` on the page's clock. */
export interface RenderTiming {
  readonly revision: number;
  readonly replyMs: number;
  readonly valuesMs: number;
  readonly chartsMs: number | null;
  readonly startedAt: number;
}

/** A performance mark of the newest change only (the entry of the change before is cleared). */
function mark(name: string, startTime?: number): void {
  performance.clearMarks(name);
  performance.mark(name, startTime === undefined ? undefined : { startTime });
}

function measure(name: string, start: number, end: number): void {
  performance.clearMeasures(name);
  performance.measure(name, { start, end });
}

/** Runs `then` in the first task after the next frame is painted (a frame callback, then a message to this page). */
function afterPaint(then: () => void): void {
  requestAnimationFrame(() => {
    mark('twofold:frame');
    const channel = new MessageChannel();
    channel.port1.onmessage = () => {
      channel.port1.close();
      then();
    };
    channel.port2.postMessage(null);
  });
}

const SCREENS: readonly { id: Screen; command: CommandId; label: string }[] = [
  { id: 'intake', command: 'go.intake', label: 'Intake' },
  { id: 'breakpoints', command: 'go.breakpoints', label: 'Breakpoints' },
  { id: 'dayover', command: 'go.dayover', label: 'Day 2 vs Day 1' },
  { id: 'signoff', command: 'go.signoff', label: 'Sign-off' },
  { id: 'recovery', command: 'go.recovery', label: 'Recovery calls' },
];

const REVIEWER_KEY = 'twofold-reviewer';
const NO_CLINICAL: ClinicalInputs = { peakRpe: null, lactateMmolL: null, fev1L: null, mvvLMin: null, restingHrBpm: null };

function loadReviewer(): Reviewer {
  try {
    const stored = JSON.parse(localStorage.getItem(REVIEWER_KEY) ?? 'null') as Reviewer | null;
    if (stored && typeof stored.who === 'string' && typeof stored.role === 'string') return stored;
  } catch {
    // A damaged entry is replaced by an empty reviewer below.
  }
  return { who: '', role: '' };
}

export function App({ host }: { host: HostClient }) {
  const [screen, setScreen] = useState<Screen>('intake');
  const [reviewDay, setReviewDay] = useState<1 | 2>(1);
  const [summary, setSummary] = useState<CaseSummary | null>(null);
  const [files, setFiles] = useState<{ day1: FilePayload; day2: FilePayload; caseJson: string } | null>(null);
  const [view, setView] = useState<View | null>(null);
  const [record, setRecord] = useState<CaseRecord | null>(null);
  const [question, setQuestion] = useState<MappingQuestion | null>(null);
  const [busy, setBusy] = useState<{ stage: string; fraction: number } | null>(null);
  /** How many times a case's analysis has reached the screen (the title carries it, so a reopen of the same case can be told apart). */
  const [opened, setOpened] = useState(0);
  const [error, setError] = useState<LocatedError | null>(null);
  const [reviewer, setReviewerState] = useState<Reviewer>(loadReviewer);
  const [saveNote, setSaveNote] = useState<string>('No case open');
  const [exportState, setExportState] = useState<ExportState>({ signers: [], signerId: null, result: null, verification: null });
  // A lab certificate's password while it is typed; cleared when the export sends it.
  const [certificatePassword, setCertificatePassword] = useState('');
  // The charts draw this view: the values' view, one painted frame later (see the timing below).
  const [chartsView, setChartsView] = useState<View | null>(null);
  const [renderMs, setRenderMs] = useState<RenderTiming | null>(null);
  const replyAt = useRef<number | null>(null);
  /** The timestamp of the newest click or key press (the event's own time, ms on the page's clock). */
  const lastInput = useRef<number | null>(null);
  const [previewUrl, setPreviewUrl] = useState<string | null>(null);
  // Numbers and dates on screen and in the report built from here (ui/locale.tsx).
  const [locale, setLocaleState] = useState<string>(initialLocale);
  setDisplayLocale(locale);
  const engineRef = useRef<EngineClient<Comparison> | null>(null);
  const autosaveRef = useRef<Autosave | null>(null);
  /** The revision on screen, the newest record received, and who waits for the one to catch up with the other. */
  const shownRevision = useRef(0);
  const latestRecord = useRef<CaseRecord | null>(null);
  const recordWaiters = useRef<{ revision: number; resolve: () => void }[]>([]);
  const verifyInput = useRef<HTMLInputElement>(null);
  const chooseInput = useRef<HTMLInputElement>(null);
  const changeStarted = useRef<number | null>(null);

  if (!autosaveRef.current) {
    autosaveRef.current = createAutosave(async (r) => {
      setSaveNote('Saving…');
      const reply = await host.call('saveCase', { caseId: r.caseId, caseJson: r.caseJson });
      if (reply.ok) setSaveNote(`Saved ${new Date(reply.value.savedAt).toLocaleTimeString('en-GB')}`);
      else {
        setSaveNote('Not saved');
        setError(reply.error);
      }
      return reply.ok;
    });
  }
  const autosave = autosaveRef.current;
  /** Lets go of those waiting for a record up to `revision` (all: no record for them will come). */
  const releaseWaiters = (revision = Infinity) => {
    const ready = recordWaiters.current.filter((w) => w.revision <= revision);
    recordWaiters.current = recordWaiters.current.filter((w) => w.revision > revision);
    for (const w of ready) w.resolve();
  };
  if (!engineRef.current) {
    engineRef.current = startEngine<Comparison>({
      onProgress: (stage, fraction) => setBusy({ stage, fraction }),
      onRecord: (r) => {
        latestRecord.current = r;
        setRecord(r);
        autosave.offer(r);
        releaseWaiters(r.revision);
      },
      onRecordFailed: (failure, previous) => {
        // The dropped change will have no record; the restored view's record was received before.
        shownRevision.current = previous.revision;
        releaseWaiters();
        setView(previous);
        setError({ ...failure, message: `The change was not kept, because its results could not be recorded: ${failure.message}` });
      },
      onStopped: () => releaseWaiters(),
    });
  }
  const engine = engineRef.current;

  const setReviewer = (next: Reviewer) => {
    setReviewerState(next);
    localStorage.setItem(REVIEWER_KEY, JSON.stringify(next));
  };

  useEffect(() => {
    const note = (event: Event) => {
      lastInput.current = event.timeStamp;
    };
    window.addEventListener('click', note, true);
    window.addEventListener('keydown', note, true);
    return () => {
      window.removeEventListener('click', note, true);
      window.removeEventListener('keydown', note, true);
    };
  }, []);

  // From a reviewer's action to the screen (performance marks and measures named `twofold:`):
  // the start is the click's or key press's own event time; the values are painted at the first
  // task after the frame that follows the commit of their view (afterPaint). Only then do the
  // charts take the new view, so their data and plotly's redraw never delay that frame; the
  // charts' time is taken the same way after their own commit.
  useLayoutEffect(() => {
    if (!view) return;
    const started = changeStarted.current;
    changeStarted.current = null;
    const reply = replyAt.current;
    const revision = view.revision;
    if (started !== null) mark('twofold:values-committed');
    afterPaint(() => {
      engine.shown(revision);
      if (started !== null) {
        const painted = performance.now();
        measure('twofold:values-painted', started, painted);
        setRenderMs({ revision, replyMs: (reply ?? painted) - started, valuesMs: painted - started, chartsMs: null, startedAt: started });
      }
      setChartsView(view);
    });
  }, [view, engine]);

  useLayoutEffect(() => {
    if (!chartsView) return;
    const revision = chartsView.revision;
    afterPaint(() =>
      setTimeout(() =>
        setRenderMs((r) => {
          if (!r || r.revision !== revision || r.chartsMs !== null) return r;
          const chartsMs = performance.now() - r.startedAt;
          measure('twofold:charts-drawn', r.startedAt, r.startedAt + chartsMs);
          return { ...r, chartsMs };
        }),
      ),
    );
  }, [chartsView]);

  const settle = useCallback((reply: Settled<Comparison>) => {
    setBusy(null);
    if (reply.type === 'error') return setError(reply.error);
    if (reply.type === 'needs-mapping') return setQuestion(reply.question);
    setQuestion(null);
    setError(null);
    shownRevision.current = reply.view.revision;
    setView(reply.view);
  }, []);

  /** Settles once the values on screen are recorded (their record follows them by tens of ms). */
  const untilRecorded = useCallback(async () => {
    const wanted = shownRevision.current;
    if (wanted === 0 || (latestRecord.current?.revision ?? 0) >= wanted) return;
    await new Promise<void>((resolve) => recordWaiters.current.push({ revision: wanted, resolve }));
  }, []);

  /** Settles once the case on screen is written: export and preview read the saved case. */
  const untilSaved = useCallback(async () => {
    await untilRecorded();
    await autosave.idle();
  }, [untilRecorded, autosave]);

  const openFiles = useCallback(
    async (opened: { summary: CaseSummary; day1: FilePayload; day2: FilePayload; caseJson: string }) => {
      setSummary(opened.summary);
      setFiles({ day1: opened.day1, day2: opened.day2, caseJson: opened.caseJson });
      setView(null);
      setChartsView(null);
      setRecord(null);
      setReviewDay(1);
      setRenderMs(null);
      setExportState((s) => ({ ...s, result: null, verification: null }));
      setPreviewUrl(null);
      const mappings = await host.call('listMappings', {});
      const request: EngineRequest = { type: 'open', caseId: opened.summary.caseId, day1: opened.day1, day2: opened.day2, caseJson: opened.caseJson, mappings: mappings.ok ? mappings.value.mappings : [] };
      setBusy({ stage: 'Starting the analysis', fraction: 0 });
      const reply = await engine.request(request);
      settle(reply);
      if (reply.type === 'view') {
        setScreen('breakpoints');
        setOpened((n) => n + 1);
      }
      return reply.type;
    },
    [engine, host, settle],
  );

  const openCase = useCallback(
    async (caseId: string) => {
      const reply = await host.call('openCase', { caseId });
      if (!reply.ok) {
        setError(reply.error);
        return 'error' as const;
      }
      return openFiles(reply.value);
    },
    [host, openFiles],
  );

  const startCase = useCallback(
    async (title: string, day1: FilePayload, day2: FilePayload, clinical: { day1: ClinicalInputs; day2: ClinicalInputs }) => {
      setBusy({ stage: 'Copying the files into a new case folder', fraction: 0 });
      const created = await host.call('createCase', { title, day1, day2, clinical });
      setBusy(null);
      if (!created.ok) return setError(created.error);
      // Files that cannot be analysed leave no case behind; the error stays on screen.
      if ((await openCase(created.value.caseId)) === 'error') {
        await host.call('discardCase', { caseId: created.value.caseId });
        setSummary(null);
        setFiles(null);
      }
    },
    [host, openCase],
  );

  const loadDemo = useCallback(async () => {
    const demo = await host.call('demoPair', {});
    if (!demo.ok) return setError(demo.error);
    if (demo.value.existingCaseId) return void (await openCase(demo.value.existingCaseId));
    await startCase(demo.value.title, demo.value.day1, demo.value.day2, { day1: NO_CLINICAL, day2: NO_CLINICAL });
  }, [host, startCase, openCase]);

  const answerMapping = useCallback(
    async (layoutKey: string, mappingJson: string) => {
      const saved = await host.call('saveMapping', { layoutKey, mappingJson });
      if (!saved.ok) return setError(saved.error);
      if (summary && files) await openFiles({ summary, ...files });
    },
    [host, summary, files, openFiles],
  );

  const act = useCallback(
    async (request: EngineRequest): Promise<boolean> => {
      if (!summary) return false;
      const now = performance.now();
      // The input that asked for this change, when there was one just now (a command from the host's menu has none).
      const input = lastInput.current;
      changeStarted.current = input !== null && input <= now && now - input < 1000 ? input : now;
      lastInput.current = null;
      mark('twofold:change-input', changeStarted.current);
      const reply = await engine.request(request);
      replyAt.current = performance.now();
      mark('twofold:reply');
      settle(reply);
      return reply.type === 'view';
    },
    [engine, settle, summary],
  );

  const needReviewer = (): boolean => {
    if (reviewer.who.trim() && reviewer.role.trim()) return false;
    setError({ code: 'reviewer-missing', file: 'reviewer', line: null, column: null, message: 'Enter your name and role (top right) first: every change is recorded under them.' });
    return true;
  };

  const setThreshold = async (day: 1 | 2, threshold: ThresholdId, givenAs: 'time' | 'vo2', value: number, reason: string) => {
    if (!needReviewer()) await act({ type: 'set-threshold', day, threshold, givenAs, value, reason, reviewer, at: new Date().toISOString() });
  };
  const withdraw = async (seq: number, reason: string) => {
    if (!needReviewer()) await act({ type: 'withdraw', seq, reason, reviewer, at: new Date().toISOString() });
  };

  const refreshSigners = useCallback(async () => {
    const reply = await host.call('listSigners', {});
    if (!reply.ok) return setError(reply.error);
    setExportState((s) => ({ ...s, signers: reply.value.signers, signerId: s.signerId ?? reply.value.signers[0]?.id ?? null }));
  }, [host]);

  useEffect(() => {
    void refreshSigners();
  }, [refreshSigners]);

  const exportReport = async () => {
    if (!summary || needReviewer()) return;
    const signerId = exportState.signerId;
    if (!signerId) return setError({ code: 'no-signer', file: 'certificates', line: null, column: null, message: 'Choose a certificate to sign with.' });
    const needsPassword = exportState.signers.find((s) => s.id === signerId)?.needsPassword ?? false;
    const password = needsPassword && certificatePassword ? certificatePassword : undefined;
    setCertificatePassword('');
    setBusy({ stage: 'Building and signing the report', fraction: 0.3 });
    await untilSaved();
    const reply = await host.call('exportReport', { caseId: summary.caseId, signerId, reviewer: `${reviewer.who} (${reviewer.role})`, locale, ...(password ? { password } : {}) });
    setBusy(null);
    // The host now holds the password, or dropped a wrong one: the list says which.
    await refreshSigners();
    if (!reply.ok) return setError(reply.error);
    setExportState((s) => ({ ...s, result: reply.value, verification: null }));
  };

  const preview = async () => {
    if (!summary) return;
    setBusy({ stage: 'Building the report preview', fraction: 0.3 });
    await untilSaved();
    const reply = await host.call('previewReport', { caseId: summary.caseId, reviewer: reviewer.who ? `${reviewer.who} (${reviewer.role})` : '', locale });
    setBusy(null);
    if (!reply.ok) return setError(reply.error);
    const bytes = Uint8Array.from(atob(reply.value.base64), (c) => c.charCodeAt(0));
    setPreviewUrl((old) => {
      if (old) URL.revokeObjectURL(old);
      return URL.createObjectURL(new Blob([bytes], { type: 'application/pdf' }));
    });
  };

  const verify = async (request: { caseId: string; fileName: string } | { fileName: string; base64: string }) => {
    setBusy({ stage: `Verifying ${request.fileName}`, fraction: 0.5 });
    const reply = await host.call('verifyReport', request);
    setBusy(null);
    if (!reply.ok) return setError(reply.error);
    setExportState((s) => ({ ...s, verification: { fileName: request.fileName, ...reply.value } }));
  };

  const canUndo = view ? activeOverrides(view.log).size > 0 : false;
  const ctx: CommandContext = {
    hasCase: view !== null,
    canUndo,
    canRedo: (view?.redoable ?? 0) > 0,
    go: setScreen,
    reviewDay: setReviewDay,
    loadDemo,
    saveNow: async () => {
      await untilRecorded();
      if (latestRecord.current) autosave.offer(latestRecord.current, true);
      await autosave.idle();
    },
    undo: async () => {
      if (!needReviewer()) await act({ type: 'undo', reviewer, at: new Date().toISOString() });
    },
    redo: async () => {
      if (!needReviewer()) await act({ type: 'redo', reviewer, at: new Date().toISOString() });
    },
    exportReport,
    chooseReportToVerify: () => verifyInput.current?.click(),
    chooseFiles: () => chooseInput.current?.focus(),
  };
  const ctxRef = useRef(ctx);
  ctxRef.current = ctx;

  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      const id = commandForKeys(keysOf(event));
      if (!id) return;
      const target = event.target as HTMLElement | null;
      // Typing in a field keeps its own undo; the workbench's undo acts outside fields.
      if (target && ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName) && id.startsWith('review.u')) return;
      event.preventDefault();
      void runCommand(id, ctxRef.current);
    };
    window.addEventListener('keydown', onKey);
    const stop = host.onCommand((id) => {
      if (COMMAND_CATALOG.some((c) => c.id === id)) void runCommand(id as CommandId, ctxRef.current);
    });
    return () => {
      window.removeEventListener('keydown', onKey);
      stop();
    };
  }, [host]);

  const button = (id: CommandId, label: string) => (
    <button type="button" className="tool" data-command={id} disabled={!COMMANDS[id].enabled(ctx)} onClick={() => void runCommand(id, ctx)} title={`${label} (${keysLabel(id)})`}>
      {label}
    </button>
  );

  const pending = useMemo(() => (view ? activeOverrides(view.log) : new Map()), [view]);

  return (
    <div className="app">
      <header className="topbar">
        <div className="brand">
          <span className="mark" aria-hidden="true" />
          Twofold <span className="sub">two-day CPET workbench</span>
        </div>
        <nav className="screens" aria-label="Screens">
          {SCREENS.map((s) => (
            <button key={s.id} type="button" className={screen === s.id ? 'tab active' : 'tab'} aria-current={screen === s.id ? 'page' : undefined} disabled={s.id !== 'intake' && !view} onClick={() => void runCommand(s.command, ctx)} title={COMMAND_CATALOG.find((c) => c.id === s.command)?.keys}>
              {s.label}
            </button>
          ))}
        </nav>
        <div className="reviewer">
          <label>
            Reviewer <input aria-label="Reviewer name" value={reviewer.who} placeholder="name" onChange={(e) => setReviewer({ ...reviewer, who: e.target.value })} />
          </label>
          <input aria-label="Reviewer role" value={reviewer.role} placeholder="role" onChange={(e) => setReviewer({ ...reviewer, role: e.target.value })} />
        </div>
        <LocalePicker
          value={locale}
          onChange={(tag) => {
            rememberLocale(tag);
            setLocaleState(tag);
          }}
        />
      </header>
      <div className="toolbar">
        {button('case.demo', 'Load demo pair')}
        {button('review.undo', 'Undo')}
        {button('review.redo', 'Redo')}
        {button('case.save', 'Save now')}
        {button('report.export', 'Export signed report')}
        <span className="case-title" data-testid="case-title" data-opened={opened}>
          {summary ? summary.title : 'No case open'}
        </span>
        <span className="save-note" data-testid="save-note" data-revision={record?.revision} title={record ? `Recorded (digest and case text) in ${record.recordMs.toFixed(1)} ms after the values` : undefined}>
          {saveNote}
        </span>
      </div>
      {busy && <ProgressStrip stage={busy.stage} fraction={busy.fraction} />}
      {error && <ErrorNotice error={error} onDismiss={() => setError(null)} />}
      <input
        ref={verifyInput}
        type="file"
        accept=".pdf,application/pdf"
        hidden
        data-testid="verify-input"
        onChange={async (e) => {
          const file = e.target.files?.[0];
          e.target.value = '';
          if (file) await verify({ fileName: file.name.replace(/[\\/]/g, '_'), base64: await toBase64(file) });
        }}
      />
      <main className="screen" data-screen={screen}>
        {screen === 'intake' && <Intake host={host} chooseRef={chooseInput} question={question} onStart={startCase} onOpen={openCase} onAnswerMapping={answerMapping} onError={setError} />}
        {screen === 'breakpoints' && view && (
          <Breakpoints view={view} chartsView={chartsView} day={reviewDay} onDay={setReviewDay} onSet={setThreshold} onWithdraw={withdraw} active={pending} renderMs={renderMs} />
        )}
        {screen === 'dayover' && view && <DayOver view={view} />}
        {screen === 'recovery' && view && <RecoveryCalls view={view} onSubmit={(request) => (needReviewer() ? Promise.resolve(false) : act({ ...request, reviewer, at: new Date().toISOString() }))} />}
        {screen === 'signoff' && view && summary && (
          <SignOff
            view={view}
            digest={record && record.revision === view.revision ? record.digest : null}
            state={exportState}
            reviewer={reviewer}
            onSigner={(signerId) => setExportState((s) => ({ ...s, signerId }))}
            onExport={() => void runCommand('report.export', ctx)}
            password={certificatePassword}
            onPassword={setCertificatePassword}
            onVerifyExported={(fileName) => void verify({ caseId: summary.caseId, fileName })}
            onChooseReport={() => void runCommand('report.verify', ctx)}
            onPreview={() => void preview()}
            previewUrl={previewUrl}
            onSignOff={async (who, statement) => { await act({ type: 'sign-off', statement, reviewer: who, at: new Date().toISOString() }); }}
          />
        )}
      </main>
    </div>
  );
}
