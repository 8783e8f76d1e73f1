/**
 * The settings in words and units, as the methods page prints them: "VO₂ above 8,000 mL/min
 * is treated as implausible", not `import.implausible.vo2MaxMlMin 8000`. Raw keys stay in the
 * embedded case file. One sentence per entry of SETTING_SOURCES; a key this module does not
 * know yet (a setting added later) is printed with its key so nothing is hidden, and the
 * tests require every current key to have its sentence.
 */
import { EFFORT_OPTION_DEFAULTS, SETTING_SOURCES, type Settings } from '../model/settings';

export interface SettingLine {
  readonly key: string;
  readonly topic: string;
  readonly text: string;
  readonly source: string;
}

/** 8000 → "8,000"; 0.05 → "0.05". */
function n(value: number): string {
  const [whole, frac] = String(value).split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return frac ? `${grouped}.${frac}` : grouped;
}

type Phrase = { readonly topic: string; readonly text: (s: Settings) => string };

const HR_CRITERION_WORDS = {
  percent: (s: Settings) => `Peak HR counts as an effort criterion at ${n(s.effort.hrPctMin)} % or more of age-predicted HRmax`,
  'within-bpm': (s: Settings) => `Peak HR counts as an effort criterion within ${n(s.effort.hrWithinBpm ?? EFFORT_OPTION_DEFAULTS.hrWithinBpm)} bpm of age-predicted HRmax`,
  either: (s: Settings) => `Peak HR counts as an effort criterion at ${n(s.effort.hrPctMin)} % or more of age-predicted HRmax, or within ${n(s.effort.hrWithinBpm ?? EFFORT_OPTION_DEFAULTS.hrWithinBpm)} bpm of it`,
  off: () => 'The peak-HR effort criterion is switched off (e.g. beta-blockade)',
} as const;

