/**
 * The part of the HTML canvas 2D context that vega's canvas renderer calls, recorded as PDF
 * drawing and replayed onto a pdfkit document: the report draws its charts with it, from
 * vega's scenegraph, without an SVG text in between (an SVG string parsed back element by
 * element cost about 0.3 ms per plotted breath). Paths are kept in the chart's own
 * coordinates (PDF allows no change of transform inside a path, so the recorder applies the
 * canvas transform to each point itself); fill and stroke paint the same recorded path, as a
 * canvas does; save, restore and clip map to PDF's q, Q and W n. Units: the chart's px,
 * drawn as pt.
 *
 * Not covered, and refused with an error rather than drawn wrong: gradients, patterns,
 * images, blend modes other than source-over, and clearing (a report page is never cleared).
 */
import type { Fonts } from './layout';

type Matrix = [number, number, number, number, number, number];
type Segment = readonly ['M' | 'L', number, number] | readonly ['C', number, number, number, number, number, number] | readonly ['Z'];
type Op = (doc: PDFKit.PDFDocument) => void;

interface State {
  matrix: Matrix;
  fillStyle: string;
  strokeStyle: string;
  globalAlpha: number;
  lineWidth: number;
  lineCap: 'butt' | 'round' | 'square';
  lineJoin: 'miter' | 'round' | 'bevel';
  miterLimit: number;
  dash: number[];
  dashOffset: number;
  font: string;
  textAlign: string;
}

const HALF_PI = Math.PI / 2;

/** A number as PDF content writes it: at most four decimals, no exponent. */
function pdfNumber(v: number): string {
  return String(Math.round(v * 1e4) / 1e4);
}

function copyState(s: State): State {
  return { ...s, matrix: [...s.matrix] as Matrix, dash: [...s.dash] };
}

/** A CSS colour as pdfkit takes it: hex and names as given, rgb()/rgba() as numbers with their alpha; null for none. */
export function pdfColour(css: string): { colour: string | [number, number, number]; alpha: number } | null {
  const c = css.trim().toLowerCase();
  if (c === 'transparent' || c === 'none' || c === '') return null;
  const rgb = /^rgba?\(\s*([\d.]+)[\s,]+([\d.]+)[\s,]+([\d.]+)(?:[\s,/]+([\d.]+%?))?\s*\)$/.exec(c);
  if (rgb) {
    const a = rgb[4] === undefined ? 1 : rgb[4].endsWith('%') ? Number(rgb[4].slice(0, -1)) / 100 : Number(rgb[4]);
    return { colour: [Number(rgb[1]), Number(rgb[2]), Number(rgb[3])], alpha: a };
  }
  return { colour: c, alpha: 1 };
}

/** Bold for a CSS font whose weight is bold or 600 and above; the size is its px. */
export function parseCssFont(font: string): { bold: boolean; size: number } {
  const size = /([\d.]+)px/.exec(font);
  const weight = /(?:^|\s)(bold|bolder|[1-9]00)(?:\s|$)/.exec(font);
  const bold = weight !== null && (weight[1].startsWith('bold') || Number(weight[1]) >= 600);
  return { bold, size: size ? Number(size[1]) : 10 };
}

export class PdfCanvas {
  private state: State = {
    matrix: [1, 0, 0, 1, 0, 0],
    fillStyle: '#000000',
    strokeStyle: '#000000',
    globalAlpha: 1,
    lineWidth: 1,
    lineCap: 'butt',
    lineJoin: 'miter',
    miterLimit: 10,
    dash: [],
    dashOffset: 0,
    font: '10px sans-serif',
    textAlign: 'start',
  };
  private readonly saved: State[] = [];
  private path: Segment[] = [];
  private start: [number, number] | null = null;
  private current: [number, number] | null = null;
  private readonly ops: Op[] = [];
  /** vega reads this to size a canvas for a screen; a page has one pt per px. */
  readonly pixelRatio = 1;

  constructor(private readonly fonts: Fonts) {}

  // --- state -------------------------------------------------------------------------------
  get fillStyle(): string { return this.state.fillStyle; }
  set fillStyle(v: string) { this.state.fillStyle = String(v); }
  get strokeStyle(): string { return this.state.strokeStyle; }
  set strokeStyle(v: string) { this.state.strokeStyle = String(v); }
  get globalAlpha(): number { return this.state.globalAlpha; }
  set globalAlpha(v: number) { this.state.globalAlpha = v; }
  get lineWidth(): number { return this.state.lineWidth; }
  set lineWidth(v: number) { this.state.lineWidth = v; }
  get lineCap(): State['lineCap'] { return this.state.lineCap; }
  set lineCap(v: State['lineCap']) { this.state.lineCap = v; }
  get lineJoin(): State['lineJoin'] { return this.state.lineJoin; }
  set lineJoin(v: State['lineJoin']) { this.state.lineJoin = v; }
  get miterLimit(): number { return this.state.miterLimit; }
  set miterLimit(v: number) { this.state.miterLimit = v; }
  get lineDashOffset(): number { return this.state.dashOffset; }
  set lineDashOffset(v: number) { this.state.dashOffset = v; }
  get font(): string { return this.state.font; }
  set font(v: string) { this.state.font = v; }
  get textAlign(): string { return this.state.textAlign; }
  set textAlign(v: string) { this.state.textAlign = v; }
  get globalCompositeOperation(): string { return 'source-over'; }
  set globalCompositeOperation(v: string) {
    if (v !== 'source-over') throw new Error(`chart drawing: blend mode ${v} is not supported in the report`);
  }

