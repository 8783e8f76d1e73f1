// The report's chart drawing (core/report/pdf-canvas.ts, a recording canvas context under
// vega's canvas renderer), checked against geometry and against vega's own SVG renderer: the
// SVG text vega writes for the same chart is an independent rendering of the same scenegraph,
// so every label must land where the SVG puts it, and every plotted breath must be drawn.
import { describe, expect, it } from 'vitest';
import * as vega from 'vega';
import * as vl from 'vega-lite';
import { drawChart, endTidalSpec, equivalentsSpec, overlaySpec, vslopeSpec } from '../../../core/report/charts';
import { parseCssFont, pdfColour, PdfCanvas } from '../../../core/report/pdf-canvas';
import { demoReport } from './fixture';

type Point = [number, number];
interface Drawn {
  paths: { kind: 'fill' | 'stroke' | 'clip'; segments: string[]; points: Point[]; colour: unknown; alpha: number | undefined }[];
  texts: { text: string; x: number; y: number; matrix: number[]; font: string; size: number }[];
}

/**
 * A stand-in for the pdfkit document that records what the replay asks of it: the paths
 * with their points (in the document's coordinates after its translations), and the texts
 * with the transform they are drawn under. widthOfString is 0, so a text's x is its anchor.
 */
function recordingDoc(): { doc: PDFKit.PDFDocument; drawn: Drawn } {
  const drawn: Drawn = { paths: [], texts: [] };
  let m = [1, 0, 0, 1, 0, 0];
  const stack: number[][] = [];
  let segments: string[] = [];
  let points: Point[] = [];
  let colour: unknown = null;
  let alpha: number | undefined;
  let font = '';
  let size = 0;
  const at = (x: number, y: number): Point => [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
  const end = (kind: 'fill' | 'stroke' | 'clip') => {
    drawn.paths.push({ kind, segments, points, colour, alpha });
    segments = [];
    points = [];
  };
  const doc: Record<string, unknown> = {
    x: 0,
    y: 0,
    save: () => (stack.push([...m]), doc),
    restore: () => ((m = stack.pop() ?? m), doc),
    translate: (x: number, y: number) => ((m = [m[0], m[1], m[2], m[3], m[4] + m[0] * x + m[2] * y, m[5] + m[1] * x + m[3] * y]), doc),
    transform: (a: number, b: number, c: number, d: number, e: number, f: number) => ((m = [m[0] * a + m[2] * b, m[1] * a + m[3] * b, m[0] * c + m[2] * d, m[1] * c + m[3] * d, m[0] * e + m[2] * f + m[4], m[1] * e + m[3] * f + m[5]]), doc),
    fillColor: (c: unknown, a?: number) => ((colour = c), (alpha = a), doc),
    strokeColor: (c: unknown, a?: number) => ((colour = c), (alpha = a), doc),
    lineWidth: () => doc,
    lineCap: () => doc,
    lineJoin: () => doc,
    miterLimit: () => doc,
    undash: () => doc,
    addContent: () => doc,
    moveTo: (x: number, y: number) => (segments.push('M'), points.push(at(x, y)), doc),
    lineTo: (x: number, y: number) => (segments.push('L'), points.push(at(x, y)), doc),
    bezierCurveTo: (a: number, b: number, c: number, d: number, x: number, y: number) => (segments.push('C'), points.push(at(a, b), at(c, d), at(x, y)), doc),
    closePath: () => (segments.push('Z'), doc),
    fill: () => (end('fill'), doc),
    stroke: () => (end('stroke'), doc),
    clip: () => (end('clip'), doc),
    font: (f: string) => ((font = f), doc),
    fontSize: (s: number) => ((size = s), doc),
    widthOfString: () => 0,
    text: (text: string, x: number, y: number) => (drawn.texts.push({ text, x, y, matrix: [...m], font, size }), doc),
  };
  return { doc: doc as unknown as PDFKit.PDFDocument, drawn };
}

const FONTS = { regular: 'Sans', bold: 'Sans-Bold' };

const unescape = (s: string) => s.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&#x27;|&#39;/g, "'").replace(/&quot;/g, '"').replace(/&amp;/g, '&');

/**
 * The texts vega's SVG shows, one per line, with each line's anchor in the SVG's coordinates
 * (following the translate() of every enclosing group, and a multi-line text's tspan dy);
 * rotated and fully transparent texts are left out (a canvas draws no text of opacity 0).
 */
function svgTexts(svg: string): { text: string; x: number; y: number }[] {
  const out: { text: string; x: number; y: number }[] = [];
  const offsets: Point[] = [[0, 0]];
  const token = /<(\/?)g\b([^>]*)>|<text\b([^>]*)>(.*?)<\/text>/g;
  const translate = (attrs: string) => /transform="translate\(([-\d.e]+),\s*([-\d.e]+)\)/.exec(attrs);
  for (let t = token.exec(svg); t; t = token.exec(svg)) {
    const here = offsets[offsets.length - 1];
    if (t[3] === undefined) {
      if (t[1]) offsets.pop();
      else if (!t[2].trimEnd().endsWith('/')) {
        const move = translate(t[2]);
        offsets.push(move ? [here[0] + Number(move[1]), here[1] + Number(move[2])] : here);
      }
      continue;
    }
    const move = translate(t[3]);
    if (!move || /rotate\(/.test(t[3]) || /opacity="0"/.test(t[3])) continue;
    const x = here[0] + Number(move[1]);
    let y = here[1] + Number(move[2]);
    const spans = [...t[4].matchAll(/<tspan([^>]*)>([^<]*)<\/tspan>/g)];
    if (spans.length === 0) out.push({ text: unescape(t[4]), x, y });
    for (const span of spans) {
      y += Number(/dy="([-\d.e]+)"/.exec(span[1])?.[1] ?? 0);
      out.push({ text: unescape(span[2]), x, y });
    }
  }
  return out;
}

async function vegaSvg(spec: Record<string, unknown>): Promise<string> {
  const compiled = vl.compile({ $schema: 'https://vega.github.io/schema/vega-lite/v6.json', ...spec } as vl.TopLevelSpec).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: 'none' });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}

