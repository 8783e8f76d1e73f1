/**
 * The load a protocol sets at each moment: phase, work (cycle) or speed and grade
 * (treadmill). The incremental phase has no set end: the subject stops it (see
 * generate-test.ts), so `exerciseEndS` is passed in.
 */
import type { PhaseName } from '../../core/model/analysis';
import type { ProtocolParams } from './params';

export interface Load {
  readonly phase: PhaseName;
  /** Cycle work, W; null on a treadmill. */
  readonly workW: number | null;
  /** Treadmill speed km/h and grade %; null on a cycle. */
  readonly speedKmh: number | null;
  readonly gradePct: number | null;
}

export function incrementalStartS(protocol: ProtocolParams): number {
  return protocol.restS + protocol.warmupS;
}

/** The load at `timeS`; `exerciseEndS` is the end of the incremental phase. */
export function loadAt(protocol: ProtocolParams, timeS: number, exerciseEndS: number): Load {
  const start = incrementalStartS(protocol);
  const phase: PhaseName = timeS < protocol.restS ? 'rest' : timeS < start ? 'warmup' : timeS < exerciseEndS ? 'incremental' : 'recovery';
  const into = timeS - start;
  switch (protocol.kind) {
    case 'cycle-ramp': {
      const workW =
        phase === 'rest' ? 0
        : phase === 'warmup' ? protocol.warmupW
        : phase === 'incremental' ? protocol.warmupW + (protocol.rampWPerMin * into) / 60
        : protocol.recoveryW;
      return { phase, workW, speedKmh: null, gradePct: null };
    }
    case 'cycle-steps': {
      const workW =
        phase === 'rest' ? 0
        : phase === 'warmup' ? protocol.warmupW
        : phase === 'incremental' ? protocol.warmupW + protocol.stepW * (Math.floor(into / protocol.stepS) + 1)
        : protocol.recoveryW;
      return { phase, workW, speedKmh: null, gradePct: null };
    }
    case 'treadmill-steps': {
      if (phase === 'rest') return { phase, workW: null, speedKmh: 0, gradePct: 0 };
      if (phase === 'warmup') return { phase, workW: null, speedKmh: protocol.warmupSpeedKmh, gradePct: protocol.warmupGradePct };
      if (phase === 'recovery') return { phase, workW: null, speedKmh: protocol.recoverySpeedKmh, gradePct: protocol.recoveryGradePct };
      const step = Math.floor(into / protocol.stepS);
      return {
        phase,
        workW: null,
        speedKmh: Math.min(protocol.maxSpeedKmh, protocol.startSpeedKmh + protocol.speedStepKmh * step),
        gradePct: protocol.startGradePct + protocol.gradeStepPct * step,
      };
    }
  }
}
