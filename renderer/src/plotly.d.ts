/** The little of plotly.js the workbench uses (the package ships no types). */
declare module 'plotly.js-dist-min' {
  export interface PlotlyHTMLElement extends HTMLElement {
    on(event: 'plotly_click', handler: (event: { points: { x: number; y: number; curveNumber: number; pointIndex: number }[] }) => void): void;
    removeAllListeners?(event: string): void;
  }
  const Plotly: {
    react(root: HTMLElement, data: unknown[], layout: unknown, config?: unknown): Promise<PlotlyHTMLElement>;
    purge(root: HTMLElement): void;
  };
  export default Plotly;
}
