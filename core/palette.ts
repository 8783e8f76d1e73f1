/**
 * The one palette of Twofold, used by the workbench (renderer/src/charts) and the PDF report
 * (core/report) alike, so a colour means the same on screen and on paper. Colours are the
 * Okabe–Ito set (Okabe et al., "Color Universal Design", 2008), chosen to stay apart under the
 * common colour-vision deficiencies, and colour never carries meaning alone: every verdict
 * has its words, day 2 is also dashed, VT2 is also dotted.
 *
 * Meanings (Twofold's own assignment):
 * - the O₂ family (VE/VO₂, PetO₂) bluish green; the CO₂ family (VE/VCO₂, PetCO₂) reddish
 *   purple, solid and dashed respectively;
 * - day 1 blue, solid; day 2 orange, dashed: neither is used for a ventilatory equivalent or
 *   an end-tidal pressure;
 * - thresholds in ink: VT1 dashed, VT2 dotted;
 * - V-slope: the fit below the breakpoint blue, above it vermillion, the line of identity grey;
 * - verdicts by harm, not by direction: adverse beyond the band vermillion, favourable beyond
 *   the band blue, within the band slate, not comparable grey.
 */
export const OKABE_ITO = {
  black: '#000000',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
  grey: '#999999',
} as const;

export const INK = '#1d2430';
export const SLATE = '#5b6575';
export const FAINT = '#c4cbd4';

/** A line as both renderers draw it: colour and dash (an SVG dash array; empty is solid). */
export interface LineStyle {
  readonly colour: string;
  readonly dash: readonly number[];
}

const SOLID: readonly number[] = [];
const DASHED: readonly number[] = [6, 3];
const DOTTED: readonly number[] = [1.5, 2.5];

export const DAY_STYLE: Readonly<Record<1 | 2, LineStyle>> = {
  1: { colour: OKABE_ITO.blue, dash: SOLID },
  2: { colour: OKABE_ITO.orange, dash: DASHED },
};

export const SERIES_STYLE = {
  veVo2: { colour: OKABE_ITO.bluishGreen, dash: SOLID },
  veVco2: { colour: OKABE_ITO.reddishPurple, dash: DASHED },
  peto2: { colour: OKABE_ITO.bluishGreen, dash: SOLID },
  petco2: { colour: OKABE_ITO.reddishPurple, dash: DASHED },
} as const satisfies Record<string, LineStyle>;

export const THRESHOLD_STYLE = {
  vt1: { colour: INK, dash: DASHED },
  vt2: { colour: INK, dash: DOTTED },
} as const satisfies Record<string, LineStyle>;

export const VSLOPE_STYLE = {
  analysed: INK,
  outside: FAINT,
  below: { colour: OKABE_ITO.blue, dash: SOLID },
  above: { colour: OKABE_ITO.vermillion, dash: SOLID },
  identity: { colour: OKABE_ITO.grey, dash: DOTTED },
} as const;

export type VerdictKind = 'held' | 'fell' | 'rose' | 'open' | 'not_comparable';

export interface VerdictStyle {
  readonly colour: string;
  /** The words that carry the meaning; the colour only repeats them. */
  readonly words: string;
  readonly harm: 'adverse' | 'favourable' | 'neutral' | 'none';
}

/**
 * A call's colour and words by harm, not by direction (core/compare: held, fell, rose, open):
 * `adverse` says whether the change lies beyond the band in the metric's harmful direction.
 */
export function verdictStyle(verdict: VerdictKind, adverse: boolean): VerdictStyle {
  switch (verdict) {
    case 'held':
      return { colour: SLATE, words: 'reproduced', harm: 'neutral' };
    case 'fell':
      return adverse ? { colour: OKABE_ITO.vermillion, words: 'lower on day 2 (adverse)', harm: 'adverse' } : { colour: OKABE_ITO.blue, words: 'lower on day 2 (favourable)', harm: 'favourable' };
    case 'rose':
      return adverse ? { colour: OKABE_ITO.vermillion, words: 'higher on day 2 (adverse)', harm: 'adverse' } : { colour: OKABE_ITO.blue, words: 'higher on day 2 (favourable)', harm: 'favourable' };
    case 'open':
      return { colour: OKABE_ITO.yellow, words: 'undetermined', harm: 'none' };
    default:
      return { colour: OKABE_ITO.grey, words: 'not comparable', harm: 'none' };
  }
}