describe('chart drawing against vega’s SVG renderer', () => {
  it('draws every label where vega’s SVG puts it, every plotted breath, and gives the SVG’s size', async () => {
    const { outcome } = await demoReport();
    const day = outcome.day1;
    const used = { vt1: day.vt1.effective, vt2: day.vt2.effective };
    const specs = [
      vslopeSpec(day.analysis, used, 'V-slope, day 1', 150),
      equivalentsSpec(day.analysis, used, 'Ventilatory equivalents, day 1', 190, 150),
      endTidalSpec(day.analysis, used, 'End-tidal pressures, day 1', 190, 150),
      overlaySpec(outcome.day1.analysis, outcome.day2.analysis, 'vo2MlMin', 'VO2 against workload', 190, 150),
    ];
    for (const spec of specs) {
      const svg = await vegaSvg(spec);
      const chart = await drawChart(spec, FONTS);
      const size = /<svg[^>]*\swidth="([\d.]+)"[^>]*\sheight="([\d.]+)"/.exec(svg)!;
      expect([chart.width, chart.height]).toEqual([Number(size[1]), Number(size[2])]);

      const { doc, drawn } = recordingDoc();
      chart.drawing.replay(doc, 0, 0);
      const expected = svgTexts(svg);
      expect(expected.length).toBeGreaterThan(8);
      const flat = drawn.texts.filter((t) => t.matrix[1] === 0 && t.matrix[2] === 0);
      // Same strings, each at the same anchor (SVG text-anchor start; ours with width 0), to 0.01 px.
      const key = (t: { text: string; x: number; y: number }) => `${t.text}@${t.x.toFixed(2)},${t.y.toFixed(2)}`;
      expect(flat.map((t) => key({ text: t.text, x: t.x + t.matrix[4], y: t.y + t.matrix[5] })).sort()).toEqual(expected.map(key).sort());

      // Circles: one filled circle (a move and four cubic quarters) per SVG circle (a move and two arcs).
      const symbols = svg.match(/<path [^>]*d="M[-\d.e]+,0A/g)?.length ?? 0;
      const circles = drawn.paths.filter((p) => p.kind === 'fill' && p.segments.join('') === 'MCCCC').length;
      expect(circles).toBe(symbols);
    }
  }, 120_000);

  it('draws the V-slope chart’s analysed breaths, each at the centre vega places it', async () => {
    const { outcome } = await demoReport();
    const day = outcome.day2;
    const spec = vslopeSpec(day.analysis, { vt1: day.vt1.effective, vt2: day.vt2.effective }, 'V-slope, day 2', 150);
    const svg = await vegaSvg(spec);
    const centres = [...svg.matchAll(/<path [^>]*transform="translate\(([-\d.e]+),([-\d.e]+)\)" d="M[-\d.e]+,0A/g)].map((m) => [Number(m[1]), Number(m[2])]);
    expect(centres.length).toBeGreaterThan(100);
    const { doc, drawn } = recordingDoc();
    (await drawChart(spec, FONTS)).drawing.replay(doc, 0, 0);
    const drawnCentres = drawn.paths
      .filter((p) => p.kind === 'fill' && p.segments.join('') === 'MCCCC')
      .map((p) => {
        // The circle's centre: the mean of its four quarter ends, in the plot group's frame.
        const ends = [p.points[3], p.points[6], p.points[9], p.points[12]];
        return [ends.reduce((s, e) => s + e[0], 0) / 4, ends.reduce((s, e) => s + e[1], 0) / 4];
      });
    // The SVG's translate is inside the plot group; both sets shift by that group's offset.
    const dx = drawnCentres[0][0] - centres[0][0];
    const dy = drawnCentres[0][1] - centres[0][1];
    expect(drawnCentres.length).toBe(centres.length);
    for (let i = 0; i < centres.length; i++) {
      expect(drawnCentres[i][0] - dx).toBeCloseTo(centres[i][0], 2);
      expect(drawnCentres[i][1] - dy).toBeCloseTo(centres[i][1], 2);
    }
  }, 120_000);
});

describe('recording canvas context', () => {
  it('approximates a full circle by four cubic quarters within 0.03 % of the radius', () => {
    // The 4/3·tan(θ/4) control distance has a largest radial error of about 0.027 % of r for a
    // quarter circle (common knowledge of Bézier circle approximation; figure from memory).
    const c = new PdfCanvas(FONTS);
    c.fillStyle = '#000000';
    c.beginPath();
    c.arc(10, 20, 5, 0, 2 * Math.PI);
    c.fill();
    const { doc, drawn } = recordingDoc();
    c.replay(doc, 0, 0);
    const [path] = drawn.paths;
    expect(path.segments.join('')).toBe('MCCCC');
    const p = path.points;
    let worst = 0;
    for (let q = 0; q < 4; q++) {
      const [p0, p1, p2, p3] = [p[q * 3], p[q * 3 + 1], p[q * 3 + 2], p[q * 3 + 3]];
      for (let t = 0; t <= 1; t += 0.01) {
        const u = 1 - t;
        const x = u * u * u * p0[0] + 3 * u * u * t * p1[0] + 3 * u * t * t * p2[0] + t * t * t * p3[0];
        const y = u * u * u * p0[1] + 3 * u * u * t * p1[1] + 3 * u * t * t * p2[1] + t * t * t * p3[1];
        worst = Math.max(worst, Math.abs(Math.hypot(x - 10, y - 20) - 5) / 5);
      }
    }
    expect(worst).toBeLessThan(3e-4);
    expect(worst).toBeGreaterThan(1e-4);
  });

  it('applies the canvas transform to each point, as a canvas does when a path is built', () => {
    const c = new PdfCanvas(FONTS);
    c.strokeStyle = 'rgba(10, 20, 30, 0.5)';
    c.globalAlpha = 0.5;
    c.translate(100, 50);
    c.rotate(Math.PI / 2);
    c.beginPath();
    c.moveTo(0, 0); // at (100, 50)
    c.lineTo(10, 0); // a quarter turn clockwise on a y-down page: at (100, 60)
    c.setTransform(1, 0, 0, 1, 0, 0); // a later transform does not move the points already built
    // A quadratic from (100, 60) through (100, 0) to (130, 60): the same curve as a cubic has its
    // control points two thirds of the way to the quadratic's, (100, 20) and (110, 20).
    c.quadraticCurveTo(100, 0, 130, 60);
    c.stroke();
    const { doc, drawn } = recordingDoc();
    c.replay(doc, 7, 3);
    const [path] = drawn.paths;
    expect(path.kind).toBe('stroke');
    expect(path.colour).toEqual([10, 20, 30]);
    expect(path.alpha).toBeCloseTo(0.25, 12);
    const rounded = path.points.map(([x, y]) => [Math.round(x * 1e9) / 1e9, Math.round(y * 1e9) / 1e9]);
    // Replayed at (7, 3).
    expect(rounded).toEqual([
      [107, 53],
      [107, 63],
      [107, 23],
      [117, 23],
      [137, 63],
    ]);
  });

  it('keeps the document’s text position, and refuses what it cannot draw', () => {
    const c = new PdfCanvas(FONTS);
    c.font = 'bold 9.5px DejaVu Sans';
    c.fillStyle = '#1d2430';
    c.fillText('VT1', 4, 8);
    const { doc, drawn } = recordingDoc();
    (doc as unknown as { x: number; y: number }).x = 55;
    (doc as unknown as { x: number; y: number }).y = 321;
    c.replay(doc, 10, 20);
    expect(drawn.texts).toEqual([{ text: 'VT1', x: 4, y: 8, matrix: [1, 0, 0, 1, 10, 20], font: 'Sans-Bold', size: 9.5 }]);
    expect([doc.x, doc.y]).toEqual([55, 321]);
    expect(() => c.createLinearGradient()).toThrow(/gradients are not supported/);
    expect(() => (c.globalCompositeOperation = 'multiply')).toThrow(/blend mode multiply/);
  });

  it('reads CSS colours and fonts as vega writes them', () => {
    expect(pdfColour('#4c78a8')).toEqual({ colour: '#4c78a8', alpha: 1 });
    expect(pdfColour('rgb(255, 0, 10)')).toEqual({ colour: [255, 0, 10], alpha: 1 });
    expect(pdfColour('rgba(0,0,0,0.25)')).toEqual({ colour: [0, 0, 0], alpha: 0.25 });
    expect(pdfColour('transparent')).toBeNull();
    expect(parseCssFont('normal 8px DejaVu Sans')).toEqual({ bold: false, size: 8 });
    expect(parseCssFont('bold 9.5px DejaVu Sans')).toEqual({ bold: true, size: 9.5 });
    expect(parseCssFont('600 10px sans-serif')).toEqual({ bold: true, size: 10 });
    expect(parseCssFont('300 10px sans-serif')).toEqual({ bold: false, size: 10 });
  });
});
