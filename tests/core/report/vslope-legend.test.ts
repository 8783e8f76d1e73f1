// The report's V-slope chart (core/report/charts.ts, vega-lite rendered by vega): its legend
// keeps clear of both axis titles and of the plot, measured on vega's own scenegraph (the
// bounding boxes vega lays out, the same ones its SVG is drawn from), and the plot is square.
import { describe, expect, it } from 'vitest';
import * as vega from 'vega';
import * as vl from 'vega-lite';
import { vslopeSpec } from '../../../core/report/charts';
import { demoReport } from './fixture';

interface Box {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}
interface SceneMark {
  marktype: string;
  role: string;
  items?: SceneItem[];
}
interface SceneItem {
  x?: number;
  y?: number;
  width?: number;
  height?: number;
  bounds: Box;
  items?: SceneMark[];
}

/** Absolute boxes of the items of every mark with `role`, walking the group offsets down. */
function boxesOf(mark: SceneMark, role: string, dx = 0, dy = 0, out: Box[] = []): Box[] {
  for (const item of mark.items ?? []) {
    if (mark.role === role) out.push({ x1: item.bounds.x1 + dx, y1: item.bounds.y1 + dy, x2: item.bounds.x2 + dx, y2: item.bounds.y2 + dy });
    if (mark.marktype === 'group') for (const child of item.items ?? []) boxesOf(child, role, dx + (item.x ?? 0), dy + (item.y ?? 0), out);
  }
  return out;
}

const apart = (a: Box, b: Box) => Math.hypot(Math.max(0, b.x1 - a.x2, a.x1 - b.x2), Math.max(0, b.y1 - a.y2, a.y1 - b.y2));

describe('report V-slope chart', () => {
  it('keeps the legend at least 6 pt from both axis titles and outside the plot', async () => {
    const { outcome } = await demoReport();
    for (const day of [outcome.day1, outcome.day2]) {
      const spec = vslopeSpec(day.analysis, { vt1: day.vt1.effective, vt2: day.vt2.effective }, 'V-slope', 150);
      const compiled = vl.compile({ $schema: 'https://vega.github.io/schema/vega-lite/v6.json', ...spec } as vl.TopLevelSpec).spec;
      const view = new vega.View(vega.parse(compiled), { renderer: 'none' });
      await view.runAsync();
      const root = (view.scenegraph() as unknown as { root: SceneMark }).root;
      const legends = boxesOf(root, 'legend');
      const titles = boxesOf(root, 'axis-title');
      // The plot: the root group's own rectangle (its data area), drawn at its x, y.
      const frame = root.items![0];
      const plot = { x1: frame.x ?? 0, y1: frame.y ?? 0, x2: (frame.x ?? 0) + frame.width!, y2: (frame.y ?? 0) + frame.height! };
      view.finalize();
      expect(legends.length).toBe(1);
      expect(titles.length).toBe(2);
      for (const t of titles) expect(apart(legends[0], t)).toBeGreaterThanOrEqual(6);
      // Square, 150 × 150 as asked, and the legend wholly outside it.
      expect([plot.x2 - plot.x1, plot.y2 - plot.y1]).toEqual([150, 150]);
      expect(legends[0].y1 >= plot.y2 || legends[0].x1 >= plot.x2).toBe(true);
    }
  }, 120_000);
});
