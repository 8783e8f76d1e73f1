/**
 * Building and signing the demo report (`twofold demo` in-process): import and analyse both
 * days, record the override and sign-off, save the case folder, build the PDF with its charts,
 * and sign it with a fresh demonstration certificate. First run (cold: modules, JIT, caches
 * empty) and the median of the next runs (warm). Target: under 2 s.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runDemo } from '../host/demo-job';

async function once(): Promise<{ ms: number; cpuMs: number; bytes: number }> {
  const dir = mkdtempSync(join(tmpdir(), 'twofold-bench-report-'));
  const cpu = process.cpuUsage();
  const t0 = performance.now();
  const r = await runDemo(dir, new Date());
  const ms = performance.now() - t0;
  const used = process.cpuUsage(cpu);
  if (!r.ok) throw new Error(r.error.message);
  return { ms, cpuMs: (used.user + used.system) / 1000, bytes: r.value.bytes };
}

export async function run(): Promise<string[]> {
  const cold = await once();
  const warm: { ms: number; cpuMs: number }[] = [];
  for (let i = 0; i < 5; i++) warm.push(await once());
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  return [
    `demo report, build + sign, first run: ${cold.ms.toFixed(0)} ms wall, ${cold.cpuMs.toFixed(0)} ms CPU (${cold.bytes} bytes)`,
    `demo report, build + sign, median of 5 warm runs: ${median(warm.map((w) => w.ms)).toFixed(0)} ms wall, ${median(warm.map((w) => w.cpuMs)).toFixed(0)} ms CPU`,
    `target: under 2000 ms`,
  ];
}
