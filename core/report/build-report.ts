/**
 * The two-day report as a PDF/A-3b document, built with pdfkit from a recomputed case.
 * Same input, same bytes: the creation date is the `generatedAt` passed in, fonts come in
 * as bytes (DejaVu Sans, for VO₂, ≥, Δ, −), and nothing is read from the clock or the disk
 * here. The two raw breath files and the case file are embedded as associated files
 * (PDF/A-3, ISO 19005-3), so the report carries everything needed to recompute it.
 * Layout (Twofold's own): the pair at a glance and the neutral summary, the comparison and
 * matched-workload tables, one section per day (effort, thresholds, charts), methods and
 * settings with their sources, provenance, the reviewer log, the signature block.
 */
import PDFDocument from 'pdfkit';
import type { CaseFile } from '../case/case-file';
import type { CaseOutcome, DayOutcome, RawBytes, ThresholdState } from '../case/recompute';
import { sha256Hex } from '../case/sha256';
import type { Comparison } from '../compare/compare-tests';
import { metricDefinition } from '../compare/metric-catalog';
import { bandStatement } from '../compare/bands';
import { verdictWords } from '../compare/change-interval';
import { pageOne } from '../compare/page-one';
import { CAUTIONS } from '../compare/wording';
import type { ThresholdId } from '../model/analysis';
import { SETTING_SOURCES, type Settings } from '../model/settings';
import { SOFTWARE_NAME, SOFTWARE_VERSION } from '../version';
import { endTidalSpec, equivalentsSpec, overlaySpec, drawChart, placeChartRow, vslopeSpec, type ChartThresholds } from './charts';
import { MISSING, reportFormat } from './format';
import { localeByTag } from '../locale/locales';
import { ACCENT, INK, Layout, MUTED, WARN } from './layout';
import { describeAction } from './log-text';
import { followUpSection, followUpSummaryLine } from './follow-up-section';
import { timeCells } from './time-text';
import { matchedReadingText } from '../compare/matched';
import { REVIEWER_MARK, metricReviewerMark, reviewerMark, reviewerMarkNote } from './reviewer-mark';
import { settingsInWords } from './settings-text';
import { dayMeasuresBlock } from './day-measures';
import { effortBlock } from './effort-table';
import { draftReason, drawDraftMark, signOffInForce } from './draft-mark';
import { BUILD_RECORD_NAME, buildRecordText, logHeadOf } from './build-record';
import { attachFile } from './attach-file';

export type SignatureKind = 'lab' | 'demonstration' | 'unsigned';

export interface ReportInput {
  readonly caseFile: CaseFile;
  /** The case file exactly as saved, embedded byte for byte. */
  readonly caseText: string;
  readonly outcome: CaseOutcome<Comparison>;
  readonly raw: RawBytes;
  readonly fonts: { readonly regular: Uint8Array; readonly bold: Uint8Array };
  /** ISO 8601 date-time the report is built, from the shell's clock. */
  readonly generatedAt: string;
  /** "Name, credential" of the reviewer who signs, or null. */
  readonly reviewer: string | null;
  readonly signature: SignatureKind;
}

export const DEMO_NOTICE =
  'DEMONSTRATION ONLY. The data are invented and the report is signed with a certificate Twofold generated for the demonstration. This is not a clinical signature and not a clinical report.';

const PAGE_SIZES = { a4: 'A4', letter: 'LETTER' } as const;

