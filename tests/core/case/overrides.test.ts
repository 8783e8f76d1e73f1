// Override bookkeeping and the VO2-to-time mapping, against values worked by hand.
import { describe, expect, it } from 'vitest';
import { activeOverrides, currentSignOff, firstTimeReaching, pointAtTime } from '../../../core/case/overrides';
import type { Phases, ProcessedSeries } from '../../../core/model/analysis';
import { caseWithLog } from './fixtures';

// VO2 = 500 + 10·(t − 100) mL/min on t = 100…700 s every 10 s; incremental phase 200–700 s.
const timeS = Array.from({ length: 61 }, (_, i) => 100 + 10 * i);
const series: ProcessedSeries = {
  timeS,
  vo2MlMin: timeS.map((t) => 500 + 10 * (t - 100)),
  vco2MlMin: timeS.map(() => 0),
  veLMin: timeS.map(() => 0),
  hrBpm: timeS.map(() => null),
  workW: timeS.map(() => null),
  peto2Mmhg: timeS.map(() => null),
  petco2Mmhg: timeS.map(() => null),
};
const phases: Phases = { phases: [], incrementalStartS: 200, incrementalEndS: 700, rampWPerMin: null, source: 'user' };

describe('firstTimeReaching', () => {
  it('maps a VO2 to the first time on the ramp it is reached, interpolating (2005 mL/min → 250.5 s by hand)', () => {
    const r = firstTimeReaching(series, phases, 2005, 'x');
    expect(r.ok && r.value.timeS).toBeCloseTo(250.5, 9);
  });

  it('takes the first ramp point when VO2 is already above the target at the ramp start (1000 → 200 s, VO2 1500)', () => {
    const r = firstTimeReaching(series, phases, 1000, 'x');
    expect(r.ok && r.value).toEqual({ timeS: 200, vo2MlMin: 1500 });
  });

  it('says so when VO2 never reaches the value', () => {
    const r = firstTimeReaching(series, phases, 9000, 'day 2 VT1');
    expect(!r.ok && r.error.code).toBe('override-vo2-not-reached');
  });
});

describe('pointAtTime', () => {
  it('interpolates VO2 at a time (333 s → 500 + 10·233 = 2830 mL/min)', () => {
    const r = pointAtTime(series, phases, 333, 'x');
    expect(r.ok && r.value.vo2MlMin).toBeCloseTo(2830, 9);
  });

  it('refuses a time off the incremental phase', () => {
    expect(pointAtTime(series, phases, 150, 'x').ok).toBe(false);
  });
});

describe('activeOverrides', () => {
  it('withdrawing the newest override brings back the one before it', () => {
    // fixtures: entry 1 sets day 2 VT1 to 570 s, entry 2 to 555 s, entry 3 withdraws entry 2.
    const c = caseWithLog();
    const active = activeOverrides(c.log).get('2:vt1');
    expect(active?.seq).toBe(1);
    expect(active?.point.timeS).toBe(570);
    // log[0] is the opening entry; the first three entries are the opening and entries 1 and 2.
    expect(activeOverrides(c.log.slice(0, 3)).get('2:vt1')?.seq).toBe(2);
    expect(activeOverrides(c.log).has('1:vt1')).toBe(false);
  });

  it('a change after a sign-off voids it', () => {
    const c = caseWithLog();
    const signOff = { ...c.log[0], seq: 9, action: { kind: 'sign-off' as const, statement: 'ok' } };
    expect(currentSignOff([...c.log, signOff])?.seq).toBe(9);
    expect(currentSignOff([signOff, ...c.log])).toBeNull();
  });
});