  setLineDash(dash: readonly number[]): void {
    this.state.dash = [...dash];
  }

  save(): void {
    this.saved.push(copyState(this.state));
    this.ops.push((doc) => doc.save());
  }

  restore(): void {
    const s = this.saved.pop();
    if (!s) return;
    this.state = s;
    this.ops.push((doc) => doc.restore());
  }

  // --- transform ---------------------------------------------------------------------------
  transform(a: number, b: number, c: number, d: number, e: number, f: number): void {
    const m = this.state.matrix;
    this.state.matrix = [m[0] * a + m[2] * b, m[1] * a + m[3] * b, m[0] * c + m[2] * d, m[1] * c + m[3] * d, m[0] * e + m[2] * f + m[4], m[1] * e + m[3] * f + m[5]];
  }

  translate(x: number, y: number): void {
    const m = this.state.matrix;
    m[4] += m[0] * x + m[2] * y;
    m[5] += m[1] * x + m[3] * y;
  }

  scale(x: number, y: number): void {
    this.transform(x, 0, 0, y, 0, 0);
  }

  rotate(angle: number): void {
    const c = Math.cos(angle);
    const s = Math.sin(angle);
    this.transform(c, s, -s, c, 0, 0);
  }

  setTransform(a: number, b: number, c: number, d: number, e: number, f: number): void {
    this.state.matrix = [a, b, c, d, e, f];
  }

  private x(px: number, py: number): number {
    const m = this.state.matrix;
    return m[0] * px + m[2] * py + m[4];
  }

  private y(px: number, py: number): number {
    const m = this.state.matrix;
    return m[1] * px + m[3] * py + m[5];
  }

  // --- path --------------------------------------------------------------------------------
  beginPath(): void {
    this.path = [];
    this.start = null;
    this.current = null;
  }

  moveTo(px: number, py: number): void {
    const p: [number, number] = [this.x(px, py), this.y(px, py)];
    this.path.push(['M', p[0], p[1]]);
    this.start = p;
    this.current = p;
  }

  lineTo(px: number, py: number): void {
    if (!this.current) return this.moveTo(px, py);
    const p: [number, number] = [this.x(px, py), this.y(px, py)];
    this.path.push(['L', p[0], p[1]]);
    this.current = p;
  }

  bezierCurveTo(c1x: number, c1y: number, c2x: number, c2y: number, px: number, py: number): void {
    if (!this.current) this.moveTo(c1x, c1y);
    const p: [number, number] = [this.x(px, py), this.y(px, py)];
    this.path.push(['C', this.x(c1x, c1y), this.y(c1x, c1y), this.x(c2x, c2y), this.y(c2x, c2y), p[0], p[1]]);
    this.current = p;
  }

  quadraticCurveTo(cx: number, cy: number, px: number, py: number): void {
    if (!this.current) this.moveTo(cx, cy);
    // The cubic with the same curve: control points two thirds of the way to the quadratic's.
    const [x0, y0] = this.current as [number, number];
    const qx = this.x(cx, cy);
    const qy = this.y(cx, cy);
    const ex = this.x(px, py);
    const ey = this.y(px, py);
    this.path.push(['C', x0 + (2 / 3) * (qx - x0), y0 + (2 / 3) * (qy - y0), ex + (2 / 3) * (qx - ex), ey + (2 / 3) * (qy - ey), ex, ey]);
    this.current = [ex, ey];
  }

  closePath(): void {
    if (!this.start) return;
    this.path.push(['Z']);
    this.current = this.start;
  }

  rect(x: number, y: number, w: number, h: number): void {
    this.moveTo(x, y);
    this.lineTo(x + w, y);
    this.lineTo(x + w, y + h);
    this.lineTo(x, y + h);
    this.closePath();
  }

