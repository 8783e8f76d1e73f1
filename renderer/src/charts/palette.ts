/**
 * The workbench's colours come from the one palette in core/palette.ts, shared with the PDF
 * report; this module only adapts it to the names the screens use.
 */
import { DAY_STYLE, THRESHOLD_STYLE } from '../../../core/palette';

export { OKABE_ITO, SERIES_STYLE, THRESHOLD_STYLE, VSLOPE_STYLE, DAY_STYLE, verdictStyle } from '../../../core/palette';

export const DAY_COLOUR = { 1: DAY_STYLE[1].colour, 2: DAY_STYLE[2].colour } as const;
export const THRESHOLD_COLOUR = { vt1: THRESHOLD_STYLE.vt1.colour, vt2: THRESHOLD_STYLE.vt2.colour } as const;

/** Plotly's dash name for a palette dash array. */
export function plotlyDash(dash: readonly number[]): 'solid' | 'dash' | 'dot' {
  return dash.length === 0 ? 'solid' : dash[0] < 2 ? 'dot' : 'dash';
}

