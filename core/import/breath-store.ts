/**
 * Where the importer keeps its breaths. An ordinary test (a few thousand breaths) keeps one
 * plain object per breath. A very large file (from COMPACT_FROM_BREATHS on) keeps its values
 * column by column in Float64Arrays, and each breath is a small object that reads its values
 * from there: about 150 bytes a breath instead of about 290, because a plain object holds
 * every number in a box of its own (measured at a million breaths, docs/performance.md,
 * "Memory at a million breaths"). Both kinds are `Breath`s with the same values; the
 * analysis cannot tell them apart (tests/core/import/breath-store.test.ts).
 *
 * An empty optional value is kept as NaN in its column and read back as null; the importer
 * never stores NaN in an optional value (an unreadable cell is null).
 */
import type { Breath } from '../model/breath-table';

/** From this many breaths on, a table is kept in columns; no real test comes near it. */
export const COMPACT_FROM_BREATHS = 20_000;

type Key = keyof Breath;
const KEYS: readonly Key[] = ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW', 'speedKmh', 'gradePct', 'peto2Mmhg', 'petco2Mmhg', 'rrPerMin', 'vtL', 'sourceLine'];
const FIRST_BLOCK = 4096;
const LARGEST_BLOCK = 65_536;

/** One block of rows: a Float64Array per variable, made when the first value of it arrives. */
class Block {
  readonly columns: Record<Key, Float64Array | null>;
  constructor(readonly size: number) {
    // Written out, so every block's columns have one shape.
    this.columns = { timeS: null, vo2MlMin: null, vco2MlMin: null, veLMin: null, hrBpm: null, workW: null, speedKmh: null, gradePct: null, peto2Mmhg: null, petco2Mmhg: null, rrPerMin: null, vtL: null, sourceLine: null };
  }
  set(key: Key, at: number, value: number | null): void {
    if (value === null) {
      const column = this.columns[key];
      if (column) column[at] = Number.NaN;
      return;
    }
    let column = this.columns[key];
    if (!column) {
      column = new Float64Array(this.size).fill(Number.NaN);
      this.columns[key] = column;
    }
    column[at] = value;
  }
}

/** A breath whose values live in a block's columns (a required column always exists). */
class ColumnBreath implements Breath {
  constructor(
    private readonly block: Block,
    private readonly at: number,
  ) {}
  /** An optional value: null where its column was never made or holds NaN (empty). */
  private optional(column: Float64Array | null): number | null {
    if (column === null) return null;
    const v = column[this.at];
    return v !== v ? null : v;
  }
  get timeS(): number {
    return this.block.columns.timeS![this.at];
  }
  get vo2MlMin(): number {
    return this.block.columns.vo2MlMin![this.at];
  }
  get vco2MlMin(): number {
    return this.block.columns.vco2MlMin![this.at];
  }
  get veLMin(): number {
    return this.block.columns.veLMin![this.at];
  }
  get sourceLine(): number {
    return this.block.columns.sourceLine![this.at];
  }
  get hrBpm(): number | null {
    return this.optional(this.block.columns.hrBpm);
  }
  get workW(): number | null {
    return this.optional(this.block.columns.workW);
  }
  get speedKmh(): number | null {
    return this.optional(this.block.columns.speedKmh);
  }
  get gradePct(): number | null {
    return this.optional(this.block.columns.gradePct);
  }
  get peto2Mmhg(): number | null {
    return this.optional(this.block.columns.peto2Mmhg);
  }
  get petco2Mmhg(): number | null {
    return this.optional(this.block.columns.petco2Mmhg);
  }
  get rrPerMin(): number | null {
    return this.optional(this.block.columns.rrPerMin);
  }
  get vtL(): number | null {
    return this.optional(this.block.columns.vtL);
  }
}

/**
 * The breaths of one import, in the order pushed. `compactFrom` is the breath count at which
 * the store moves to columns (tests set it low to compare the two kinds).
 */
export class BreathStore {
  readonly breaths: Breath[] = [];
  private block: Block | null = null;
  private used = 0;

  constructor(private readonly compactFrom = COMPACT_FROM_BREATHS) {}

  push(breath: Breath): void {
    if (this.block === null && this.breaths.length + 1 < this.compactFrom) {
      this.breaths.push(breath);
      return;
    }
    if (this.block === null) {
      // The breaths so far move to columns too, so a large table holds one kind of breath.
      const earlier = this.breaths.splice(0);
      for (const b of earlier) this.breaths.push(this.columnBreath(b));
    }
    this.breaths.push(this.columnBreath(breath));
  }

  private columnBreath(b: Breath): Breath {
    if (this.block === null || this.used === this.block.size) {
      this.block = new Block(this.block === null ? FIRST_BLOCK : Math.min(LARGEST_BLOCK, this.block.size * 2));
      this.used = 0;
    }
    const block = this.block;
    const at = this.used++;
    for (const key of KEYS) block.set(key, at, b[key]);
    return new ColumnBreath(block, at);
  }
}
