/**
 * Recovery calls: the follow-up reports after each test, entered by keyboard while the
 * coordinator is on the phone. Every field is a short text box read by core's field readers
 * (core/followup/fields.ts), so "p" is phone, "n" is no and "3d" is 72 h; Tab moves on, Enter
 * records, and the form clears for the next call keeping test, reporter and channel. A report
 * is corrected by loading it into the form (its Correct button), changing it and giving a
 * reason; the correction is a new log entry. Above: the time to reported recovery after each
 * test and a timeline chart per domain, both from core's course.
 */
import { useEffect, useMemo, useRef, useState, type FormEvent } from 'react';
import type { Comparison } from '../../../core/compare/compare-tests';
import { followUpsOf } from '../../../core/case/follow-ups';
import { FOLLOW_UP_CAUTION } from '../../../core/followup/caution';
import { followUpCourse, recoveryText } from '../../../core/followup/course';
import { readBackToUsual, readChannel, readHours, readScore, readTestDay, type Field } from '../../../core/followup/fields';
import { CHANNEL_LABELS, DEFAULT_DOMAINS, FOLLOW_UP_VERSION, hoursText, type FollowUpReport } from '../../../core/followup/report';
import { Chart } from '../charts/Chart';
import { recoveryCharts } from '../charts/recovery-charts';
import type { EngineView } from '../engine/protocol';
import { Caution } from '../ui/notices';

export type FollowUpRequest =
  | { readonly type: 'follow-up'; readonly report: FollowUpReport; readonly reason: string }
  | { readonly type: 'follow-up-correction'; readonly seq: number; readonly report: FollowUpReport | null; readonly reason: string };

interface Props {
  readonly view: EngineView<Comparison>;
  /** Sends the request to the worker; true once it is recorded and on screen (false: the shell shows why). */
  readonly onSubmit: (request: FollowUpRequest) => Promise<boolean>;
}

interface Draft {
  test: string;
  hours: string;
  by: string;
  how: string;
  usual: string;
  scores: Record<string, string>;
  otherDomain: string;
  otherScore: string;
  note: string;
  reason: string;
}

const EMPTY: Draft = { test: '1', hours: '', by: 'the person', how: 'phone', usual: '', scores: {}, otherDomain: '', otherScore: '', note: '', reason: '' };

function draftOf(report: FollowUpReport): Draft {
  return {
    test: String(report.day),
    hours: String(report.afterTestH),
    by: report.reportedBy,
    how: report.channel,
    usual: report.backToUsual ? 'yes' : 'no',
    scores: Object.fromEntries(report.ratings.map((r) => [r.domain, r.score === null ? '' : String(r.score)])),
    otherDomain: '',
    otherScore: '',
    note: report.note,
    reason: '',
  };
}

type Problem = { field: string; message: string };

function reportOf(draft: Draft, domains: readonly string[]): { report: FollowUpReport } | Problem {
  const read = <T,>(field: string, label: string, f: Field<T>): T | Problem => (f.ok ? f.value : { field, message: `${label}: expected ${f.expected}.` });
  const isProblem = (v: unknown): v is Problem => typeof v === 'object' && v !== null && 'field' in v && 'message' in v;
  const day = read('test', 'Test', readTestDay(draft.test));
  if (isProblem(day)) return day;
  const hours = read('hours', 'Hours after the test', readHours(draft.hours));
  if (isProblem(hours)) return hours;
  if (!draft.by.trim()) return { field: 'by', message: "Reported by: expected who gave the account, e.g. 'the person'." };
  const channel = read('how', 'How', readChannel(draft.how));
  if (isProblem(channel)) return channel;
  const usual = read('usual', 'Back to usual state', readBackToUsual(draft.usual));
  if (isProblem(usual)) return usual;
  const ratings = [];
  for (const domain of domains) {
    const score = read(`score-${domain}`, domain, readScore(draft.scores[domain] ?? ''));
    if (isProblem(score)) return score;
    if (score !== null) ratings.push({ domain, score });
  }
  const other = draft.otherDomain.trim().toLowerCase();
  if (other) {
    if (domains.includes(other)) return { field: 'other-domain', message: `${other} is already listed; rate it in its own box.` };
    const score = read('other-score', other, readScore(draft.otherScore));
    if (isProblem(score)) return score;
    if (score !== null) ratings.push({ domain: other, score });
  }
  return { report: { version: FOLLOW_UP_VERSION, day, afterTestH: hours, reportedBy: draft.by.trim(), channel, backToUsual: usual, ratings, note: draft.note.trim() } };
}

