/**
 * The per-day clinical table: peak values beside what is predicted for the person, the
 * derived measures a clinician reads (METs, Weber class, ΔVO2/ΔWR, VE/VCO2 slope, OUES,
 * breathing reserve when MVV or FEV1 is given), the values at VT1 and the HR at VT1 beside
 * its labelled rules of thumb. Every number comes from the analysis as recomputed
 * (core/measures), and each row names its source; values marked (memory) were recalled, not
 * looked up, as core/measures says.
 */
import type { DayOutcome } from '../case/recompute';
import type { TestAnalysis } from '../model/analysis';
import type { HrMaxFormula } from '../model/settings';
import { fixed, minSec, MISSING } from './format';
import { MUTED, type Layout } from './layout';
import { reviewerMark, reviewerMarkNote } from './reviewer-mark';

type Row = readonly [string, string, string, string];

const WEBER = { A: '> 20', B: '16–20', C: '10–16', D: '< 10' } as const;

function withUnit(value: string, unit: string): string {
  return value === MISSING ? MISSING : `${value} ${unit}`;
}

function hrMaxText(formula: HrMaxFormula): string {
  return formula === 'tanaka' ? 'Tanaka et al., J Am Coll Cardiol 2001 (208 − 0.7 × age)' : 'Fox et al. 1971 (220 − age)';
}

