/**
 * Breakpoints: one day's thresholds as core found them, with the evidence behind each
 * method, and the reviewer's controls: click a chart or type a time or VO2 to move VT1 or
 * VT2 (a reason is required), withdraw an override. Every value shown comes from the view
 * the worker returned; nothing here estimates anything.
 */
import { useMemo, useState } from 'react';
import type { ThresholdId, ValuesAt } from '../../../core/model/analysis';
import type { ActiveOverride, OverrideKey } from '../../../core/case/overrides';
import type { Comparison } from '../../../core/compare/compare-tests';
import type { EngineView } from '../engine/protocol';
import { Chart } from '../charts/Chart';
import { endTidalChart, equivalentsChart, vSlopeChart } from '../charts/threshold-charts';
import { DAY_COLOUR, THRESHOLD_COLOUR } from '../charts/palette';
import { Caution, placeOf } from '../ui/notices';
import { clock, fmt, parseClock, prose } from '../ui/format';
import { ReviewerMark } from '../ui/reviewer-mark';

interface Props {
  readonly view: EngineView<Comparison>;
  /** The view the charts draw: the values' view once its values are painted (App.tsx); the values' own view when absent. */
  readonly chartsView?: EngineView<Comparison> | null;
  readonly day: 1 | 2;
  readonly onDay: (day: 1 | 2) => void;
  readonly onSet: (day: 1 | 2, threshold: ThresholdId, givenAs: 'time' | 'vo2', value: number, reason: string) => Promise<void>;
  readonly onWithdraw: (seq: number, reason: string) => Promise<void>;
  readonly active: ReadonlyMap<OverrideKey, ActiveOverride>;
  readonly renderMs: { readonly revision: number; readonly replyMs: number; readonly valuesMs: number; readonly chartsMs: number | null } | null;
}

function ValuesRow({ label, at }: { label: string; at: ValuesAt | null }) {
  return (
    <>
      <td>{label}</td>
      <td data-time-s={at ? Math.round(at.timeS) : undefined}>{clock(at?.timeS)}</td>
      <td>{fmt(at?.vo2MlMin, 0, 'mL/min')}</td>
      <td>{fmt(at?.vo2MlKgMin, 1, 'mL/kg/min')}</td>
      <td>{fmt(at?.pctPeakVo2, 0, '%')}</td>
      <td>{fmt(at?.workW, 0, 'W')}</td>
      <td>{fmt(at?.hrBpm, 0, 'bpm')}</td>
      <td>{fmt(at?.rer, 2)}</td>
    </>
  );
}

