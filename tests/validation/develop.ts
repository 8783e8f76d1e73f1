/**
 * Development runs for the threshold detectors, on the development seeds only
 * (DEVELOPMENT_FIRST_SEED and up, never the held-out seeds): summary per condition and each
 * method's own bias and spread, printed as markdown tables.
 * Run: npx tsx tests/validation/develop.ts [seedsPerCell] [main|hard|both]
 */
import { DEVELOPMENT_FIRST_SEED, hardCases, mainCases } from './cases';
import { byCondition, family1, measureAll, methodTable, summarise, SUMMARY_HEADER, summaryRow, type TruthCase } from './measure';
import { familyBCases } from './family-b';

const k = Number(process.argv[2] ?? 1);
const which = process.argv[3] ?? 'both';
const families = (process.argv[4] ?? '1,B').split(',');
const sets: [string, TruthCase[]][] = [];
for (const fam of families) {
  if (fam === '1') {
    if (which !== 'hard') sets.push(['family 1 main', family1(mainCases(k, DEVELOPMENT_FIRST_SEED))]);
    if (which !== 'main') sets.push(['family 1 hard', family1(hardCases(k, DEVELOPMENT_FIRST_SEED))]);
  } else if (fam === 'B') {
    const b = familyBCases('development', k * 12);
    if (b) {
      if (which !== 'hard') sets.push(['family B main', b.filter((c) => c.condition === 'main')]);
      if (which !== 'main') sets.push(['family B hard', b.filter((c) => c.condition === 'hard')]);
    }
  }
}
for (const [name, cases] of sets) {
  const t0 = Date.now();
  const results = measureAll(cases);
  console.log(`\n## ${name} (development seeds, ${cases.length} tests, ${((Date.now() - t0) / 1000).toFixed(0)} s)\n`);
  console.log(SUMMARY_HEADER);
  console.log(summaryRow('all', summarise(results)));
  for (const [key, s] of byCondition(results, (c) => c.protocol)) console.log(summaryRow(key, s));
  for (const [key, s] of byCondition(results, (c) => `noise ×${c.noiseScale}`)) console.log(summaryRow(key, s));
  console.log('');
  console.log(methodTable(results));
  if (process.env.WORST) {
    const worst = [...results].sort((a, b) => b.vt1ErrPct - a.vt1ErrPct).slice(0, Number(process.env.WORST) > 1 ? Number(process.env.WORST) : 6);
    for (const r of worst) console.log(`worst VT1 ${r.vt1SignedPct.toFixed(1)} % VT2 ${r.vt2SignedPct.toFixed(1)} %: ${r.c.label} seed ${r.c.seed}; ${Object.entries(r.methods).map(([m, v]) => `${m} ${v === null ? '—' : v.toFixed(1)}`).join(', ')}`);
  }
}

// Candidate VT1/VT2 consensus rules, formed from the methods' own errors (same truth, so the
// median of errors is the error of the median).
if (process.env.CAND) {
  const { median: med, quantile: q } = await import('../../core/math/stats');
  const subsets: Record<string, string[]> = {
    'vt1 all': ['vslope-ve', 'vslope', 'vslope-hinge', 've-vo2', 'excess-co2', 'peto2'],
    'vt1 ve+hinge+excess': ['vslope-ve', 'vslope-hinge', 'excess-co2'],
    'vt1 ve+hinge': ['vslope-ve', 'vslope-hinge'],
    'vt1 ve+hinge+vevo2': ['vslope-ve', 'vslope-hinge', 've-vo2'],
    'vt1 ve+hinge+excess+vevo2': ['vslope-ve', 'vslope-hinge', 'excess-co2', 've-vo2'],
    'vt1 ve only': ['vslope-ve'],
    'vt2 all': ['ve-vco2-ratio', 'petco2', 've-vs-vco2'],
    'vt2 ratio+vsvco2': ['ve-vco2-ratio', 've-vs-vco2'],
  };
  for (const [name, cases] of sets) {
    const results = measureAll(cases);
    console.log(`\n${name}`);
    for (const [cand, ms] of Object.entries(subsets)) {
      const id = cand.slice(0, 3);
      const errs = results.map((r) => {
        const v = ms.map((m) => r.methods[`${id} ${m}`]).filter((x): x is number => x !== null && x !== undefined);
        if (v.length) return med(v);
        const all = Object.entries(r.methods).filter(([k, x]) => k.startsWith(id) && x !== null).map(([, x]) => x as number);
        return all.length ? med(all) : 100;
      });
      const abs = errs.map(Math.abs);
      console.log(`${cand}: median ${med(abs).toFixed(1)} p95 ${q(abs, 0.95).toFixed(1)} bias ${med(errs).toFixed(1)}`);
    }
  }
}

if (process.env.ORACLE) {
  const { oracleSummary } = await import('./oracle');
  const s = oracleSummary(mainCases(k, DEVELOPMENT_FIRST_SEED));
  console.log(`\noracle (achievable reference, family 1 main, development): VT1 median ${s.median.toFixed(1)} %, p95 ${s.p95.toFixed(1)} %`);
}
