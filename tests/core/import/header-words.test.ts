// Reference: the words in core/import/header-words/ as physiologists in each language write
// them (common practice); the expected readings below are what those words mean in German,
// Italian, French, Spanish, Dutch and the Nordic languages, checked by hand.
import { describe, expect, test } from 'vitest';
import { foldWord, readHeaderWords, sexOf, metadataMeanings } from '../../../core/import/header-words/words';
import { LANGUAGES, TRADE_WORDS } from '../../../core/import/header-words/index';
import { matchVariable } from '../../../core/import/variables';
import { readBreathText } from '../../../core/import/read-table';
import { parseMetadata, type MetadataLine } from '../../../core/import/metadata';
import { MMHG_PER_KPA } from '../../../core/import/units';

function lines(texts: string[]): MetadataLine[] {
  return texts.map((text, i) => ({ line: i + 1, text, cells: [text] }));
}

describe('header words', () => {
  test('accents, case, spaces and dashes do not matter', () => {
    expect(foldWord('Körpergröße')).toBe('korpergrosse');
    expect(foldWord('Fréquence cardiaque')).toBe('frequencecardiaque');
    expect(foldWord('Åndedrætsfrekvens')).toBe('andedraetsfrekvens');
  });

  test('every English synonym the importer already read is in the English or trade table, with the same meaning', () => {
    const en = LANGUAGES.find((l) => l.language === 'en')!;
    for (const [meaning, words] of [...Object.entries(en.columns), ...Object.entries(TRADE_WORDS)]) {
      if (meaning === 'marker' || meaning === 'phase' || meaning === 'clock') continue;
      for (const w of words) {
        const known = matchVariable(w);
        if (known !== null) expect(known, w).toBe(meaning);
      }
    }
  });

  test('each language has words for every variable the importer reads and every metadata label', () => {
    const variables = ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW', 'speedKmh', 'gradePct', 'peto2Mmhg', 'petco2Mmhg', 'rrPerMin', 'vtL', 'rpe', 'marker', 'phase'];
    const labels = ['subjectId', 'date', 'ageY', 'sex', 'heightCm', 'weightKg'];
    for (const l of LANGUAGES) {
      for (const v of variables) expect((l.columns as Record<string, string[]>)[v]?.length ?? 0, `${l.language} ${v}`).toBeGreaterThan(0);
      for (const k of labels) expect((l.metadata as Record<string, string[]>)[k]?.length ?? 0, `${l.language} ${k}`).toBeGreaterThan(0);
    }
    expect(LANGUAGES.map((l) => l.language)).toEqual(['en', 'de', 'fr', 'es', 'it', 'nl', 'sv', 'da', 'nb']);
  });

  test.each([
    [['Zeit', 'VO2', 'VCO2', 'VE', 'HF', 'Last'], ['de'], ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW']],
    [['Temps', 'VO2', 'VCO2', 'VE', 'FC', 'Charge', 'FR'], ['fr'], ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW', 'rrPerMin']],
    [['Tiempo', 'VO2', 'VCO2', 'VE', 'Frecuencia cardiaca', 'Carga', 'Volumen corriente'], ['es'], ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW', 'vtL']],
    [['Tempo', 'VO2', 'VCO2', 'VE', 'FC', 'Carico', 'Pendenza'], ['it'], ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW', 'gradePct']],
    [['Tijd', 'VO2', 'VCO2', 'VE', 'Hartfrequentie', 'Belasting', 'Snelheid'], ['nl'], ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'workW', 'speedKmh']],
    [['Tid', 'VO2', 'VCO2', 'VE', 'Hjärtfrekvens', 'Andningsfrekvens'], ['sv'], ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'rrPerMin']],
    [['Tid', 'VO2', 'VCO2', 'VE', 'Hjertefrekvens', 'Hastighed', 'Stigning'], ['da'], ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'speedKmh', 'gradePct']],
    [['Tid', 'VO2', 'VCO2', 'VE', 'Hjertefrekvens', 'Fart', 'Stigning'], ['nb'], ['timeS', 'vo2MlMin', 'vco2MlMin', 'veLMin', 'hrBpm', 'speedKmh', 'gradePct']],
  ])('%j is read in %j', (cells, languages, meanings) => {
    const r = readHeaderWords(cells);
    expect(r.languages).toEqual(languages);
    expect(r.cells.map((c) => c.meaning)).toEqual(meanings);
    expect(r.ambiguities).toEqual([]);
  });

  test('languages that share the words tie and are all named', () => {
    // `Tid` and `HF` are Swedish, Danish and Norwegian alike
    expect(readHeaderWords(['Tid', 'VO2', 'VCO2', 'VE', 'HF']).languages).toEqual(['sv', 'da', 'nb']);
    expect(readHeaderWords(['VO2', 'VCO2', 'VE', 'PetCO2']).languages).toEqual([]);
  });

  test('RR is the breathing rate in an English row and the blood pressure in a German one', () => {
    expect(readHeaderWords(['Time', 'VO2', 'VCO2', 'VE', 'HR', 'RR']).cells[5].meaning).toBe('rrPerMin');
    expect(readHeaderWords(['Zeit', 'VO2', 'VCO2', 'VE', 'HF', 'RR']).cells[5].meaning).toBe('bloodPressure');
  });

  test('a word two candidate languages read differently is an ambiguity, not a reading', () => {
    // German `Tempo` is speed, Italian `Tempo` is time; nothing else in the row names a language
    const r = readHeaderWords(['Tempo', 'VO2', 'VCO2', 'VE']);
    expect(r.cells[0].meaning).toBeNull();
    expect(r.ambiguities).toEqual([{ index: 0, header: 'Tempo', readings: [{ meaning: 'speedKmh', languages: ['de'] }, { meaning: 'timeS', languages: ['it'] }] }]);
  });

  test('the importer stops at an ambiguous column with its line and column, and a column map settles it', () => {
    const text = 'Tempo;VO2;VCO2;VE\n5;300;250;9\n10;310;260;9,5\n';
    const r = readBreathText(text, { sourceName: 'x.csv' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect([r.error.code, r.error.line, r.error.column]).toEqual(['ambiguous-header', 1, 1]);
    expect(r.error.message).toContain('speed in German, or time in Italian');
    const mapped = readBreathText(text, {
      sourceName: 'x.csv',
      mapping: { format: 'twofold-column-map', version: 1, delimiter: null, decimal: null, headerLine: null, columns: [{ header: 'Tempo', variable: 'timeS', unit: 's' }] },
    });
    expect(mapped.ok).toBe(true);
    if (mapped.ok) expect(mapped.value.table.breaths.map((b) => b.timeS)).toEqual([5, 10]);
  });

  test('the header row of the issue imports, with kPa and L/min converted', () => {
    const text = ['Zeit;VO2 [l/min];VCO2 [l/min];VE [l/min];HF [1/min];Last [W];PETO2 [kPa];PETCO2 [kPa]', '0:05;0,280;0,159;8,62;74;0;14,97;3,69', '0:11;0,283;0,222;9,19;75;5;14,90;3,81'].join('\n');
    const r = readBreathText(text, { sourceName: 'zeit.csv' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.layout.languages).toEqual(['de']);
    const b = r.value.table.breaths[1];
    expect(b.timeS).toBe(11);
    expect(b.vo2MlMin).toBeCloseTo(283, 9); // 0.283 L/min · 1000
    expect(b.petco2Mmhg).toBeCloseTo(3.81 * MMHG_PER_KPA, 9); // 28.58 mmHg
    expect(b.hrBpm).toBe(75);
    expect(b.workW).toBe(5);
  });
});

describe('metadata labels in the file’s languages', () => {
  test('German labels, decimal comma and a day-first date make the subject and the test start', () => {
    const m = parseMetadata(lines(['Patient: QH-9', 'Datum: 09/03/2026', 'Uhrzeit: 09:10', 'Alter: 38', 'Geschlecht: w', 'Größe: 1,67 m', 'Gewicht (kg): 70,5']), null, 'd.txt', false, ['de']);
    expect(m.metadata).toMatchObject({ subjectId: 'QH-9', ageY: 38, sex: 'F', weightKg: 70.5, testStart: '2026-03-09T09:10:00' });
    expect(m.metadata.heightCm).toBeCloseTo(167, 9);
    expect(m.warnings).toEqual([]);
  });

  test('the same a/b/yyyy date in an English file is still not guessed', () => {
    const m = parseMetadata(lines(['Date: 09/03/2026', 'Time: 09:10']), null, 'e.txt', false, ['en']);
    expect(m.metadata.testStart).toBeNull();
    expect(m.warnings.map((w) => w.code)).toEqual(['metadata-unreadable']);
  });

  test('Dutch dd-mm-yyyy, Italian Data, Swedish Kön K', () => {
    expect(parseMetadata(lines(['Datum: 02-03-2026', 'Tijd: 8:05']), null, 'n.txt', false, ['nl']).metadata.testStart).toBe('2026-03-02T08:05:00');
    expect(parseMetadata(lines(['Data: 02/03/2026', 'Ora: 8:05']), null, 'i.txt', false, ['it']).metadata.testStart).toBe('2026-03-02T08:05:00');
    expect(parseMetadata(lines(['Kön: K', 'Ålder: 44', 'Längd: 180', 'Vikt: 81,2']), null, 's.txt', false, ['sv']).metadata).toMatchObject({ sex: 'F', ageY: 44, heightCm: 180, weightKg: 81.2 });
  });

  test('a sex letter that is female in one reading and male in another is not read', () => {
    // Spanish forms write M for both masculino and mujer
    const es = parseMetadata(lines(['Sexo: M']), null, 'e.txt', false, ['es']);
    expect(es.metadata.sex).toBeNull();
    expect(es.warnings.map((w) => [w.code, w.line])).toEqual([['metadata-unreadable', 1]]);
    expect(es.metadata.extra).toEqual({ Sexo: 'M' });
    expect(sexOf('V', ['es'])).toBe('M'); // varón
    expect(sexOf('V', ['nl'])).toBe('F'); // vrouw
    expect(sexOf('V', ['es', 'nl'])).toBe('ambiguous');
    expect(sexOf('female', ['de'])).toBe('F');
  });

  test('metadata labels are read in English and the file’s languages only', () => {
    expect(metadataMeanings('Data', ['it']).meanings).toEqual(['date']);
    expect(metadataMeanings('Data', ['en']).meanings).toEqual([]);
    expect(metadataMeanings('Körpergröße', ['de']).meanings).toEqual(['heightCm']);
  });
});

describe('written months and modality words', () => {
  test.each([
    ['Datum: 9. März 2026 09:10', 'de'],
    ['Date : 9 mars 2026 09:10', 'fr'],
    ['Fecha: 9 de marzo de 2026 09:10', 'es'],
    ['Data: 9 marzo 2026 09:10', 'it'],
    ['Datum: 9 maart 2026 09:10', 'nl'],
    ['Datum: 9 mars 2026 09:10', 'sv'],
    ['Dato: 9. marts 2026 09:10', 'da'],
    ['Dato: 9. mars 2026 09:10', 'nb'],
    ['Date: March 9, 2026 09:10', 'en'],
    ['Datum: 9.3.2026 9:10', 'de'],
  ] as const)('%s', (line, lang) => {
    const m = parseMetadata(lines([line]), null, 'm.txt', false, [lang]);
    expect(m.metadata.testStart).toBe('2026-03-09T09:10:00');
    expect(m.warnings).toEqual([]);
  });

  test('a shortened month that could be two months is not read', () => {
    // `jui` begins both juin (June) and juillet (July)
    const m = parseMetadata(lines(['Date: 9 jui 2026']), null, 'm.txt', false, ['fr']);
    expect(m.metadata.testStart).toBeNull();
    expect(m.warnings.map((w) => w.code)).toEqual(['metadata-unreadable']);
  });

  test('modality words of each language; a treadmill ergometer is a treadmill', () => {
    const modality = (line: string, lang: 'de' | 'fr' | 'es' | 'nl' | 'sv' | 'nb') => parseMetadata(lines([line]), null, 'm.txt', false, [lang]).metadata.modality;
    expect(modality('Ergometer: Fahrradergometer', 'de')).toBe('cycle');
    expect(modality('Ergometer: Laufbandergometer', 'de')).toBe('treadmill');
    expect(modality('Ergomètre : tapis roulant', 'fr')).toBe('treadmill');
    expect(modality('Ergómetro: cicloergómetro', 'es')).toBe('cycle');
    expect(modality('Ergometer: loopband', 'nl')).toBe('treadmill');
    expect(modality('Testform: cykel', 'sv')).toBe('cycle');
    expect(modality('Testform: tredemølle', 'nb')).toBe('treadmill');
  });
});