export function Breakpoints({ view, chartsView, day, onDay, onSet, onWithdraw, active, renderMs }: Props) {
  const outcome = day === 1 ? view.day1 : view.day2;
  const drawn = chartsView ?? view;
  const chartDay = day === 1 ? drawn.day1 : drawn.day2;
  const a = outcome.analysis;
  const [threshold, setThreshold] = useState<ThresholdId>('vt1');
  const [givenAs, setGivenAs] = useState<'time' | 'vo2'>('time');
  const [value, setValue] = useState('');
  const [reason, setReason] = useState('');
  const [withdrawReason, setWithdrawReason] = useState<Record<number, string>>({});

  const charts = useMemo(() => ({ vslope: vSlopeChart(chartDay), eq: equivalentsChart(chartDay), et: endTidalChart(chartDay) }), [chartDay]);
  const pick = (as: 'time' | 'vo2') => (x: number) => {
    setGivenAs(as);
    setValue(as === 'time' ? clock(x) : String(Math.round(x)));
  };

  const apply = async () => {
    const number = givenAs === 'time' ? (parseClock(value) ?? Number.NaN) : Number(value.replace(',', '.'));
    if (!Number.isFinite(number) || reason.trim() === '') return;
    await onSet(day, threshold, givenAs, number, reason.trim());
    setReason('');
  };

  const notes = day === 1 ? view.notes.day1 : view.notes.day2;
  const meta = a.metadata;
  const overridesHere = [...active.values()].filter((o) => o.day === day);

  return (
    <div className="breakpoints">
      <div className="day-switch" role="tablist" aria-label="Day under review">
        {([1, 2] as const).map((d) => (
          <button key={d} type="button" role="tab" aria-selected={d === day} className={d === day ? 'day-tab active' : 'day-tab'} style={{ borderColor: DAY_COLOUR[d] }} onClick={() => onDay(d)}>
            <span className="chip" style={{ background: DAY_COLOUR[d] }} aria-hidden="true" /> Day {d}: {(d === 1 ? view.day1 : view.day2).analysis.sourceName}
          </button>
        ))}
        <span className="subject">
          Subject {meta.subjectId ?? '—'} · {fmt(meta.ageY, 0, 'y')} · {meta.sex ?? '—'} · {fmt(meta.heightCm, 0, 'cm')} · {fmt(meta.weightKg, 1, 'kg')} · {meta.modality ?? 'modality not stated'}
        </span>
      </div>
      <Caution />
      {(notes.warnings.length > 0 || notes.rejected.length > 0 || a.warnings.length > 0) && (
        <details className="import-notes">
          <summary>
            Import and analysis notes: {notes.warnings.length + a.warnings.length} remarks, {notes.rejected.length} rows not used, {notes.flagged} values flagged, {a.removedBreaths.length} breaths removed as outliers
          </summary>
          <ul>
            {[...notes.warnings, ...notes.rejected].map((w, i) => (
              <li key={i}>
                <span className="error-place">{placeOf(w)}:</span> {w.message}
              </li>
            ))}
            {a.warnings.map((w, i) => (
              <li key={`a${i}`}>{w}</li>
            ))}
          </ul>
        </details>
      )}
      <div className="bp-grid">
        <div className="charts">
          <Chart label={`V-slope plot, day ${day}`} testId="chart-vslope" className="square" data={charts.vslope.data} layout={charts.vslope.layout} onPick={pick('vo2')} />
          <Chart label={`Ventilatory equivalents, day ${day}`} testId="chart-equivalents" data={charts.eq.data} layout={charts.eq.layout} onPick={pick('time')} />
          <Chart label={`End-tidal pressures, day ${day}`} testId="chart-endtidal" data={charts.et.data} layout={charts.et.layout} onPick={pick('time')} />
        </div>
        <aside className="side">
          <section className="panel move" aria-label="Move a threshold">
            <h3>Move a threshold</h3>
            <p className="hint">Click a point on a chart, or type a value. The reason is recorded in the reviewer log.</p>
            <div className="radio-row">
              {(['vt1', 'vt2'] as const).map((id) => (
                <label key={id} style={{ color: THRESHOLD_COLOUR[id] }}>
                  <input type="radio" name="threshold" checked={threshold === id} onChange={() => setThreshold(id)} /> {id.toUpperCase()}
                </label>
              ))}
            </div>
            <div className="radio-row">
              <label>
                <input type="radio" name="givenAs" checked={givenAs === 'time'} onChange={() => setGivenAs('time')} /> time (m:ss)
              </label>
              <label>
                <input type="radio" name="givenAs" checked={givenAs === 'vo2'} onChange={() => setGivenAs('vo2')} /> VO₂ (mL/min)
              </label>
            </div>
            <label className="field">
              {givenAs === 'time' ? 'Time from start of recording (m:ss, or seconds)' : 'VO₂ (mL/min)'}
              <input data-testid="override-value" inputMode="decimal" value={value} onChange={(e) => setValue(e.target.value)} />
            </label>
            <label className="field">
              Reason (required)
              <textarea data-testid="override-reason" rows={2} value={reason} onChange={(e) => setReason(e.target.value)} />
            </label>
            <button type="button" className="primary" data-testid="override-apply" disabled={reason.trim() === '' || value.trim() === ''} onClick={() => void apply()}>
              Set day {day} {threshold.toUpperCase()}
            </button>
            {/* Measurements for the timing tests: kept out of sight and out of the accessibility tree. */}
            <p className="timing visually-hidden" data-testid="timing" data-revision={renderMs?.revision} aria-hidden="true">
              Recomputed in <span data-testid="worker-ms">{fmt(view.updateMs, 1)}</span> ms (analysis worker)
              {renderMs && (
                <>
                  {' '}
                  · reply in <span data-testid="reply-ms">{fmt(renderMs.replyMs, 1)}</span> ms · values on screen in <span data-testid="values-ms">{fmt(renderMs.valuesMs, 1)}</span> ms
                  {renderMs.chartsMs !== null && (
                    <>
                      {' '}
                      · charts redrawn in <span data-testid="charts-ms">{fmt(renderMs.chartsMs, 0)}</span> ms
                    </>
                  )}
                </>
              )}
            </p>
          </section>
          {overridesHere.length > 0 && (
            <section className="panel" aria-label="Overrides in force">
              <h3>Overrides in force</h3>
              <ul className="overrides">
                {overridesHere.map((o) => (
                  <li key={o.seq} data-testid={`override-${o.threshold}`}>
                    <strong>{o.threshold.toUpperCase()}</strong> at {clock(o.point.timeS)}, {fmt(o.point.vo2MlMin, 0, 'mL/min')} — entry {o.seq}, {o.who} ({o.role}): “{o.reason}”
                    <div className="withdraw">
                      <input aria-label={`Reason to withdraw entry ${o.seq}`} placeholder="reason to withdraw" value={withdrawReason[o.seq] ?? ''} onChange={(e) => setWithdrawReason((w) => ({ ...w, [o.seq]: e.target.value }))} />
                      <button type="button" disabled={!(withdrawReason[o.seq] ?? '').trim()} onClick={() => void onWithdraw(o.seq, (withdrawReason[o.seq] ?? '').trim())}>
                        Withdraw
                      </button>
                    </div>
                  </li>
                ))}
              </ul>
            </section>
          )}
        </aside>
      </div>
      <section className="panel">
        <h3>Thresholds as they stand</h3>
        <table className="values" data-testid={`thresholds-day${day}`}>
          <thead>
            <tr>
              <th>Threshold</th>
              <th>Source</th>
              <th>Time</th>
              <th>VO₂</th>
              <th>VO₂/kg</th>
              <th>% of peak VO₂</th>
              <th>Work</th>
              <th>HR</th>
              <th>RER</th>
              <th>Interval of VO₂ (automatic)</th>
              <th>Methods agree?</th>
            </tr>
          </thead>
          <tbody>
            {(['vt1', 'vt2'] as const).map((id) => {
              const state = outcome[id];
              return (
                <tr key={id} data-testid={`row-${id}`}>
                  <th scope="row" style={{ color: THRESHOLD_COLOUR[id] }}>
                    {id.toUpperCase()}
                    <ReviewerMark day={outcome} threshold={id} />
                  </th>
                  <ValuesRow label={state.override ? `reviewer (entry ${state.override.seq})` : state.automatic.at ? 'automatic consensus' : `not found: ${state.automatic.reason ?? ''}`} at={a[id].at} />
                  <td>{state.automatic.ci95Vo2MlMin ? `${fmt(state.automatic.ci95Vo2MlMin[0], 0)}–${fmt(state.automatic.ci95Vo2MlMin[1], 0, 'mL/min')} (${state.automatic.ciLabel ?? '95% interval'})` : '—'}</td>
                  <td>{state.automatic.methodsDisagree ? `no: spread ${fmt(state.automatic.spreadVo2MlMin, 0, 'mL/min')}` : `yes: spread ${fmt(state.automatic.spreadVo2MlMin, 0, 'mL/min')}`}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <h3>Each method&apos;s estimate</h3>
        <table className="values methods">
          <thead>
            <tr>
              <th>Threshold</th>
              <th>Method</th>
              <th>Time</th>
              <th>VO₂</th>
              <th>Source</th>
            </tr>
          </thead>
          <tbody>
            {(['vt1', 'vt2'] as const).flatMap((id) =>
              outcome[id].automatic.methods.map((m) => (
                <tr key={`${id}-${m.method}`}>
                  <td>{id.toUpperCase()}</td>
                  <td>{m.label}</td>
                  <td>{m.found ? clock(m.timeS) : `not found: ${m.reason}`}</td>
                  <td>{m.found ? fmt(m.vo2MlMin, 0, 'mL/min') : '—'}</td>
                  <td className="source">{m.source}</td>
                </tr>
              )),
            )}
          </tbody>
        </table>
      </section>
      <section className="panel two-col">
        <div>
          <h3>Peak values</h3>
          <table className="values">
            <tbody>
              <tr><th>VO₂ peak</th><td>{fmt(a.peak.vo2MlMin, 0, 'mL/min')} · {fmt(a.peak.vo2MlKgMin, 1, 'mL/kg/min')} · {fmt(a.peak.mets, 1, 'MET')}</td></tr>
              <tr><th>Work peak</th><td>{fmt(a.peak.workW, 0, 'W')}</td></tr>
              <tr><th>HR peak</th><td>{fmt(a.peak.hrBpm, 0, 'bpm')} (predicted max {fmt(a.predicted.hrMaxBpm, 0, 'bpm')})</td></tr>
              <tr><th>RER peak</th><td>{fmt(a.peak.rer, 2)}</td></tr>
              <tr><th>O₂ pulse peak</th><td>{fmt(a.peak.o2PulseMlBeat, 1, 'mL/beat')}</td></tr>
              <tr><th>VE peak</th><td>{fmt(a.peak.veLMin, 1, 'L/min')}</td></tr>
              <tr><th>VE/VCO₂ slope</th><td>{fmt(a.derived.veVco2Slope, 1)}</td></tr>
              <tr><th>OUES</th><td>{fmt(a.derived.oues, 0, 'mL/min per log₁₀(L/min)')}</td></tr>
              <tr><th>Incremental phase</th><td>{clock(a.peak.exerciseDurationS)}{a.phases.rampWPerMin !== null ? `, ramp ${fmt(a.phases.rampWPerMin, 1, 'W/min')}` : ''}</td></tr>
            </tbody>
          </table>
        </div>
        <div>
          <h3>
            Effort: <span data-testid={`effort-day${day}`}>{a.effort.verdict}</span>
          </h3>
          <table className="values">
            <tbody>
              {a.effort.criteria.map((c) => (
                <tr key={c.id}>
                  <th>{c.label}</th>
                  <td>{c.met === null ? 'not assessed' : c.met ? 'met' : 'not met'}</td>
                  <td>
                    {prose(c.valueText)}
                    {c.detail ? `, ${prose(c.detail)}` : ''} <span className="secondary">(rule: {prose(c.rule)})</span>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <ul className="reasons">
            {a.effort.reasons.map((r, i) => (
              <li key={i}>{r}</li>
            ))}
          </ul>
        </div>
      </section>
    </div>
  );
}