export async function buildReport(input: ReportInput): Promise<Uint8Array> {
  const { caseFile, outcome } = input;
  const created = new Date(input.generatedAt);
  const subject = outcome.day1.analysis.metadata.subjectId ?? 'subject not stated';
  const doc = new PDFDocument({
    size: PAGE_SIZES[caseFile.settings.report.paper],
    margins: { top: 46, bottom: 52, left: 50, right: 50 },
    subset: 'PDF/A-3b',
    pdfVersion: '1.7',
    bufferPages: true,
    lang: 'en',
    displayTitle: true,
    // PDF/A wants the Info dictionary and the XMP packet to agree. pdfkit writes the XMP from
    // these fields (pdf:Producer from Creator, no xmp:ModifyDate, no XML escaping), hence one
    // tool string, no ModDate, and markup characters kept out.
    info: {
      Title: xmpSafe(`Two-day CPET report, ${subject}`),
      Author: xmpSafe(input.reviewer ?? SOFTWARE_NAME),
      Subject: 'Day 2 against day 1 cardiopulmonary exercise test comparison',
      Creator: `${SOFTWARE_NAME} ${SOFTWARE_VERSION}`,
      Producer: `${SOFTWARE_NAME} ${SOFTWARE_VERSION}`,
      CreationDate: created,
    },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const finished = new Promise<Uint8Array>((resolve, reject) => {
    doc.on('end', () => {
      // A view of the one joined buffer, not a second copy of the whole report.
      const joined = Buffer.concat(chunks);
      resolve(new Uint8Array(joined.buffer, joined.byteOffset, joined.byteLength));
    });
    doc.on('error', reject);
  });
  doc.registerFont('Sans', Buffer.from(input.fonts.regular));
  doc.registerFont('Sans-Bold', Buffer.from(input.fonts.bold));
  // Numbers and dates in the locale the case records (neutral `en` for a case without one).
  const L = new Layout(doc, { regular: 'Sans', bold: 'Sans-Bold' }, reportFormat(localeByTag(caseFile.reportLocale)));

  titleBlock(L, input, subject);
  comparisonSection(L, outcome.comparison, outcome);
  matchedSection(L, outcome);
  for (const day of [outcome.day1, outcome.day2]) await daySection(L, day);
  await overlaySection(L, outcome);
  hrSection(L, outcome);
  await followUpSection(L, caseFile, outcome.comparison.pairing.intervalH);
  methodsSection(L, caseFile.settings, outcome);
  provenanceSection(L, input);
  logSection(L, caseFile);
  signatureSection(L, input);
  footers(L, subject, input);
  attach(doc, input, created);
  doc.end();
  return finished;
}

function xmpSafe(text: string): string {
  return text.replace(/&/g, 'and').replace(/[<>]/g, '');
}

function titleBlock(L: Layout, input: ReportInput, subject: string): void {
  const { doc } = L;
  const { day1, day2, comparison } = input.outcome;
  doc.rect(L.left, doc.y, L.width, 2).fill(ACCENT);
  doc.moveDown(0.5);
  doc.font('Sans-Bold').fontSize(17).fillColor(INK).text('Two-day cardiopulmonary exercise test', L.left, doc.y, { width: L.width });
  doc.font('Sans').fontSize(10).fillColor(MUTED).text(`Day 2 against day 1 · ${subject} · built ${L.f.dateTime(input.generatedAt)}`, { width: L.width });
  doc.moveDown(0.5);
  if (input.signature === 'demonstration') L.notice('Demonstration', DEMO_NOTICE, WARN);
  const m1 = day1.analysis.metadata;
  const m2 = day2.analysis.metadata;
  const lab = m1.extra['lab'] ?? m1.extra['Lab'] ?? m2.extra['lab'] ?? m2.extra['Lab'] ?? 'not stated in the files';
  const interval = comparison.pairing.intervalH;
  L.facts([
    ['Subject', subject],
    ['Lab', lab],
    ['Age, sex', `${m1.ageY ?? MISSING} y, ${m1.sex ?? MISSING}`],
    ['Height, mass', `${L.f.fixed(m1.heightCm, 0)} cm, ${L.f.fixed(m1.weightKg, 1)} kg`],
    ['Day 1 start', L.f.dateTime(m1.testStart)],
    ['Day 2 start', L.f.dateTime(m2.testStart)],
    ['Interval', interval === null ? 'unknown (a start time is missing)' : `${L.f.fixed(interval, 1)} h`],
    ['Ergometer', m1.modality ?? m2.modality ?? 'not stated'],
    ['Protocol, day 1', m1.protocol ?? rampText(L, day1)],
    ['Protocol, day 2', m2.protocol ?? rampText(L, day2)],
    ['Effort, day 1', day1.analysis.effort.verdict],
    ['Effort, day 2', day2.analysis.effort.verdict],
  ]);
  const page = pageOne(comparison, L.f.locale);
  L.subheading('Finding');
  for (const sentence of page.sentences) L.paragraph(L.f.prose(sentence));
  // A day that was not judged maximal says why on page 1 (the first reason is the deciding
  // one, e.g. too many impossible values in the recording).
  for (const [d, day] of [[1, day1], [2, day2]] as const) {
    const e = day.analysis.effort;
    if (e.verdict !== 'maximal') L.paragraph(L.f.prose(`Effort, day ${d}: ${e.verdict}. ${e.reasons[0] ?? ''}`), { color: WARN });
  }
  const recovery = followUpSummaryLine(input.caseFile);
  if (recovery) L.paragraph(L.f.prose(recovery));
  L.paragraph(L.f.prose(`${page.bandLine} ${page.bandBasis}`), { size: 8, color: MUTED });
  const table = (t: typeof page.primary, widths: readonly number[], firstNumeric: number) =>
    L.table(t.header.map((header, i) => ({ header, width: widths[i], align: i >= firstNumeric && i < t.header.length - 1 ? ('right' as const) : undefined })), t.rows.map((r) => [...r]));
  if (page.primary.rows.length > 0) table(page.primary, [0.24, 0.1, 0.1, 0.1, 0.16, 0.16, 0.14], 1);
  for (const w of comparison.pairing.warnings) L.paragraph(`${w.severity === 'hard' ? 'Pairing problem' : 'Pairing note'}: ${L.f.prose(w.message)}`, { color: WARN });
  L.notice('Cautions', CAUTIONS, ACCENT);
  if (page.secondary.rows.length > 0) table(page.secondary, [0.3, 0.12, 0.1, 0.1, 0.08, 0.16, 0.14], 2);
}

function rampText(L: Layout, day: DayOutcome): string {
  const r = day.analysis.phases.rampWPerMin;
  return r === null ? 'not stated' : `ramp ${L.f.fixed(r, 0)} W/min (measured)`;
}

function comparisonSection(L: Layout, c: Comparison, outcome: CaseOutcome<Comparison>): void {
  L.heading('Day 2 against day 1');
  L.paragraph(L.f.prose(bandStatement(c.band)), { size: 8, color: MUTED });
  const sources: string[] = [];
  const sourceNo = (s: string) => {
    const i = sources.indexOf(s);
    if (i >= 0) return i + 1;
    sources.push(s);
    return sources.length;
  };
  const digits = metricDigits;
  const rows = c.metrics.map((m) => {
    const d = digits(m.unit);
    const time = timeCells(m.unit, m.day1, m.day2, m.delta);
    return [
      `${m.label}${metricReviewerMark(outcome, metricDefinition(m.id).threshold)}`,
      time?.unit ?? (m.unit || '–'),
      time?.day1 ?? L.f.fixed(m.day1, d),
      time?.day2 ?? L.f.fixed(m.day2, d),
      time?.delta ?? L.f.signed(m.delta, d),
      L.f.signed(m.deltaPct, 1),
      m.band ? `${L.f.signed(m.band.lowPct, 1)}/${L.f.signed(m.band.highPct, 1)} [${sourceNo(`${m.band.origin}: ${m.band.source}`)}]` : MISSING,
      verdictWords(m.verdict),
    ];
  });
  L.table(
    [
      { header: 'Metric', width: 0.22 },
      { header: 'Unit', width: 0.13 },
      { header: 'Day 1', width: 0.09, align: 'right' },
      { header: 'Day 2', width: 0.09, align: 'right' },
      { header: 'Δ', width: 0.09, align: 'right' },
      { header: 'Δ %', width: 0.08, align: 'right' },
      { header: 'Reproduced %', width: 0.14, align: 'right' },
      { header: 'Call', width: 0.16 },
    ],
    rows,
  );
  L.paragraph(sources.map((s, i) => `[${i + 1}] ${s}`).join('   '), { size: 7, color: MUTED });
  const marked = reviewerMarkNote([outcome.day1, outcome.day2]);
  if (marked) L.paragraph(marked, { size: 7.5, color: MUTED });
  const notes = c.metrics.filter((m) => m.verdict === 'not_comparable').map((m) => `${m.label}: ${L.f.prose(m.reason ?? '')}`);
  if (notes.length > 0) L.paragraph(`Not compared. ${notes.join(' ')}`, { size: 7.5, color: MUTED });
}

/** Decimals the comparison table prints a metric with, by its unit (`twofold verify` reads them back). */
export function metricDigits(unit: string): number {
  return unit === 'mL/min' || unit === 'W' || unit === 'bpm' || unit === 's' ? 0 : unit === '' ? 2 : 1;
}

const READING_WORDS: Readonly<Record<string, string>> = { 'local-fit': 'local fit', 'window-mean': 'window mean', none: 'not read' };

function matchedSection(L: Layout, outcome: CaseOutcome<Comparison>): void {
  const c = outcome.comparison;
  L.heading('At matched workloads');
  if (!c.matched.available) {
    L.paragraph(`Not available: ${L.f.prose(c.matched.reason ?? '')}`);
    return;
  }
  L.paragraph(`${matchedReadingText(c.matched.windowW)} Common range ${L.f.fixed(c.matched.rangeW[0], 0)}–${L.f.fixed(c.matched.rangeW[1], 0)} W in ${L.f.fixed(c.matched.stepW, 0)} W steps, plus each day's VT1 workload.`, { size: 8, color: MUTED });
  const kind = (k: string) => (k === 'step' ? '' : k === 'vt1_day1' ? ` (VT1 day 1${reviewerMark(outcome.day1, 'vt1') ? ` ${REVIEWER_MARK}` : ''})` : ` (VT1 day 2${reviewerMark(outcome.day2, 'vt1') ? ` ${REVIEWER_MARK}` : ''})`);
  const read = (r: { day1: string; day2: string }) => (r.day1 === r.day2 ? READING_WORDS[r.day1] : `${READING_WORDS[r.day1]} / ${READING_WORDS[r.day2]}`);
  const rows = c.matched.rows.map((r) => [
    `${L.f.fixed(r.workW, 0)}${kind(r.kind)}`,
    L.f.fixed(r.values.vo2MlMin.day1, 0),
    L.f.fixed(r.values.vo2MlMin.day2, 0),
    L.f.signed(r.values.vo2MlMin.deltaPct, 1),
    L.f.fixed(r.values.hrBpm.day1, 0),
    L.f.fixed(r.values.hrBpm.day2, 0),
    L.f.fixed(r.values.veLMin.day1, 1),
    L.f.fixed(r.values.veLMin.day2, 1),
    L.f.fixed(r.values.rer.day1, 2),
    L.f.fixed(r.values.rer.day2, 2),
    read(r.reading),
  ]);
  L.table(
    [
      { header: 'Work (W)', width: 0.15 },
      { header: 'VO₂ d1', width: 0.08, align: 'right' },
      { header: 'VO₂ d2', width: 0.08, align: 'right' },
      { header: 'VO₂ Δ %', width: 0.09, align: 'right' },
      { header: 'HR d1', width: 0.07, align: 'right' },
      { header: 'HR d2', width: 0.07, align: 'right' },
      { header: 'VE d1', width: 0.08, align: 'right' },
      { header: 'VE d2', width: 0.08, align: 'right' },
      { header: 'RER d1', width: 0.08, align: 'right' },
      { header: 'RER d2', width: 0.08, align: 'right' },
      { header: 'Read by', width: 0.14 },
    ],
    rows,
    { size: 7.5 },
  );
  const note = reviewerMarkNote([outcome.day1, outcome.day2], ['vt1']);
  L.paragraph(`VO₂ in mL/min, HR in bpm, VE in L/min BTPS.${note ? ` ${note}` : ''}`, { size: 7, color: MUTED });
}

async function daySection(L: Layout, day: DayOutcome): Promise<void> {
  const a = day.analysis;
  L.doc.addPage();
  L.heading(`Day ${day.day}: ${a.sourceName}`);
  effortBlock(L, a.effort, a.provenance.settings.effort);
  dayMeasuresBlock(L, day);
  for (const id of ['vt1', 'vt2'] as const) thresholdBlock(L, id, day[id]);
  const used: ChartThresholds = { vt1: day.vt1.effective, vt2: day.vt2.effective };
  // Vega's width is the plot area; axis titles, labels and the legend take about 60 pt more.
  const w = (L.width - 8) / 2 - 62;
  // The V-slope plot is square (equal axis scales); the chart beside it takes the rest of the row.
  const square = 150;
  await chartRow(L, [vslopeSpec(a, used, `V-slope, day ${day.day}`, square), equivalentsSpec(a, used, `Ventilatory equivalents, day ${day.day}`, L.width - 8 - (square + 70) - 62, 150)]);
  await chartRow(L, [endTidalSpec(a, used, `End-tidal pressures, day ${day.day}`, w, 120)]);
  if (a.warnings.length > 0) {
    L.subheading('Analysis notes');
    for (const note of a.warnings) L.paragraph(`• ${L.f.prose(note)}`, { size: 8 });
  }
}

function thresholdBlock(L: Layout, id: ThresholdId, state: ThresholdState): void {
  const name = id.toUpperCase();
  const auto = state.automatic;
  L.subheading(name);
  L.table(
    [
      { header: 'Method', width: 0.28 },
      { header: 'Time (m:ss)', width: 0.12, align: 'right' },
      { header: 'VO₂ (mL/min)', width: 0.14, align: 'right' },
      { header: 'Source or reason', width: 0.46 },
    ],
    auto.methods.map((m) => (m.found ? [m.label, L.f.minSec(m.timeS), L.f.fixed(m.vo2MlMin, 0), m.source] : [m.label, MISSING, MISSING, `not found: ${L.f.prose(m.reason ?? '')}`])),
    { size: 7.5 },
  );
  const consensus = auto.at ? `automatic consensus ${L.f.minSec(auto.at.timeS)}, VO₂ ${L.f.fixed(auto.at.vo2MlMin, 0)} mL/min` : `no automatic estimate (${L.f.prose(auto.reason ?? 'no method found it')})`;
  const ci = auto.ci95Vo2MlMin ? `, ${auto.ciLabel ?? '95% interval'} ${L.f.fixed(auto.ci95Vo2MlMin[0], 0)}–${L.f.fixed(auto.ci95Vo2MlMin[1], 0)} mL/min` : '';
  const spread = auto.spreadVo2MlMin !== null ? `; methods span ${L.f.fixed(auto.spreadVo2MlMin, 0)} mL/min${auto.methodsDisagree ? ' (they disagree)' : ''}` : '';
  L.paragraph(`${consensus}${ci}${spread}.`, { size: 8.5 });
  const o = state.override;
  if (o) {
    L.paragraph(`Used: set by the reviewer, ${o.who} (${o.role}), ${L.f.dateTime(o.at)}, log entry ${o.seq}: ${L.f.minSec(o.point.timeS)}, VO₂ ${L.f.fixed(o.point.vo2MlMin, 0)} mL/min (given as a ${o.givenAs === 'vo2' ? 'VO₂' : 'time'}). Reason: ${o.reason}`, { size: 8.5, bold: true, color: WARN });
  } else if (auto.at) {
    L.paragraph(`Used: the automatic consensus.`, { size: 8.5, bold: true });
  }
}

async function chartRow(L: Layout, specs: Record<string, unknown>[]): Promise<void> {
  const charts = await Promise.all(specs.map((s) => drawChart(s, L.fonts, L.f.locale.tag === 'en' ? undefined : L.f.locale)));
  placeChartRow(L, charts, 4, 6);
}

async function overlaySection(L: Layout, outcome: CaseOutcome<Comparison>): Promise<void> {
  L.doc.addPage();
  L.heading('Both days against workload');
  const w = (L.width - 8) / 2 - 62;
  await chartRow(L, [
    overlaySpec(outcome.day1.analysis, outcome.day2.analysis, 'vo2MlMin', 'VO₂ against workload', w, 160),
    overlaySpec(outcome.day1.analysis, outcome.day2.analysis, 'hrBpm', 'HR against workload', w, 160),
  ]);
}

function hrSection(L: Layout, outcome: CaseOutcome<Comparison>): void {
  L.heading('Heart rate at VT1');
  L.paragraph('Measured facts from these tests, shown beside rules of thumb that are used when no test exists. None of this is a prescription; pacing advice is the clinician\'s decision.', { size: 8.5 });
  const rows = [outcome.day1, outcome.day2].map((d) => {
    const a = d.analysis;
    const hrMax = a.predicted.hrMaxBpm;
    const resting = a.clinical.restingHrBpm;
    return [
      `Day ${d.day}`,
      a.vt1.at?.hrBpm != null ? `${L.f.fixed(a.vt1.at.hrBpm, 0)} bpm${reviewerMark(d, 'vt1') ? ` ${REVIEWER_MARK}` : ''}` : 'not available',
      hrMax !== null ? `${L.f.fixed(0.55 * hrMax, 0)}–${L.f.fixed(0.6 * hrMax, 0)} bpm (of ${L.f.fixed(hrMax, 0)})` : 'age not stated',
      resting !== null ? `${L.f.fixed(resting + 15, 0)} bpm (rest ${L.f.fixed(resting, 0)})` : 'resting HR not given',
    ];
  });
  L.table(
    [
      { header: '', width: 0.12 },
      { header: 'Measured HR at VT1', width: 0.24 },
      { header: 'Rule of thumb: 55–60% of age-predicted HRmax', width: 0.36 },
      { header: 'Rule of thumb: resting HR + 15 bpm', width: 0.28 },
    ],
    rows,
  );
  const marked = reviewerMarkNote([outcome.day1, outcome.day2], ['vt1']);
  L.paragraph(`Rules of thumb: common practice. Age-predicted HRmax by the formula in the settings (${SETTING_SOURCES['effort.hrMaxFormula']}).${marked ? ` ${marked}` : ''}`, { size: 7, color: MUTED });
}

function methodsSection(L: Layout, settings: Settings, outcome: CaseOutcome<Comparison>): void {
  L.doc.addPage();
  L.heading('Methods and settings');
  const methods = new Map<string, string>();
  for (const d of [outcome.day1, outcome.day2]) for (const t of [d.vt1.automatic, d.vt2.automatic]) for (const m of t.methods) methods.set(m.label, m.source);
  L.table(
    [
      { header: 'Threshold method', width: 0.3 },
      { header: 'Source', width: 0.7 },
    ],
    [...methods].map(([label, source]) => [label, source]),
    { size: 7.5 },
  );
  L.table(
    [
      { header: 'Topic', width: 0.11 },
      { header: 'Setting in use', width: 0.47 },
      { header: 'Source', width: 0.42 },
    ],
    settingsInWords(settings).map((line) => [line.topic, line.text, line.source]),
    { size: 7 },
  );
  L.paragraph('The same settings, with their keys, are in the case file attached to this PDF.', { size: 7, color: MUTED });
}

function provenanceSection(L: Layout, input: ReportInput): void {
  L.heading('Provenance');
  const { inputs } = input.caseFile;
  L.facts([
    ['Software', `${SOFTWARE_NAME} ${SOFTWARE_VERSION}`],
    ['Built', L.f.dateTime(input.generatedAt)],
    ['Case opened', L.f.dateTime(input.caseFile.createdAt)],
    ['Number format', L.f.locale.tag === 'en' ? 'decimal point, ISO 8601 dates' : `${L.f.locale.tag}: decimal ${L.f.locale.decimal === ',' ? 'comma' : 'point'}, dates as ${L.f.dateTime('2026-03-09')}`],
  ]);
  L.paragraph(`Digest of every recomputed number (SHA-256): ${input.outcome.recorded.digest}`, { size: 7.5 });
  L.table(
    [
      { header: 'Embedded file', width: 0.27 },
      { header: 'Bytes', width: 0.08, align: 'right' },
      { header: 'SHA-256', width: 0.65 },
    ],
    [
      [`day 1: ${inputs.day1.name}`, L.f.integer(inputs.day1.sizeBytes), inputs.day1.sha256],
      [`day 2: ${inputs.day2.name}`, L.f.integer(inputs.day2.sizeBytes), inputs.day2.sha256],
      ['case file: twofold-case.json', L.f.integer(Buffer.byteLength(input.caseText)), sha256Hex(input.caseText)],
    ],
    { size: 6.5 },
  );
  L.paragraph('These files and a build record are attached to this PDF. `twofold verify` checks the signature, extracts them, checks their SHA-256 and recomputes every number from them.', { size: 7.5, color: MUTED });
}

function logSection(L: Layout, caseFile: CaseFile): void {
  L.heading('Reviewer log');
  if (caseFile.log.length === 0) {
    L.paragraph('No reviewer actions: every threshold is the automatic estimate.');
    return;
  }
  L.table(
    [
      { header: '#', width: 0.04 },
      { header: 'When', width: 0.17 },
      { header: 'Who (role)', width: 0.16 },
      { header: 'Action', width: 0.27 },
      { header: 'Reason', width: 0.24 },
      { header: 'Hash', width: 0.12 },
    ],
    caseFile.log.map((e) => [String(e.seq), L.f.dateTime(e.at), `${e.who} (${e.role})`, describeAction(e.action, L.f), e.reason, `${e.hash.slice(0, 12)}…`]),
    { size: 7 },
  );
  L.paragraph('Each entry carries the SHA-256 of the one before it, so an edited history does not load.', { size: 7, color: MUTED });
}

function signatureSection(L: Layout, input: ReportInput): void {
  L.heading('Signature');
  L.ensure(110);
  const signOff = signOffInForce(input.caseFile);
  const statement = signOff && signOff.action.kind === 'sign-off' ? `${signOff.action.statement} (${signOff.who}, ${signOff.role}, ${L.f.dateTime(signOff.at)}, log entry ${signOff.seq})` : `DRAFT. ${draftReason(input.caseFile)}`;
  L.facts([
    ['Reviewer', input.reviewer ?? 'not named'],
    ['Statement', statement],
    ['Signature', input.signature === 'lab' ? "digital signature with the lab's certificate (see the PDF's signature panel)" : input.signature === 'demonstration' ? 'demonstration certificate, not a clinical signature' : 'unsigned'],
  ]);
  if (input.signature === 'demonstration') L.notice('Demonstration', DEMO_NOTICE, WARN);
}

function footers(L: Layout, subject: string, input: ReportInput): void {
  const { doc } = L;
  const range = doc.bufferedPageRange();
  const draft = signOffInForce(input.caseFile) === null;
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    if (draft) drawDraftMark(L);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    const y = doc.page.height - 34;
    const tag = `${input.signature === 'demonstration' ? 'DEMONSTRATION · ' : ''}${draft ? 'DRAFT · ' : ''}`;
    doc.font('Sans').fontSize(7).fillColor(MUTED).text(`${tag}${SOFTWARE_NAME} ${SOFTWARE_VERSION} · ${subject} · supports licensed clinicians, does not diagnose`, L.left, y, { width: L.width - 70, lineBreak: false });
    doc.text(`page ${L.f.integer(i + 1)} of ${L.f.integer(range.count)}`, L.left + L.width - 70, y, { width: 70, align: 'right', lineBreak: false });
    doc.page.margins.bottom = bottom;
  }
}

function attach(doc: InstanceType<typeof PDFDocument>, input: ReportInput, created: Date): void {
  const { inputs } = input.caseFile;
  const utf8 = (text: string) => new TextEncoder().encode(text);
  attachFile(doc, input.raw.day1, { name: `day1-${inputs.day1.name}`, type: 'text/plain', relationship: 'Source', created, description: `Day 1 raw breath file, SHA-256 ${inputs.day1.sha256}` });
  attachFile(doc, input.raw.day2, { name: `day2-${inputs.day2.name}`, type: 'text/plain', relationship: 'Source', created, description: `Day 2 raw breath file, SHA-256 ${inputs.day2.sha256}` });
  attachFile(doc, utf8(input.caseText), { name: 'twofold-case.json', type: 'application/json', relationship: 'Data', created, description: 'Twofold case file: settings, clinical inputs, reviewer log, recorded results' });
  const record = buildRecordText({ format: 'twofold-build', version: 1, generatedAt: input.generatedAt, reviewer: input.reviewer, signature: input.signature, softwareVersion: SOFTWARE_VERSION, logHead: logHeadOf(input.caseFile) });
  attachFile(doc, utf8(record), { name: BUILD_RECORD_NAME, type: 'application/json', relationship: 'Data', created, description: 'Twofold build record: build time, reviewer, signature kind, reviewer-log head' });
}
