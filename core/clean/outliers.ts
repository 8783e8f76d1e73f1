/**
 * Outlier breath removal by local standard deviation, after Lamarra et al., J Appl
 * Physiol 1987;62:2003–12 (breath-by-breath noise is roughly Gaussian
 * about the local response, so a breath far outside its neighbours is a cough, swallow or
 * sigh rather than physiology).
 *
 * For every breath and each of VO2 (mL/min), VCO2 (mL/min) and VE (L/min): take the
 * `windowBreaths` breaths centred on it, the breath itself excluded (at the ends of the
 * recording, the nearest such window), and remove the breath when its value lies more than `limitSd` sample
 * standard deviations from their mean. One pass over the original breaths, so a removal
 * never changes the neighbourhood of another breath. Assumes breaths in time order.
 *
 * Example: VO2 1000, 1010, 990, 1005, 3000, 995, 1000, 1010, 990 with a 9-breath window and
 * limit 4 SD removes the 3000 breath and keeps the other eight.
 */
import type { Breath } from '../model/breath-table';
import type { RemovedBreath } from '../model/analysis';
import type { OutlierSpec } from '../model/settings';

export interface OutlierResult {
  readonly kept: readonly Breath[];
  readonly removed: readonly RemovedBreath[];
}

const CHECKED = [
  { key: 'vo2MlMin', label: 'VO2', unit: 'mL/min' },
  { key: 'vco2MlMin', label: 'VCO2', unit: 'mL/min' },
  { key: 'veLMin', label: 'VE', unit: 'L/min' },
] as const;

export function removeOutliers(breaths: readonly Breath[], spec: OutlierSpec): OutlierResult {
  if (spec.kind === 'none') return { kept: breaths, removed: [] };
  const half = Math.max(1, Math.floor(spec.windowBreaths / 2));
  const kept: Breath[] = [];
  const removed: RemovedBreath[] = [];
  // Each checked variable as one contiguous column, read many times over by the windows,
  // filled in one pass over the breaths (each breath's fields are fetched from memory once).
  const columns = CHECKED.map(() => new Float64Array(breaths.length));
  for (let i = 0; i < breaths.length; i++) {
    const b = breaths[i];
    for (let c = 0; c < CHECKED.length; c++) columns[c][i] = b[CHECKED[c].key];
  }
  for (let i = 0; i < breaths.length; i++) {
    const found = firstOutlier(breaths, columns, i, half, spec.limitSd);
    if (found) removed.push(found);
    else kept.push(breaths[i]);
  }
  return { kept, removed };
}

/**
 * The first checked variable in which breath i lies beyond the limit. The mean and the sample
 * SD (n − 1) of the neighbours are summed in the order of core/math/stats `mean` and
 * `sampleSd`, so they are the same numbers, without a neighbour array per breath.
 */
function firstOutlier(breaths: readonly Breath[], columns: readonly Float64Array[], i: number, half: number, limitSd: number): RemovedBreath | null {
  // At the ends of the recording the window shifts inward, so every breath is judged
  // against the same number of neighbours.
  const from = Math.max(0, Math.min(i - half, breaths.length - 1 - 2 * half));
  const to = Math.min(breaths.length - 1, from + 2 * half);
  // Fewer than three neighbours give no usable spread.
  if (to - from < 3) return null;
  // The window always holds breath i itself, which is left out.
  const n = to - from;
  for (let c = 0; c < CHECKED.length; c++) {
    const { key, label, unit } = CHECKED[c];
    const column = columns[c];
    let sum = 0;
    for (let j = from; j <= to; j++) if (j !== i) sum += column[j];
    const m = sum / n;
    let squares = 0;
    for (let j = from; j <= to; j++) if (j !== i) squares += (column[j] - m) * (column[j] - m);
    const sd = Math.sqrt(squares / (n - 1));
    const value = breaths[i][key];
    const distance = Math.abs(value - m);
    if (distance > 0 && distance > limitSd * sd) {
      const sds = sd > 0 ? (distance / sd).toFixed(1) : 'infinitely many';
      return {
        sourceLine: breaths[i].sourceLine,
        timeS: breaths[i].timeS,
        variable: key,
        value,
        reason:
          `${label} ${round(value)} ${unit} lies ${sds} SD from the mean of its ${n} ` +
          `neighbouring breaths (${round(m)} ${unit}); the limit is ${limitSd} SD.`,
      };
    }
  }
  return null;
}

function round(x: number): string {
  return Math.abs(x) >= 100 ? x.toFixed(0) : x.toFixed(1);
}
