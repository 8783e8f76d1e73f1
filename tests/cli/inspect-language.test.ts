// `twofold inspect` names the language of the header words it matched (the invented export
// in sample-tests/languages/, written by sample-tests/layout-writers/lab-languages.ts).
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../cli/main';
import { io } from './capture-io';

const file = (lang: string) => join(__dirname, '../../sample-tests/languages', lang, 'qh0417-day1.csv');

describe('twofold inspect and header languages', () => {
  it('says the German words were matched and reads the blood pressure column as not used', async () => {
    const t = io();
    expect(await main(['inspect', file('de')], t.io)).toBe(0);
    expect(t.out().split('\n')[1]).toBe('header words: German (de)');
    expect(t.out()).toMatch(/RR \[mmHg\]\s+\(ignored\)\s+-\s+a blood pressure; not used \(read in German; in English it would be breathing rate/);
    expect(t.out()).toContain('metadata: subject QH-0417, age 38 y, sex F, height 167 cm, weight 70 kg');
  });

  it('lists the languages in --json', async () => {
    const t = io();
    expect(await main(['inspect', file('sv'), '--json'], t.io)).toBe(0);
    expect(JSON.parse(t.out()).layout.languages).toEqual(['sv']);
  });
});
