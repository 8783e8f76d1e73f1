/**
 * Day 2 vs Day 1: the comparison exactly as core/compare produced it — the neutral summary,
 * pairing warnings, the metric table with each band, its source and the verdict (colour
 * and words), the matched-workload table, and overlays of both days.
 */
import { useMemo } from 'react';
import { bandStatement } from '../../../core/compare/bands';
import type { Comparison } from '../../../core/compare/compare-tests';
import { zeroWidth } from '../../../core/compare/change-interval';
import { isPrimary } from '../../../core/compare/findings';
import { matchedReadingText, type MatchedVariable } from '../../../core/compare/matched';
import type { EngineView } from '../engine/protocol';
import { Chart } from '../charts/Chart';
import { overlayCharts } from '../charts/overlay-charts';
import { verdictStyle } from '../charts/palette';
import { Caution } from '../ui/notices';
import { clock, fmt, prose, signed, signedClock } from '../ui/format';
import { ReviewerMark, thresholdOfMetric } from '../ui/reviewer-mark';

const MATCHED: readonly { key: MatchedVariable; label: string; unit: string; digits: number }[] = [
  { key: 'vo2MlMin', label: 'VO₂', unit: 'mL/min', digits: 0 },
  { key: 'hrBpm', label: 'HR', unit: 'bpm', digits: 0 },
  { key: 'veLMin', label: 'VE', unit: 'L/min', digits: 1 },
  { key: 'rer', label: 'RER', unit: '', digits: 2 },
  { key: 'veVco2', label: 'VE/VCO₂', unit: '', digits: 1 },
];

const KIND_LABEL = { step: 'common step', vt1_day1: 'day-1 VT1 workload', vt1_day2: 'day-2 VT1 workload' } as const;

export function DayOver({ view }: { view: EngineView<Comparison> }) {
  const c = view.comparison;
  const charts = useMemo(() => overlayCharts(view.day1.analysis, view.day2.analysis), [view]);
  const digitsOf = (unit: string) => (unit === 'mL/min' || unit === 'W' || unit === 'bpm' || unit === 's' ? 0 : unit === '' ? 2 : 1);
  return (
    <div className="dayover">
      <Caution />
      <section className="panel summary">
        <h2>Summary</h2>
        {c.refusals.length > 0 && (
          <ul className="warnings" data-testid="pair-refused">
            {c.refusals.map((r) => (
              <li key={r.code} className="hard">
                Not compared: {r.message}
              </li>
            ))}
          </ul>
        )}
        <p data-testid="comparison-summary">{prose(c.summary)}</p>
        <p className="hint">
          {bandStatement(c.band)}
          {c.pairing.intervalH !== null && ` Interval between the tests: ${fmt(c.pairing.intervalH, 1, 'h')}.`}
        </p>
        {c.pairing.warnings.length > 0 && (
          <ul className="warnings">
            {c.pairing.warnings.map((w) => (
              <li key={w.code} className={w.severity}>
                {w.severity === 'hard' ? 'Serious: ' : 'Note: '}
                {w.message}
              </li>
            ))}
          </ul>
        )}
      </section>
      <section className="panel">
        <h2>Metrics</h2>
        <table className="values metrics" data-testid="metric-table">
          <thead>
            <tr>
              <th>Metric</th>
              <th>Day 1</th>
              <th>Day 2</th>
              <th>Change</th>
              <th>Change %</th>
              <th>Change interval %</th>
              <th>Reproduced range %</th>
              <th>Call</th>
              <th>Band source</th>
            </tr>
          </thead>
          <tbody>
            {(c.refusals.length > 0 ? [] : c.metrics).map((m) => {
              const style = verdictStyle(m.verdict, m.adverseBeyondBand);
              const d = digitsOf(m.unit);
              return (
                <tr key={m.id} data-metric={m.id}>
                  <th scope="row">
                    {m.label}
                    {m.unit && m.unit !== 's' && <span className="unit"> ({m.unit})</span>}
                    {m.unit === 's' && <span className="unit"> (m:ss)</span>}
                    {m.effortCheck && <span className="tag">effort check</span>}
                    {isPrimary(m.id) && <span className="tag">primary</span>}
                  </th>
                  <td>
                    {m.unit === 's' ? clock(m.day1) : fmt(m.day1, d)}
                    <ReviewerMark day={view.day1} threshold={thresholdOfMetric(m.id)} />
                  </td>
                  <td>
                    {m.unit === 's' ? clock(m.day2) : fmt(m.day2, d)}
                    <ReviewerMark day={view.day2} threshold={thresholdOfMetric(m.id)} />
                  </td>
                  <td>{m.unit === 's' ? signedClock(m.delta) : signed(m.delta, d, m.unit)}</td>
                  <td>{signed(m.deltaPct, 1, '%')}</td>
                  <td>{m.interval ? (zeroWidth(m.interval) ? `none (${zeroWidth(m.interval)})` : `${signed(m.interval.lowPct, 1, '')} to ${signed(m.interval.highPct, 1, '%')}`) : '—'}</td>
                  <td>{m.band ? `${signed(m.band.lowPct, 1, '')} to ${signed(m.band.highPct, 1, '%')}` : '—'}</td>
                  <td className="verdict" data-verdict={m.verdict} title={m.reason}>
                    <span className="chip" style={{ background: style.colour }} aria-hidden="true" /> {style.words}
                  </td>
                  <td className="source">{m.band ? `${m.band.origin}: ${m.band.source}` : m.reason}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </section>
      <section className="panel">
        <h2>Matched workloads</h2>
        {c.matched.available && (
          <p className="hint" data-testid="matched-reading">
            {prose(matchedReadingText(c.matched.windowW))}
          </p>
        )}
        {c.matched.available ? (
          <table className="values matched" data-testid="matched-table">
            <thead>
              <tr>
                <th>Work (W)</th>
                {MATCHED.map((v) => (
                  <th key={v.key} colSpan={3}>
                    {v.label}
                    {v.unit && ` (${v.unit})`}: day 1 · day 2 · change %
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {c.matched.rows.map((r, i) => (
                <tr key={i} className={r.kind === 'step' ? '' : 'vt1-row'}>
                  <th scope="row">
                    {fmt(r.workW, 0, 'W')}
                    {r.kind !== 'step' && <span className="tag">{KIND_LABEL[r.kind]}</span>}
                  </th>
                  {MATCHED.flatMap((v) => [
                    <td key={`${v.key}1`}>{fmt(r.values[v.key].day1, v.digits)}</td>,
                    <td key={`${v.key}2`}>{fmt(r.values[v.key].day2, v.digits)}</td>,
                    <td key={`${v.key}p`}>{signed(r.values[v.key].deltaPct, 1, '%')}</td>,
                  ])}
                </tr>
              ))}
            </tbody>
          </table>
        ) : (
          <p className="hint">Not available: {c.matched.reason}</p>
        )}
      </section>
      <section className="panel overlays">
        <h2>Both days</h2>
        <div className="overlay-grid">
          {charts.map((chart) => (
            <Chart key={chart.id} label={chart.label} data={chart.data} layout={chart.layout} />
          ))}
        </div>
      </section>
    </div>
  );
}
