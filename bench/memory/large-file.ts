/**
 * A large breath-by-breath file for the memory measurements (bench/memory.ts and
 * tests/cli/memory-guard.test.ts): our plain CSV layout, 10 columns, written line by line to
 * disk so the writer itself stays small. It is generated at run time and never committed.
 *
 * The model (stated so the analysis has something to find): one long cycle ramp, work rising
 * linearly from 0 to 250 W over all rows; breath intervals 1–5 s; VO2 = 350 + 10·W mL/min;
 * VCO2 = 0.9·VO2 up to VT1 at 100 W, slope 1.3 above it; VE = 25·VCO2 (L/min per L/min) up to
 * VT2 at 180 W, slope 40 above it; HR 70 + 0.5·W bpm; uniform noise of a few percent on the
 * gases. At 1,000,000 rows the file is about 55 MB.
 */
import { openSync, writeSync, closeSync } from 'node:fs';
import { seededRandom } from '../../core/math/random';

export const LARGE_ROWS = 1_000_000;
const HEADER = 'time_s,vo2_ml_min,vco2_ml_min,ve_l_min,hr_bpm,work_w,peto2_mmhg,petco2_mmhg,rr_per_min,vt_l';

/**
 * Writes `rows` breaths to `path`; returns the file's size in bytes. `gasDecimals` sets the
 * decimals of VO2 and VCO2: a pair for a report is written with 0 and 1, because with a
 * million breaths the averaged values of two whole-number files coincide so often that the
 * pair check (core/compare/refusals.ts) would take them for one test loaded twice.
 */
export function writeLargeBreathFile(path: string, rows = LARGE_ROWS, seed = 1, gasDecimals = 0): number {
  const random = seededRandom(seed);
  const fd = openSync(path, 'w');
  let bytes = 0;
  const put = (s: string) => {
    bytes += writeSync(fd, s);
  };
  try {
    put(`# subject_id: LARGE-${seed}\n# age: 40\n# sex: F\n# height_cm: 168\n# weight_kg: 68\n# modality: cycle\n${HEADER}\n`);
    let t = 0;
    let chunk: string[] = [];
    for (let i = 0; i < rows; i++) {
      t += 1 + random() * 4;
      const w = (250 * i) / rows;
      const vo2 = (350 + 10 * w) * (0.97 + 0.06 * random());
      const vo2AtVt1 = 350 + 10 * 100;
      const vco2 = (w <= 100 ? 0.9 * vo2 : 0.9 * vo2AtVt1 + 1.3 * (vo2 - vo2AtVt1)) * (0.98 + 0.04 * random());
      const vco2AtVt2 = 0.9 * vo2AtVt1 + 1.3 * (350 + 1800 - vo2AtVt1);
      const ve = ((w <= 180 ? 25 * vco2 : 25 * vco2AtVt2 + 40 * (vco2 - vco2AtVt2)) / 1000) * (0.97 + 0.06 * random());
      const petco2 = w <= 180 ? 38 + random() * 2 : 38 - (w - 180) * 0.05 + random() * 2;
      const peto2 = w <= 100 ? 100 + random() * 3 : 100 + (w - 100) * 0.05 + random() * 3;
      const rr = 12 + w / 10 + random() * 3;
      chunk.push(
        `${t.toFixed(2)},${vo2.toFixed(gasDecimals)},${vco2.toFixed(gasDecimals)},${ve.toFixed(2)},${(70 + 0.5 * w).toFixed(0)},${w.toFixed(0)},${peto2.toFixed(1)},${petco2.toFixed(1)},${rr.toFixed(1)},${(ve / rr).toFixed(3)}`,
      );
      if (chunk.length === 10_000) {
        put(`${chunk.join('\n')}\n`);
        chunk = [];
      }
    }
    if (chunk.length > 0) put(`${chunk.join('\n')}\n`);
  } finally {
    closeSync(fd);
  }
  return bytes;
}
