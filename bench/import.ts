/**
 * Import speed: a 100,000-row breath file, read by readBreathText, against papaparse alone
 * splitting the same text into cells. Target (docs/performance.md): under 1 s, and at most
 * twice papaparse's time. Two layouts: our plain CSV, and a semicolon/decimal-comma export
 * with a metadata block, a units row and mm:ss time. Nine interleaved runs after a warm-up.
 */
import Papa from 'papaparse';
import { readBreathText } from '../core/import/read-table';
import { seededRandom } from '../core/math/random';
import { median } from '../core/math/stats';

const ROWS = 100_000;

function plainCsv(random: () => number): string {
  const lines = ['# subject_id: BENCH-1', '# weight_kg: 70', 'time_s,vo2_ml_min,vco2_ml_min,ve_l_min,hr_bpm,work_w,peto2_mmhg,petco2_mmhg,rr_per_min,vt_l'];
  let t = 0;
  for (let i = 0; i < ROWS; i++) {
    t += 1 + random() * 4;
    const vo2 = 300 + (i / ROWS) * 2500 + random() * 100;
    lines.push([t.toFixed(2), vo2.toFixed(0), (vo2 * (0.8 + random() * 0.3)).toFixed(0), (10 + vo2 / 40).toFixed(2), (70 + i / 1000).toFixed(0), ((i / ROWS) * 250).toFixed(0), (100 + random() * 10).toFixed(1), (35 + random() * 5).toFixed(1), (12 + random() * 20).toFixed(1), (0.5 + random()).toFixed(3)].join(','));
  }
  return `${lines.join('\n')}\n`;
}

function cartExport(random: () => number): string {
  const lines = ['Exercise laboratory export', 'Patient: BENCH-2', 'Weight: 70 kg', '', "Time;V'O2;V'CO2;V'E;HR;Load;PetO2;PetCO2;BF;VT", 'mm:ss;L/min;L/min;L/min;bpm;W;kPa;kPa;1/min;L'];
  let t = 0;
  const c = (x: number, d: number) => x.toFixed(d).replace('.', ',');
  for (let i = 0; i < ROWS; i++) {
    t += 1 + random() * 4;
    const tenths = Math.round(t * 10);
    const m = Math.floor(tenths / 600);
    const vo2 = 0.3 + (i / ROWS) * 2.5 + random() * 0.1;
    lines.push([`${String(m).padStart(2, '0')}:${c((tenths - m * 600) / 10, 1).padStart(4, '0')}`, c(vo2, 3), c(vo2 * 0.9, 3), c(10 + vo2 * 25, 2), String(70 + Math.floor(i / 1000)), String(Math.floor((i / ROWS) * 250)), c(13.5 + random(), 2), c(4.8 + random() * 0.5, 2), c(12 + random() * 20, 1), c(0.5 + random(), 3)].join(';'));
  }
  return `${lines.join('\r\n')}\r\n`;
}

interface Timing {
  /** Median wall-clock time, ms. */
  readonly wallMs: number;
  /** Median CPU time of this process (all its threads, garbage collection included), ms. */
  readonly cpuMs: number;
}

function measure(fn: () => void): { wall: number; cpu: number } {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  fn();
  const wall = performance.now() - t0;
  const c = process.cpuUsage(c0);
  return { wall, cpu: (c.user + c.system) / 1000 };
}

/**
 * Interleaved runs (a, b, a, b, ...) so both see the same machine load. CPU time is reported
 * beside wall time because the build machine is shared: other work inflates wall time, much
 * less the process's own CPU time.
 */
function timePair(a: () => void, b: () => void, runs = 9): { a: Timing; b: Timing } {
  a();
  b();
  const ra: { wall: number; cpu: number }[] = [];
  const rb: { wall: number; cpu: number }[] = [];
  for (let i = 0; i < runs; i++) {
    ra.push(measure(a));
    rb.push(measure(b));
  }
  const summary = (r: { wall: number; cpu: number }[]): Timing => ({ wallMs: median(r.map((x) => x.wall)), cpuMs: median(r.map((x) => x.cpu)) });
  return { a: summary(ra), b: summary(rb) };
}

export async function run(): Promise<string[]> {
  const lines: string[] = [];
  for (const [name, text, delimiter] of [
    ['plain CSV (comma, point decimals, s)', plainCsv(seededRandom(1)), ','],
    ['cart export (semicolon, decimal comma, mm:ss, units row, CRLF)', cartExport(seededRandom(2)), ';'],
  ] as const) {
    let breaths = 0;
    const t = timePair(
      () => {
        Papa.parse<string[]>(text, { delimiter, skipEmptyLines: false });
      },
      () => {
        const r = readBreathText(text, { sourceName: 'bench.csv' });
        if (!r.ok) throw new Error(r.error.message);
        breaths = r.value.table.breaths.length;
      },
    );
    lines.push(
      `- ${name}: ${ROWS.toLocaleString('en-US')} rows (${(text.length / 1e6).toFixed(1)} MB), ${breaths.toLocaleString('en-US')} breaths; ` +
        `import ${t.b.wallMs.toFixed(0)} ms wall / ${t.b.cpuMs.toFixed(0)} ms CPU, papaparse alone ${t.a.wallMs.toFixed(0)} ms wall / ${t.a.cpuMs.toFixed(0)} ms CPU (medians of 9); ` +
        `ratio ${(t.b.wallMs / t.a.wallMs).toFixed(2)} wall, ${(t.b.cpuMs / t.a.cpuMs).toFixed(2)} CPU`,
    );
  }
  return lines;
}
