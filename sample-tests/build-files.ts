/**
 * Every generated sample file, as bytes in memory: the demo tests in Twofold's layout with
 * their truth, and the first demo test in the invented export layouts. Pure apart from the
 * workbook writer's asynchrony; sample-tests/generate.ts writes the result to disk.
 */
import { writeBreathCsv } from '../core/export/breath-csv';
import { generateTest, type TestTruth } from './generator';
import { LAB_LANGUAGES, writeLabLanguage } from './layout-writers/lab-languages';
import { writeNarrativeSemicolon } from './layout-writers/narrative-semicolon';
import { writeQuotedUtf16 } from './layout-writers/quoted-utf16';
import { writeTabbedUnitsClock } from './layout-writers/tabbed-units-clock';
import { writeWorkbook } from './layout-writers/workbook';
import { DEMO_PAIRS, LAB_NAME, type DemoPair } from './scenario/demo-scenario';

export interface SampleFile {
  /** Path relative to sample-tests/. */
  readonly path: string;
  readonly bytes: Uint8Array;
}

const utf8 = (text: string) => new TextEncoder().encode(text);

/** The truth file: the scenario's context, the model truth, and each outlier's line in the CSV. */
function truthJson(pair: DemoPair, day: 1 | 2, truth: TestTruth, csv: string): string {
  const lines = csv.split('\n');
  const headerLine = lines.findIndex((l) => !l.startsWith('#')) + 1;
  const document = {
    scenario: { lab: LAB_NAME, pair: pair.id, day, outcome: pair.outcome, summary: pair.summary, invented: true },
    ...truth,
    outliers: truth.outliers.map((o) => ({ ...o, csvLine: headerLine + o.index + 1 })),
  };
  return JSON.stringify(document, null, 2) + '\n';
}

/** The layout variants are written from this test. */
export const LAYOUT_SOURCE = { pair: 'qh0417', day: 1 } as const;

export async function buildSampleFiles(): Promise<SampleFile[]> {
  const files: SampleFile[] = [];
  for (const pair of DEMO_PAIRS) {
    for (const [day, test] of [[1, pair.day1], [2, pair.day2]] as const) {
      const { table, truth } = generateTest(test.params, test.seed);
      const csv = writeBreathCsv(table);
      files.push({ path: `demo/${test.name}.csv`, bytes: utf8(csv) });
      files.push({ path: `demo/${test.name}.truth.json`, bytes: utf8(truthJson(pair, day, truth, csv)) });
      if (pair.id === LAYOUT_SOURCE.pair && day === LAYOUT_SOURCE.day) {
        files.push({ path: `layouts/narrative-semicolon/${test.name}.txt`, bytes: utf8(writeNarrativeSemicolon(table, LAB_NAME)) });
        files.push({ path: `layouts/tabbed-units-clock/${test.name}.tsv`, bytes: utf8(writeTabbedUnitsClock(table)) });
        files.push({ path: `layouts/quoted-utf16/${test.name}.csv`, bytes: writeQuotedUtf16(table) });
        files.push({ path: `layouts/workbook/${test.name}.xlsx`, bytes: await writeWorkbook(table, LAB_NAME) });
        for (const language of LAB_LANGUAGES) files.push({ path: `languages/${language}/${test.name}.csv`, bytes: utf8(writeLabLanguage(table, language)) });
      }
    }
  }
  return files;
}