const PHRASES: Readonly<Record<string, Phrase>> = {
  'import.implausible.vo2MaxMlMin': { topic: 'Import', text: (s) => `VO₂ above ${n(s.import.implausible.vo2MaxMlMin)} mL/min is treated as implausible` },
  'import.implausible.hrMinBpm': { topic: 'Import', text: (s) => `HR below ${n(s.import.implausible.hrMinBpm)} bpm is treated as implausible` },
  'import.implausible.hrMaxBpm': { topic: 'Import', text: (s) => `HR above ${n(s.import.implausible.hrMaxBpm)} bpm is treated as implausible` },
  'import.implausible.rerMin': { topic: 'Import', text: (s) => `RER below ${n(s.import.implausible.rerMin)} is treated as implausible` },
  'import.implausible.rerMax': { topic: 'Import', text: (s) => `RER above ${n(s.import.implausible.rerMax)} is treated as implausible` },
  'import.rerMismatch': { topic: 'Import', text: (s) => `A file's RER column differing from VCO₂/VO₂ by more than ${n(s.import.rerMismatch)} raises a warning` },
  'clean.outliers': {
    topic: 'Cleaning',
    text: (s) =>
      s.clean.outliers.kind === 'none'
        ? 'No breaths are removed as outliers'
        : `A breath is removed when it lies more than ${n(s.clean.outliers.limitSd)} standard deviations from the ${n(s.clean.outliers.windowBreaths)} breaths around it`,
  },
  'clean.averaging': {
    topic: 'Cleaning',
    text: (s) => {
      const a = s.clean.averaging;
      if (a.kind === 'rolling-time') return `Values are averaged over a rolling ${n(a.windowS)} s window`;
      if (a.kind === 'time-bins') return `Values are averaged in consecutive ${n(a.binS)} s bins`;
      return `Values are averaged over a rolling ${n(a.breaths)} breaths`;
    },
  },
  'clean.phases': {
    topic: 'Cleaning',
    text: (s) => {
      const { incrementalStartS: a, incrementalEndS: b } = s.clean.phases;
      if (a === null && b === null) return 'The incremental phase is found from the load (no boundary set by hand)';
      const at = (v: number | null, what: string) => (v === null ? `${what} found from the load` : `${what} set by hand at ${Math.floor(v / 60)}:${String(Math.round(v % 60)).padStart(2, '0')} (m:ss)`);
      return `${at(a, 'Start of the incremental phase')}; ${at(b, 'its end')}`;
    },
  },
  'thresholds.minPointsPerSegment': { topic: 'Thresholds', text: (s) => `A breakpoint needs at least ${n(s.thresholds.minPointsPerSegment)} averaged points on each side` },
  'thresholds.disagreementPct': { topic: 'Thresholds', text: (s) => `Methods are said to disagree when their VO₂ estimates span more than ${n(s.thresholds.disagreementPct)} % of the consensus` },
  'thresholds.bootstrap': { topic: 'Thresholds', text: (s) => `The 95 % interval comes from ${n(s.thresholds.bootstrap.replicates)} bootstrap refits (seed ${s.thresholds.bootstrap.seed}, so the same data give the same interval)` },
  'peaks.windowS': { topic: 'Peaks', text: (s) => `Peak values are the highest ${n(s.peaks.windowS)} s rolling mean` },
  'effort.rerMin': { topic: 'Effort', text: (s) => `Peak RER of ${s.effort.rerMin.toFixed(2)} or more meets the RER criterion` },
  'effort.plateauMlMin': { topic: 'Effort', text: (s) => `A VO₂ plateau is a rise below ${n(s.effort.plateauMlMin)} mL/min for a further rise in load (when body mass is unknown)` },
  'effort.plateauMlKgMin': { topic: 'Effort', text: (s) => `With body mass known, a plateau is a rise below ${n(s.effort.plateauMlKgMin)} mL/kg/min` },
  'effort.hrMaxFormula': { topic: 'Effort', text: (s) => (s.effort.hrMaxFormula === 'tanaka' ? 'Age-predicted HRmax is 208 − 0.7 × age' : 'Age-predicted HRmax is 220 − age') },
  'effort.hrPctMin': { topic: 'Effort', text: (s) => `The percentage form of the HR criterion is ${n(s.effort.hrPctMin)} % of age-predicted HRmax` },
  'effort.rpeMin': { topic: 'Effort', text: (s) => `A Borg 6–20 rating of ${n(s.effort.rpeMin)} or more meets the RPE criterion` },
  'effort.lactateMinMmolL': { topic: 'Effort', text: (s) => `Blood lactate of ${n(s.effort.lactateMinMmolL)} mmol/L or more meets the lactate criterion` },
  'effort.hrCriterion': { topic: 'Effort', text: (s) => HR_CRITERION_WORDS[s.effort.hrCriterion ?? EFFORT_OPTION_DEFAULTS.hrCriterion](s) },
  'effort.hrWithinBpm': { topic: 'Effort', text: (s) => `The "within" form of the HR criterion allows ${n(s.effort.hrWithinBpm ?? EFFORT_OPTION_DEFAULTS.hrWithinBpm)} bpm below age-predicted HRmax` },
  'effort.rule': {
    topic: 'Effort',
    text: (s) =>
      (s.effort.rule ?? EFFORT_OPTION_DEFAULTS.rule) === 'rer-alone'
        ? 'A test is maximal when the RER criterion is met (RER alone decides)'
        : 'A test is maximal when the RER criterion and at least one other criterion are met',
  },
  'compare.intervalHMin': { topic: 'Comparison', text: (s) => `Day 2 is expected at least ${n(s.compare.intervalHMin)} h after day 1` },
  'compare.intervalHMax': { topic: 'Comparison', text: (s) => `Day 2 is expected at most ${n(s.compare.intervalHMax)} h after day 1` },
  'compare.workloadStepW': { topic: 'Comparison', text: (s) => `Matched workloads are compared every ${n(s.compare.workloadStepW)} W` },
  'compare.bandKind': {
    topic: 'Comparison',
    text: (s) => (s.compare.bandKind === 'mdc95' ? 'A change counts when it lies beyond the minimal detectable change (MDC95)' : 'A change is set against ± one typical error (a description, not a decision limit)'),
  },
  'report.paper': { topic: 'Report', text: (s) => `Paper size ${s.report.paper === 'a4' ? 'A4' : 'US Letter'}` },
};

/** Keys of SETTING_SOURCES this module has a sentence for (for the tests). */
export const PHRASED_KEYS: readonly string[] = Object.keys(PHRASES);

function rawValue(settings: Settings, path: string): string {
  let value: unknown = settings;
  for (const key of path.split('.')) value = (value as Record<string, unknown>)?.[key];
  return JSON.stringify(value) ?? 'not set';
}

export function settingsInWords(settings: Settings): SettingLine[] {
  return Object.entries(SETTING_SOURCES).map(([key, source]) => {
    const phrase = PHRASES[key];
    if (!phrase) return { key, topic: 'Other', text: `Setting ${key}: ${rawValue(settings, key)}`, source };
    return { key, topic: phrase.topic, text: `${phrase.text(settings)}.`, source };
  });
}
