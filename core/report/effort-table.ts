/**
 * The effort table of a day's page: each criterion with its value at the precision it is
 * judged at, the rule as applied in words and units (core/measures/effort.ts writes both),
 * whether it was met, and its source; then how the criteria combine into the verdict.
 * Thresholds a lab changed from the defaults are flagged, so a reader sees the lab's choice.
 */
import type { EffortAssessment } from '../model/analysis';
import { DEFAULT_SETTINGS, type Settings } from '../model/settings';
import { MUTED, type Layout } from './layout';

function metText(met: boolean | null): string {
  return met === null ? 'not assessed' : met ? 'met' : 'not met';
}

/** Which effort settings differ from the defaults, in words (empty when none). */
export function changedEffortSettings(effort: Settings['effort']): string[] {
  const d = DEFAULT_SETTINGS.effort;
  const out: string[] = [];
  if (effort.rerMin !== d.rerMin) out.push(`RER threshold ${effort.rerMin.toFixed(2)} (default ${d.rerMin.toFixed(2)})`);
  if (effort.hrPctMin !== d.hrPctMin) out.push(`HR ${effort.hrPctMin} % of predicted (default ${d.hrPctMin} %)`);
  if ((effort.hrCriterion ?? d.hrCriterion) !== d.hrCriterion) out.push(`HR criterion: ${effort.hrCriterion}`);
  if ((effort.hrWithinBpm ?? d.hrWithinBpm) !== d.hrWithinBpm) out.push(`HR within ${effort.hrWithinBpm} bpm (default ${d.hrWithinBpm})`);
  if ((effort.rule ?? d.rule) !== d.rule) out.push(`combination rule: ${effort.rule}`);
  if (effort.rpeMin !== d.rpeMin) out.push(`RPE ≥ ${effort.rpeMin} (default ${d.rpeMin})`);
  if (effort.plateauMlMin !== d.plateauMlMin || effort.plateauMlKgMin !== d.plateauMlKgMin) out.push(`plateau ${effort.plateauMlMin} mL/min or ${effort.plateauMlKgMin} mL/kg/min`);
  if (effort.lactateMinMmolL !== d.lactateMinMmolL) out.push(`lactate ≥ ${effort.lactateMinMmolL} mmol/L (default ${d.lactateMinMmolL})`);
  return out;
}

export function effortRows(effort: EffortAssessment): string[][] {
  return effort.criteria.map((c) => [c.label, c.detail ? `${c.valueText}; ${c.detail}` : c.valueText, c.rule, metText(c.met), c.source]);
}

export function effortBlock(L: Layout, effort: EffortAssessment, settings: Settings['effort']): void {
  L.subheading(`Effort: ${effort.verdict}`);
  L.table(
    [
      { header: 'Criterion', width: 0.17 },
      { header: 'Value', width: 0.15 },
      { header: 'Rule as applied', width: 0.3 },
      { header: 'Met', width: 0.09 },
      { header: 'Source', width: 0.29 },
    ],
    effortRows(effort),
    { size: 7.2 },
  );
  const changed = changedEffortSettings(settings);
  const lab = changed.length > 0 ? ` Set by the lab, differing from Twofold's defaults: ${changed.join('; ')}.` : '';
  L.paragraph(`Verdict rule: ${effort.combination}${lab}`, { size: 7.2, color: MUTED });
}