/** The rows of the per-day table (exported for the tests). */
export function dayMeasureRows(day: DayOutcome): Row[] {
  const a: TestAnalysis = day.analysis;
  const { peak, derived, predicted, clinical } = a;
  const formula = a.provenance.settings.effort.hrMaxFormula;
  const rows: Row[] = [];
  const friend = predicted.friendVo2MlKgMin;
  const hansen = predicted.hansenVo2MlMin;
  rows.push(['Peak VO₂', `${fixed(peak.vo2MlMin, 0)} mL/min; ${withUnit(fixed(peak.vo2MlKgMin, 1), 'mL/kg/min')}`, `highest ${a.provenance.settings.peaks.windowS} s mean`, 'measured']);
  rows.push([
    'Peak VO₂, % predicted (FRIEND)',
    predicted.pctPredictedFriend === null ? MISSING : `${fixed(predicted.pctPredictedFriend, 0)} %`,
    friend === null ? 'needs age, sex, height, mass' : `predicted ${fixed(friend, 1)} mL/kg/min (SEE 6.6)`,
    'de Souza e Silva et al., Eur J Prev Cardiol 2018',
  ]);
  rows.push([
    'Peak VO₂, % predicted (Hansen/Wasserman)',
    predicted.pctPredictedHansen === null ? MISSING : `${fixed(predicted.pctPredictedHansen, 0)} %`,
    hansen === null ? 'needs age, sex, height, mass' : `predicted ${fixed(hansen, 0)} mL/min`,
    'Hansen et al., Am Rev Respir Dis 1984 (equation recalled, not looked up: memory)',
  ]);
  rows.push(['METs at peak', fixed(peak.mets, 1), 'VO₂/kg ÷ 3.5', 'common practice']);
  rows.push(['Weber class', derived.weberClass ?? MISSING, derived.weberClass ? `peak VO₂/kg ${WEBER[derived.weberClass]} mL/kg/min` : 'needs body mass', 'Weber et al., Circulation 1982']);
  rows.push(['Peak work', withUnit(fixed(peak.workW, 0), 'W'), `incremental phase ${minSec(peak.exerciseDurationS)} (m:ss)`, 'measured']);
  const hrPct = peak.hrBpm !== null && predicted.hrMaxBpm !== null ? (100 * peak.hrBpm) / predicted.hrMaxBpm : null;
  rows.push([
    'Peak HR',
    withUnit(fixed(peak.hrBpm, 0), 'bpm'),
    predicted.hrMaxBpm === null ? 'age not stated' : `${fixed(hrPct, 0)} % of predicted ${fixed(predicted.hrMaxBpm, 0)} bpm; reserve ${withUnit(fixed(derived.hrReserveBpm, 0), 'bpm')}`,
    hrMaxText(formula),
  ]);
  rows.push(['Peak RER', fixed(peak.rer, 2), 'VCO₂ ÷ VO₂', 'definition']);
  rows.push(['Peak O₂ pulse', withUnit(fixed(peak.o2PulseMlBeat, 1), 'mL/beat'), 'VO₂ ÷ HR', 'definition']);
  rows.push(['ΔVO₂/ΔWR', withUnit(fixed(derived.dVo2dWrMlMinW, 1), 'mL/min/W'), 'about 10 in healthy adults on a cycle ramp (8.5–11; memory)', 'ATS/ACCP 2003 (memory)']);
  rows.push(['VE/VCO₂ slope', fixed(derived.veVco2Slope, 1), 'normal below about 30 (memory)', 'ATS/ACCP 2003 (memory)']);
  rows.push(['OUES', withUnit(fixed(derived.oues, 0), 'mL/min per log₁₀(L/min)'), 'slope of VO₂ on log₁₀ VE', 'Baba et al., J Am Coll Cardiol 1996']);
  const mvvSource = clinical.mvvLMin !== null ? `MVV measured, ${fixed(clinical.mvvLMin, 0)} L/min` : clinical.fev1L !== null ? `MVV estimated as FEV1 ${fixed(clinical.fev1L, 2)} L × 40 = ${fixed(clinical.fev1L * 40, 0)} L/min` : null;
  rows.push([
    'Breathing reserve',
    derived.breathingReserveLMin === null ? 'not assessed' : `${fixed(derived.breathingReserveLMin, 0)} L/min (${fixed(derived.breathingReservePct, 0)} %)`,
    mvvSource === null ? 'needs MVV or FEV1 (not given)' : `${mvvSource}; peak VE ${fixed(peak.veLMin, 1)} L/min`,
    mvvSource !== null && clinical.mvvLMin === null ? 'MVV ≈ FEV1 × 40: common practice' : 'MVV − peak VE',
  ]);
  const vt1 = a.vt1.at;
  const mark = reviewerMark(day, 'vt1');
  rows.push([
    `At VT1${mark ? ` ${mark}` : ''}`,
    vt1 ? `${fixed(vt1.vo2MlMin, 0)} mL/min at ${minSec(vt1.timeS)} (m:ss)` : 'no VT1',
    vt1 ? `${withUnit(fixed(vt1.pctPeakVo2, 0), '% of peak VO₂')}; work ${withUnit(fixed(vt1.workW, 0), 'W')}` : MISSING,
    'typically 45–65 % of peak in untrained adults (memory)',
  ]);
  rows.push([`HR at VT1${mark ? ` ${mark}` : ''}`, vt1?.hrBpm != null ? `${fixed(vt1.hrBpm, 0)} bpm` : 'not available', 'measured on this test', 'measured fact, not a prescription']);
  const hrMax = predicted.hrMaxBpm;
  rows.push(['Rule of thumb: 55–60 % of age-predicted HRmax', hrMax === null ? 'age not stated' : `${fixed(0.55 * hrMax, 0)}–${fixed(0.6 * hrMax, 0)} bpm`, hrMax === null ? MISSING : `of ${fixed(hrMax, 0)} bpm`, 'rule of thumb for when no test exists: common practice']);
  const rest = clinical.restingHrBpm;
  rows.push(['Rule of thumb: resting HR + 15 bpm', rest === null ? 'resting HR not given' : `${fixed(rest + 15, 0)} bpm`, rest === null ? MISSING : `rest ${fixed(rest, 0)} bpm`, 'rule of thumb for when no test exists: common practice']);
  return rows;
}

export function dayMeasuresBlock(L: Layout, day: DayOutcome): void {
  L.subheading('Peak, predicted and derived values');
  L.table(
    [
      { header: 'Measure', width: 0.27 },
      { header: 'Value', width: 0.22 },
      { header: 'Reference or basis', width: 0.27 },
      { header: 'Source', width: 0.24 },
    ],
    dayMeasureRows(day),
    { size: 7.3 },
  );
  const note = reviewerMarkNote([day], ['vt1']);
  const tail = 'Rules of thumb are shown beside the measured HR at VT1 as labelled reference points; pacing advice is the clinician’s decision.';
  L.paragraph(note ? `${note} ${tail}` : tail, { size: 7, color: MUTED });
}