export function RecoveryCalls({ view, onSubmit }: Props) {
  const items = useMemo(() => followUpsOf(view.log), [view.log]);
  const course = useMemo(() => followUpCourse(items), [items]);
  const charts = useMemo(() => recoveryCharts(course), [course]);
  const domains = useMemo(() => [...DEFAULT_DOMAINS, ...course.domains.filter((d) => !DEFAULT_DOMAINS.includes(d))], [course]);
  const [draft, setDraft] = useState<Draft>(EMPTY);
  const [correcting, setCorrecting] = useState<number | null>(null);
  const [problem, setProblem] = useState<Problem | null>(null);
  const [sending, setSending] = useState(false);
  const form = useRef<HTMLFormElement>(null);
  const focus = (field: string) => form.current?.querySelector<HTMLInputElement>(`[data-field="${CSS.escape(field)}"]`)?.focus();

  useEffect(() => focus('test'), []);

  const set = (patch: Partial<Draft>) => setDraft((d) => ({ ...d, ...patch }));
  const startCorrection = (seq: number) => {
    const item = items.find((i) => i.seq === seq);
    if (!item?.report) return;
    setDraft(draftOf(item.report));
    setCorrecting(seq);
    setProblem(null);
    setTimeout(() => focus('hours'), 0);
  };
  const cancel = () => {
    setCorrecting(null);
    setDraft(EMPTY);
    setProblem(null);
    setTimeout(() => focus('test'), 0);
  };

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    if (sending) return;
    const read = reportOf(draft, domains);
    if ('field' in read) {
      setProblem(read);
      return focus(read.field);
    }
    if (correcting !== null && !draft.reason.trim()) {
      setProblem({ field: 'reason', message: 'Reason: a correction needs a reason; it is kept in the log and printed in the report.' });
      return focus('reason');
    }
    setProblem(null);
    setSending(true);
    const reason = draft.reason.trim() || 'Follow-up report, recorded as given.';
    const recorded = await onSubmit(correcting === null ? { type: 'follow-up', report: read.report, reason } : { type: 'follow-up-correction', seq: correcting, report: read.report, reason });
    setSending(false);
    // Refused (the shell shows why): the typed entry stays in the form.
    if (!recorded) return;
    setCorrecting(null);
    setDraft({ ...EMPTY, test: draft.test, by: draft.by, how: draft.how });
    setTimeout(() => focus('hours'), 0);
  };

  const strike = async (seq: number) => {
    const reason = window.prompt(`Why is the follow-up in entry ${seq} struck out? (kept in the log)`)?.trim();
    if (reason) await onSubmit({ type: 'follow-up-correction', seq, report: null, reason });
  };

  const box = (field: string, label: string, value: string, onChange: (v: string) => void, hint: string, size = 6) => (
    <label className={problem?.field === field ? 'fu-field invalid' : 'fu-field'}>
      <span>{label}</span>
      <input data-field={field} aria-label={label} value={value} size={size} onChange={(e) => onChange(e.target.value)} aria-invalid={problem?.field === field} />
      <small>{hint}</small>
    </label>
  );

  return (
    <div className="recovery">
      <Caution />
      <aside className="caution" role="note" aria-label="Symptom reports">
        <strong>Reported, not measured.</strong> {FOLLOW_UP_CAUTION}
      </aside>
      <section className="panel" aria-label="Recovery after each test">
        <h2>Recovery after each test</h2>
        <table className="values" data-testid="recovery-summary">
          <tbody>
            {[course.day1, course.day2].map((d) => (
              <tr key={d.day} data-testid={`recovery-day${d.day}`}>
                <th>After the day {d.day} test</th>
                <td>{recoveryText(d.recovery)}</td>
                <td>{d.reports.length} follow-up{d.reports.length === 1 ? '' : 's'}</td>
              </tr>
            ))}
          </tbody>
        </table>
        {charts.length > 0 && (
          <div className="fu-charts">
            {charts.map((c) => (
              <Chart key={c.domain} data={c.data} layout={c.layout} label={`${c.domain} ratings after each test`} testId={`fu-chart-${c.domain}`} />
            ))}
          </div>
        )}
        {charts.length > 0 && <p className="hint">Day 1 solid, day 2 dashed; a dotted line marks the follow-up at which the person reported being back to their usual state.</p>}
      </section>
      <section className="panel" aria-label="Follow-up entry">
        <h2>{correcting === null ? 'New follow-up' : `Correcting the follow-up in entry ${correcting}`}</h2>
        <form ref={form} onSubmit={submit} onKeyDown={(e) => e.key === 'Escape' && correcting !== null && cancel()} data-testid="follow-up-form">
          <div className="fu-row">
            {box('test', 'Test', draft.test, (v) => set({ test: v }), '1 or 2', 2)}
            {box('hours', 'Hours after', draft.hours, (v) => set({ hours: v }), '22, 3d', 6)}
            {box('by', 'Reported by', draft.by, (v) => set({ by: v }), 'who spoke', 14)}
            {box('how', 'How', draft.how, (v) => set({ how: v }), 'p phone, i in person, f form', 9)}
            {box('usual', 'Back to usual?', draft.usual, (v) => set({ usual: v }), 'y / n', 4)}
          </div>
          <div className="fu-row">
            {domains.map((d) => box(`score-${d}`, d, draft.scores[d] ?? '', (v) => set({ scores: { ...draft.scores, [d]: v } }), '0–10, empty: not asked', 3))}
            {box('other-domain', 'Other domain', draft.otherDomain, (v) => set({ otherDomain: v }), 'the lab’s own', 12)}
            {box('other-score', 'Its rating', draft.otherScore, (v) => set({ otherScore: v }), '0–10', 3)}
          </div>
          <div className="fu-row">
            {box('note', 'Note', draft.note, (v) => set({ note: v }), 'as said or written', 48)}
            {box('reason', correcting === null ? 'Reason (optional)' : 'Reason for the correction', draft.reason, (v) => set({ reason: v }), correcting === null ? 'e.g. scheduled call' : 'required', 28)}
          </div>
          {problem && (
            <p className="fu-problem" role="alert" data-testid="follow-up-problem">
              {problem.message}
            </p>
          )}
          <button type="submit" data-testid="record-follow-up" disabled={sending}>
            {correcting === null ? 'Record (Enter)' : 'Record correction (Enter)'}
          </button>
          {correcting !== null && (
            <button type="button" className="quiet" onClick={cancel}>
              Cancel (Esc)
            </button>
          )}
        </form>
      </section>
      <section className="panel" aria-label="Follow-ups recorded">
        <h2>Follow-ups recorded</h2>
        {items.length === 0 ? (
          <p className="hint">None yet.</p>
        ) : (
          <table className="values" data-testid="follow-up-table">
            <thead>
              <tr>
                <th>#</th>
                <th>Test</th>
                <th>After</th>
                <th>Reported by, how</th>
                <th>Usual state</th>
                <th>Ratings</th>
                <th>Note; corrections</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {items.map((i) => {
                const r = i.report ?? i.original;
                return (
                  <tr key={i.seq} data-testid={`follow-up-${i.seq}`} className={i.report ? undefined : 'struck'}>
                    <td>{i.seq}</td>
                    <td>day {r.day}</td>
                    <td>{hoursText(r.afterTestH)}</td>
                    <td>
                      {r.reportedBy}, {CHANNEL_LABELS[r.channel]}
                    </td>
                    <td>{i.report ? (r.backToUsual ? 'back' : 'not back') : 'struck out'}</td>
                    <td>{r.ratings.map((x) => `${x.domain} ${x.score ?? '–'}`).join(', ')}</td>
                    <td>{[r.note, ...i.corrections.map((c) => `${c.struck ? 'struck out' : 'corrected'} in entry ${c.seq} by ${c.who}: ${c.reason}`)].filter(Boolean).join(' · ')}</td>
                    <td>
                      {i.report && (
                        <>
                          <button type="button" className="quiet" onClick={() => startCorrection(i.seq)}>
                            Correct
                          </button>
                          <button type="button" className="quiet" onClick={() => void strike(i.seq)}>
                            Strike out
                          </button>
                        </>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}
