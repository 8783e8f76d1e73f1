/**
 * Are these two tests a pair? Checks the subject, the modality, the protocol, the ramp rate
 * and the interval between the starts, and turns every mismatch into a warning. A different
 * subject id is a hard mismatch; everything else is soft (the comparison runs and says so).
 *
 * Interval window: settings.compare.intervalHMin–intervalHMax (18–72 h; two-day testing is
 * about 24 h apart, common practice); an interval outside it is stated on page 1 of the report. Ramp rates count as different when they differ by more
 * than 1 W/min and more than 5% of day 1's rate: the rate is estimated from the averaged load,
 * so smaller differences are estimation noise (Twofold's tolerance, common practice).
 * Times: metadata.testStart as ISO 8601. A start time without a zone offset is read as UTC and
 * the pairing says so; when both days lack a zone the offset cancels out of the interval.
 * Day order, a day-2 start before day 1, is a refusal (refusals.ts), not a warning.
 */
import type { TestAnalysis } from '../model/analysis';
import type { Settings } from '../model/settings';
import type { Pairing, PairingWarning } from './types';

const RAMP_TOLERANCE_W_PER_MIN = 1;
const RAMP_TOLERANCE_PCT = 5;

function normalise(text: string | null): string | null {
  if (text === null) return null;
  const t = text.trim().toLowerCase().replace(/\s+/g, ' ');
  return t === '' ? null : t;
}

/** True when an ISO 8601 date-time carries Z or a ±hh:mm offset. */
export function hasZone(iso: string): boolean {
  return /(Z|[+-]\d{2}:?\d{2})$/i.test(iso.trim()) || !/T\d/.test(iso);
}

/** Milliseconds of a start time; a date-time without a zone is read as UTC. */
export function startMs(iso: string | null): number {
  if (iso === null) return Number.NaN;
  const v = iso.trim();
  return Date.parse(hasZone(v) ? v : `${v}Z`);
}

export function pairTests(day1: TestAnalysis, day2: TestAnalysis, settings: Settings): Pairing {
  const warnings: PairingWarning[] = [];
  const soft = (code: string, message: string) => warnings.push({ code, severity: 'soft', message });
  const m1 = day1.metadata;
  const m2 = day2.metadata;

  let hardMismatch = false;
  const s1 = normalise(m1.subjectId);
  const s2 = normalise(m2.subjectId);
  if (s1 !== null && s2 !== null && s1 !== s2) {
    hardMismatch = true;
    warnings.push({
      code: 'different-subject',
      severity: 'hard',
      message: `DIFFERENT SUBJECTS: day 1 is subject '${m1.subjectId}', day 2 is subject '${m2.subjectId}'. These tests are not one person's pair; the changes below do not describe one person.`,
    });
  } else if (s1 === null || s2 === null) {
    const missing = [s1 === null ? 'day 1' : null, s2 === null ? 'day 2' : null].filter(Boolean).join(' and ');
    soft('subject-unknown', `No subject id on ${missing}: Twofold cannot confirm that both tests are the same person.`);
  }

  if (m1.modality !== null && m2.modality !== null && m1.modality !== m2.modality) {
    soft('different-modality', `Different ergometers: day 1 ${m1.modality}, day 2 ${m2.modality}. Peak and threshold values differ between cycle and treadmill even in the same person.`);
  } else if (m1.modality === null || m2.modality === null) {
    soft('modality-unknown', 'The ergometer (cycle or treadmill) is not recorded on both days; Twofold cannot confirm the same modality.');
  }

  const p1 = normalise(m1.protocol);
  const p2 = normalise(m2.protocol);
  if (p1 !== null && p2 !== null && p1 !== p2) {
    soft('different-protocol', `Different protocols: day 1 '${m1.protocol}', day 2 '${m2.protocol}'.`);
  }

  const r1 = day1.phases.rampWPerMin;
  const r2 = day2.phases.rampWPerMin;
  if (r1 !== null && r2 !== null) {
    const diff = Math.abs(r2 - r1);
    if (diff > RAMP_TOLERANCE_W_PER_MIN && diff > (RAMP_TOLERANCE_PCT / 100) * Math.abs(r1)) {
      soft('different-ramp', `Different ramp rates: day 1 ${r1.toFixed(1)} W/min, day 2 ${r2.toFixed(1)} W/min. Workload and time at a threshold depend on the ramp rate.`);
    }
  } else if ((r1 === null) !== (r2 === null)) {
    soft('ramp-unknown', `A ramp rate is known for ${r1 !== null ? 'day 1' : 'day 2'} only; Twofold cannot confirm the same ramp.`);
  }

  let intervalH: number | null = null;
  const noZone = [m1.testStart !== null && !hasZone(m1.testStart) ? 'day 1' : null, m2.testStart !== null && !hasZone(m2.testStart) ? 'day 2' : null].filter(Boolean);
  if (noZone.length > 0) soft('start-without-zone', `The start time of ${noZone.join(' and ')} has no time-zone offset; Twofold reads it as UTC.`);
  const t1 = startMs(m1.testStart);
  const t2 = startMs(m2.testStart);
  if (Number.isFinite(t1) && Number.isFinite(t2)) {
    intervalH = (t2 - t1) / 3_600_000;
    const { intervalHMin, intervalHMax } = settings.compare;
    if (intervalH <= 0) {
      soft('day2-not-after-day1', `Day 2 starts ${Math.abs(intervalH).toFixed(1)} h before day 1 (or at the same time); the days were confirmed in this order.`);
    } else if (intervalH < intervalHMin || intervalH > intervalHMax) {
      soft('interval-outside', `The tests are ${intervalH.toFixed(1)} h apart, outside the expected ${intervalHMin}–${intervalHMax} h for two-day testing.`);
    }
  } else {
    soft('interval-unknown', 'The start time of one or both tests is missing or unreadable; the interval between the tests is unknown.');
  }

  return { intervalH, warnings, hardMismatch };
}
