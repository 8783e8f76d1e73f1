/**
 * Development data for the threshold interval's calibration: one JSON line per test and
 * threshold with the consensus's log error against the truth and the features the interval can
 * see (bootstrap SD, between-method SD, methods found, where the threshold sits in the ramp).
 * Development seeds only (detection grids from 5000, day-2 pairs from 9000 / 49000).
 * Run: npx tsx tests/validation/interval-dump.ts [seedsPerCell] [pairs] > dev.jsonl
 */
import { analyzeTest, noClinicalInputs } from '../../core/analyze/analyze-test';
import type { TestAnalysis } from '../../core/model/analysis';
import type { BreathTable } from '../../core/model/breath-table';
import { DEFAULT_SETTINGS } from '../../core/model/settings';
import { findThresholds } from '../../core/thresholds/find-thresholds';
import { measurementSd } from '../../core/compare/measurement';
import { generateTest } from '../../sample-tests/generator';
import { generateKineticTest } from '../../sample-tests/kinetic-family';
import { DEVELOPMENT_FIRST_SEED, hardCases, mainCases } from './cases';
import { pairParams, pairParamsB } from './day2-pairs';
import { familyBCases } from './family-b';
import { family1, type TruthCase } from './measure';

interface Truth {
  readonly vt1: { vo2MlMin: number; workW: number | null };
  readonly vt2: { vo2MlMin: number; workW: number | null };
}

function record(set: string, condition: string, seed: number, table: BreathTable, truth: Truth, extra: Record<string, unknown> = {}): void {
  const a: TestAnalysis = analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs());
  const parts = findThresholds(a.series, a.phases, DEFAULT_SETTINGS);
  const inc0 = a.phases.incrementalStartS;
  const incS = a.phases.incrementalEndS - inc0;
  for (const id of ['vt1', 'vt2'] as const) {
    const r = a[id];
    const p = parts[id].ciParts;
    const t = truth[id];
    if (!r.at || !p) {
      console.log(JSON.stringify({ set, condition, seed, id, found: false, ...extra }));
      continue;
    }
    const c = r.at.vo2MlMin;
    const vo2Sd = measurementSd(a, id === 'vt1' ? 'vt1_vo2' : 'vt2_vo2').sd;
    const workSd = measurementSd(a, id === 'vt1' ? 'vt1_work' : 'vt2_work').sd;
    const found = r.methods.filter((m) => m.found).map((m) => m.vo2MlMin);
    console.log(
      JSON.stringify({
        set,
        condition,
        seed,
        id,
        found: true,
        tv: t.vo2MlMin,
        fv: c,
        tw: t.workW,
        fw: r.at.workW,
        e: Math.log(c / t.vo2MlMin),
        ew: t.workW && r.at.workW && r.at.workW > 0 ? Math.log(r.at.workW / t.workW) : null,
        boot: p.bootSdMlMin / c,
        meth: p.methodSdMlMin / c,
        nFound: found.length,
        methLog: found.map((v) => Math.log(v / c)),
        tFromStartS: r.at.timeS - inc0,
        incS,
        vo2Sd,
        workSd,
        ...extra,
      }),
    );
  }
}

const k = Number(process.argv[2] ?? 2);
const nPairs = Number(process.argv[3] ?? 40);
const grid: [string, TruthCase[]][] = [
  ['f1', family1([...mainCases(k, DEVELOPMENT_FIRST_SEED), ...hardCases(k, DEVELOPMENT_FIRST_SEED)])],
  ['B', familyBCases('development', k * 12)],
];
for (const [set, cases] of grid) {
  for (const c of cases) {
    const g = c.generate();
    record(set, c.condition, c.seed, g.table, g, { noise: c.noiseScale, modality: c.modality });
  }
}
for (const kind of ['null', 'decline'] as const) {
  for (let seed = 9000 + (kind === 'null' ? 0 : 300); seed < 9000 + (kind === 'null' ? 0 : 300) + nPairs; seed++) {
    const [p1, p2] = pairParams(seed, kind);
    try {
      const g1 = generateTest(p1, 2 * seed);
      const g2 = generateTest(p2, 2 * seed + 1);
      record('pairA', 'main', seed, g1.table, g1.truth, { kind, day: 1 });
      record('pairA', 'main', seed, g2.table, g2.truth, { kind, day: 2 });
    } catch {
      // a seed the model cannot simulate
    }
  }
  let done = 0;
  for (let seed = 49000 + (kind === 'null' ? 0 : 300); done < nPairs; seed++) {
    const [p1, p2] = pairParamsB(seed, kind);
    try {
      const g1 = generateKineticTest(p1, 2 * seed);
      const g2 = generateKineticTest(p2, 2 * seed + 1);
      record('pairB', 'main', seed, g1.table, g1.truth, { kind, day: 1 });
      record('pairB', 'main', seed, g2.table, g2.truth, { kind, day: 2 });
      done++;
    } catch {
      // skipped
    }
  }
}
