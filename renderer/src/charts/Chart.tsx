/**
 * One interactive chart: a thin React wrapper over plotly's `react`, which redraws in place.
 * Clicks report the data coordinates under the pointer, so a screen can place a threshold.
 */
import { useEffect, useRef } from 'react';
import Plotly from 'plotly.js-dist-min';
import { chartSeparators } from '../ui/format';

export interface ChartProps {
  readonly data: unknown[];
  readonly layout: Record<string, unknown>;
  readonly onPick?: (x: number, y: number) => void;
  readonly label: string;
  readonly testId?: string;
  /** An extra class for the box, e.g. 'square' for a chart drawn with equal axis scales. */
  readonly className?: string;
}

const CONFIG = { displaylogo: false, responsive: true, modeBarButtonsToRemove: ['select2d', 'lasso2d', 'toImage'] };

export function Chart({ data, layout, onPick, label, testId, className }: ChartProps) {
  const root = useRef<HTMLDivElement>(null);
  const pick = useRef(onPick);
  pick.current = onPick;
  // Axis and hover numbers in the workbench's locale (plotly's decimal and thousands marks).
  const separators = chartSeparators();

  useEffect(() => {
    const el = root.current;
    if (!el) return;
    let live = true;
    void Plotly.react(el, data, { margin: { l: 64, r: 16, t: 36, b: 52 }, font: { family: 'system-ui, sans-serif', size: 12 }, separators, ...layout }, CONFIG).then((plot) => {
      if (!live) return;
      plot.removeAllListeners?.('plotly_click');
      plot.on('plotly_click', (event) => {
        const point = event.points[0];
        if (point && pick.current) pick.current(point.x, point.y);
      });
    });
    return () => {
      live = false;
    };
  }, [data, layout, separators]);

  useEffect(() => {
    const el = root.current;
    return () => {
      if (el) Plotly.purge(el);
    };
  }, []);

  return <div className={className ? `chart ${className}` : 'chart'} ref={root} role="img" aria-label={label} data-testid={testId} />;
}