  /** A canvas arc: a line to its start when a path is open elsewhere, then cubic pieces of at most 90°. */
  arc(cx: number, cy: number, r: number, from: number, to: number, anticlockwise = false): void {
    let sweep = to - from;
    const full = 2 * Math.PI;
    if (!anticlockwise && sweep >= full) sweep = full;
    else if (anticlockwise && -sweep >= full) sweep = -full;
    else if (!anticlockwise) sweep = ((sweep % full) + full) % full;
    else sweep = -((((-sweep) % full) + full) % full);
    const sx = cx + r * Math.cos(from);
    const sy = cy + r * Math.sin(from);
    if (!this.current) this.moveTo(sx, sy);
    else if (Math.abs(this.x(sx, sy) - this.current[0]) > 1e-9 || Math.abs(this.y(sx, sy) - this.current[1]) > 1e-9) this.lineTo(sx, sy);
    const pieces = Math.max(1, Math.ceil(Math.abs(sweep) / HALF_PI - 1e-9));
    const step = sweep / pieces;
    // Control-point distance for a circular arc of angle `step` (the usual 4/3·tan(θ/4)).
    const k = (4 / 3) * Math.tan(step / 4);
    let a = from;
    for (let i = 0; i < pieces; i++) {
      const b = a + step;
      const ca = Math.cos(a), sa = Math.sin(a), cb = Math.cos(b), sb = Math.sin(b);
      this.bezierCurveTo(cx + r * (ca - k * sa), cy + r * (sa + k * ca), cx + r * (cb + k * sb), cy + r * (sb - k * cb), cx + r * cb, cy + r * sb);
      a = b;
    }
  }

  private emitPath(doc: PDFKit.PDFDocument, path: readonly Segment[]): void {
    for (const s of path) {
      if (s[0] === 'M') doc.moveTo(s[1], s[2]);
      else if (s[0] === 'L') doc.lineTo(s[1], s[2]);
      else if (s[0] === 'C') doc.bezierCurveTo(s[1], s[2], s[3], s[4], s[5], s[6]);
      else doc.closePath();
    }
  }

  fill(): void {
    const paint = pdfColour(this.state.fillStyle);
    if (!paint || this.path.length === 0) return;
    const path = this.path;
    const alpha = paint.alpha * this.state.globalAlpha;
    this.ops.push((doc) => {
      doc.fillColor(paint.colour, alpha);
      this.emitPath(doc, path);
      doc.fill();
    });
  }

  stroke(): void {
    const paint = pdfColour(this.state.strokeStyle);
    if (!paint || this.path.length === 0) return;
    const path = this.path;
    const { lineWidth, lineCap, lineJoin, miterLimit, dash, dashOffset } = this.state;
    const alpha = paint.alpha * this.state.globalAlpha;
    this.ops.push((doc) => {
      doc.strokeColor(paint.colour, alpha).lineWidth(lineWidth).lineCap(lineCap).lineJoin(lineJoin).miterLimit(miterLimit);
      // PDF's d operator takes a canvas dash list as it is (an odd list repeats; zeros are allowed, not all of them).
      if (dash.some((d) => d > 0)) doc.addContent(`[${dash.map(pdfNumber).join(' ')}] ${pdfNumber(dashOffset)} d`);
      else doc.undash();
      this.emitPath(doc, path);
      doc.stroke();
    });
  }

  clip(): void {
    const path = this.path;
    this.ops.push((doc) => {
      this.emitPath(doc, path);
      doc.clip();
    });
  }

  fillRect(x: number, y: number, w: number, h: number): void {
    this.beginPath();
    this.rect(x, y, w, h);
    this.fill();
    this.beginPath();
  }

  // --- text --------------------------------------------------------------------------------
  fillText(text: string, x: number, y: number): void {
    const paint = pdfColour(this.state.fillStyle);
    if (!paint || text === '') return;
    const { bold, size } = parseCssFont(this.state.font);
    const font = bold ? this.fonts.bold : this.fonts.regular;
    const align = this.state.textAlign;
    const m = [...this.state.matrix] as Matrix;
    const alpha = paint.alpha * this.state.globalAlpha;
    this.ops.push((doc) => {
      doc.save();
      doc.transform(...m);
      doc.font(font).fontSize(size).fillColor(paint.colour, alpha);
      const w = align === 'center' ? doc.widthOfString(text) / 2 : align === 'right' || align === 'end' ? doc.widthOfString(text) : 0;
      doc.text(text, x - w, y, { lineBreak: false, baseline: 'alphabetic' });
      doc.restore();
    });
  }

  strokeText(): void {
    throw new Error('chart drawing: outlined text is not supported in the report');
  }

  measureText(text: string): { width: number } {
    // vega measures text with its own estimate unless a real canvas library is installed; it
    // does not ask this context. Kept so a call is answered rather than crashing.
    return { width: 0.6 * parseCssFont(this.state.font).size * text.length };
  }

  clearRect(): void {
    throw new Error('chart drawing: clearing is not supported in the report');
  }

  createLinearGradient(): never {
    throw new Error('chart drawing: gradients are not supported in the report');
  }

  createRadialGradient(): never {
    throw new Error('chart drawing: gradients are not supported in the report');
  }

  createPattern(): never {
    throw new Error('chart drawing: patterns are not supported in the report');
  }

  drawImage(): never {
    throw new Error('chart drawing: images are not supported in the report');
  }

  /** Draws what was recorded with its top left corner at (x, y) on the current page; the document's text position is kept. */
  replay(doc: PDFKit.PDFDocument, x: number, y: number): void {
    const at = { x: doc.x, y: doc.y };
    doc.save();
    doc.translate(x, y);
    for (const op of this.ops) op(doc);
    doc.restore();
    doc.x = at.x;
    doc.y = at.y;
  }
}
