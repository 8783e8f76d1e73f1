/**
 * A time axis read as m:ss: ticks at whole minutes (every 1, 2, 5 or 10 min, so about 6–12
 * ticks), labelled '0:00', '2:00', … The data stay in seconds; only the labels change.
 * Plotly formats a hovered x as a number, so a trace against time carries each point's m:ss
 * as `customdata` and names it in its hover template (`clockHover`).
 */
import { clock } from '../ui/format';

export function clockAxis(maxS: number): { title: { text: string }; tickmode: 'array'; tickvals: number[]; ticktext: string[] } {
  const span = Number.isFinite(maxS) && maxS > 0 ? maxS : 60;
  const stepMin = [1, 2, 5, 10, 20].find((m) => span / (m * 60) <= 12) ?? 30;
  const tickvals: number[] = [];
  for (let t = 0; t <= span + 1e-9; t += stepMin * 60) tickvals.push(t);
  return { title: { text: 'Time (m:ss)' }, tickmode: 'array', tickvals, ticktext: tickvals.map((t) => clock(t)) };
}

/**
 * Hover text whose time reads m:ss: `what` is the rest of plotly's template (e.g.
 * 'VE/VO₂ %{y:.1f}'), the trace's name goes in the hover box's side label.
 * Example: clockHover([372], 'HR %{y:.0f} bpm') → customdata ['6:12'], template '6:12, HR …'.
 */
export function clockHover(timeS: readonly number[], what: string): { customdata: string[]; hovertemplate: string } {
  return { customdata: timeS.map((t) => clock(t)), hovertemplate: `%{customdata}, ${what}<extra>%{fullData.name}</extra>` };
}
