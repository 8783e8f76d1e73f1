/**
 * Invented layout "lab-languages": the same test written with its labels and column headers
 * in one of nine languages, so that each can be checked against its English twin. A block
 * of `label;value` lines (subject, date in the language's usual order, start time, age,
 * sex, height, weight), a blank line, then one header row with units in brackets: elapsed
 * time in s (1 decimal), VO2 and VCO2 in L/min, VE in L/min, end-tidal pressures in kPa
 * (2 decimals), HR, load, breathing rate, tidal volume in L, Borg, the phase as a word, an
 * empty marker column, and in German and Italian a blood pressure column (`RR`) filled every
 * 120 s. Decimal commas and semicolons in every language but English (decimal point,
 * commas). The words are this writer's own strings, not the importer's tables. LF line ends.
 */
import type { BreathTable } from '../../core/model/breath-table';
import { fixed, MMHG_TO_KPA, rpeByBreath } from './text-cells';

export type LabLanguage = 'en' | 'de' | 'fr' | 'es' | 'it' | 'nl' | 'sv' | 'da' | 'nb';

interface Words {
  readonly labels: readonly [subject: string, date: string, start: string, age: string, sex: string, height: string, weight: string];
  readonly date: (y: string, m: string, d: string) => string;
  readonly female: string;
  readonly male: string;
  readonly columns: readonly [time: string, hr: string, load: string, rr: string, vt: string, phase: string, marker: string];
  readonly rest: string;
  readonly exercise: string;
  readonly bloodPressure: string | null;
}

const WORDS: Readonly<Record<LabLanguage, Words>> = {
  en: { labels: ['Subject', 'Date', 'Start time', 'Age', 'Sex', 'Height [cm]', 'Weight [kg]'], date: (y, m, d) => `${y}-${m}-${d}`, female: 'F', male: 'M', columns: ['Time [s]', 'HR [1/min]', 'Load [W]', 'BF [1/min]', 'VT [l]', 'Phase', 'Marker'], rest: 'rest', exercise: 'exercise', bloodPressure: null },
  de: { labels: ['Patient', 'Datum', 'Uhrzeit', 'Alter', 'Geschlecht', 'Größe [cm]', 'Gewicht [kg]'], date: (y, m, d) => `${d}.${m}.${y}`, female: 'w', male: 'm', columns: ['Zeit [s]', 'HF [1/min]', 'Last [W]', 'AF [1/min]', 'AZV [l]', 'Phase', 'Markierung'], rest: 'Ruhe', exercise: 'Belastung', bloodPressure: 'RR [mmHg]' },
  fr: { labels: ['Patient', 'Date', 'Heure', 'Âge', 'Sexe', 'Taille [cm]', 'Poids [kg]'], date: (y, m, d) => `${d}/${m}/${y}`, female: 'F', male: 'H', columns: ['Temps [s]', 'FC [1/min]', 'Charge [W]', 'FR [1/min]', 'VC [l]', 'Palier', 'Marqueur'], rest: 'repos', exercise: 'effort', bloodPressure: null },
  es: { labels: ['Paciente', 'Fecha', 'Hora', 'Edad', 'Sexo', 'Talla [cm]', 'Peso [kg]'], date: (y, m, d) => `${d}/${m}/${y}`, female: 'mujer', male: 'hombre', columns: ['Tiempo [s]', 'FC [1/min]', 'Carga [W]', 'FR [1/min]', 'VC [l]', 'Fase', 'Marcador'], rest: 'reposo', exercise: 'ejercicio', bloodPressure: null },
  it: { labels: ['Paziente', 'Data', 'Ora', 'Età', 'Sesso', 'Altezza [cm]', 'Peso [kg]'], date: (y, m, d) => `${d}/${m}/${y}`, female: 'F', male: 'M', columns: ['Tempo [s]', 'FC [1/min]', 'Carico [W]', 'FR [1/min]', 'VC [l]', 'Fase', 'Marcatore'], rest: 'riposo', exercise: 'esercizio', bloodPressure: 'RR [mmHg]' },
  nl: { labels: ['Patiënt', 'Datum', 'Tijd', 'Leeftijd', 'Geslacht', 'Lengte [cm]', 'Gewicht [kg]'], date: (y, m, d) => `${d}-${m}-${y}`, female: 'V', male: 'M', columns: ['Tijd [s]', 'HF [1/min]', 'Belasting [W]', 'AF [1/min]', 'Teugvolume [l]', 'Fase', 'Markering'], rest: 'rust', exercise: 'inspanning', bloodPressure: null },
  sv: { labels: ['Patient', 'Datum', 'Starttid', 'Ålder', 'Kön', 'Längd [cm]', 'Vikt [kg]'], date: (y, m, d) => `${y}-${m}-${d}`, female: 'K', male: 'M', columns: ['Tid [s]', 'HF [1/min]', 'Belastning [W]', 'AF [1/min]', 'Tidalvolym [l]', 'Fas', 'Markering'], rest: 'vila', exercise: 'arbete', bloodPressure: null },
  da: { labels: ['Patient', 'Dato', 'Klokkeslæt', 'Alder', 'Køn', 'Højde [cm]', 'Vægt [kg]'], date: (y, m, d) => `${d}-${m}-${y}`, female: 'K', male: 'M', columns: ['Tid [s]', 'HF [1/min]', 'Belastning [W]', 'RF [1/min]', 'Tidalvolumen [l]', 'Fase', 'Markering'], rest: 'hvile', exercise: 'arbejde', bloodPressure: null },
  nb: { labels: ['Pasient', 'Dato', 'Klokkeslett', 'Alder', 'Kjønn', 'Høyde [cm]', 'Vekt [kg]'], date: (y, m, d) => `${d}.${m}.${y}`, female: 'K', male: 'M', columns: ['Tid [s]', 'HF [1/min]', 'Belastning [W]', 'RF [1/min]', 'Tidalvolum [l]', 'Fase', 'Markering'], rest: 'hvile', exercise: 'arbeid', bloodPressure: null },
};

export const LAB_LANGUAGES = Object.keys(WORDS) as LabLanguage[];

export function writeLabLanguage(table: BreathTable, language: LabLanguage): string {
  const w = WORDS[language];
  const mark = language === 'en' ? '.' : ',';
  const sep = language === 'en' ? ',' : ';';
  const m = table.metadata;
  const start = m.testStart ?? '';
  const [y, mo, d] = [start.slice(0, 4), start.slice(5, 7), start.slice(8, 10)];
  const values = [m.subjectId ?? '', w.date(y, mo, d), start.slice(11, 16), String(m.ageY ?? ''), m.sex === 'F' ? w.female : m.sex === 'M' ? w.male : '', fixed(m.heightCm, 0, mark), fixed(m.weightKg, 1, mark)];
  const preamble = w.labels.map((label, i) => `${label}${sep}${values[i]}`);
  const [time, hr, load, rr, vt, phase, marker] = w.columns;
  const header = [time, 'VO2 [l/min]', 'VCO2 [l/min]', 'VE [l/min]', hr, load, 'PETO2 [kPa]', 'PETCO2 [kPa]', rr, vt, 'Borg', phase, marker, ...(w.bloodPressure ? [w.bloodPressure] : [])];
  const rpe = rpeByBreath(table);
  let nextPressureS = 0;
  const rows = table.breaths.map((b) => {
    let pressure = '';
    if (w.bloodPressure && b.timeS >= nextPressureS) {
      pressure = `${120 + Math.round((b.workW ?? 0) / 4)}/80`;
      nextPressureS += 120;
    }
    return [
      fixed(b.timeS, 1, mark),
      fixed(b.vo2MlMin / 1000, 3, mark),
      fixed(b.vco2MlMin / 1000, 3, mark),
      fixed(b.veLMin, 2, mark),
      fixed(b.hrBpm, 0, mark),
      fixed(b.workW, 0, mark),
      fixed(b.peto2Mmhg === null ? null : b.peto2Mmhg * MMHG_TO_KPA, 2, mark),
      fixed(b.petco2Mmhg === null ? null : b.petco2Mmhg * MMHG_TO_KPA, 2, mark),
      fixed(b.rrPerMin, 1, mark),
      fixed(b.vtL, 3, mark),
      rpe.has(b) ? String(rpe.get(b)) : '',
      (b.workW ?? 0) > 0 ? w.exercise : w.rest,
      '',
      ...(w.bloodPressure ? [pressure] : []),
    ].join(sep);
  });
  return [...preamble, '', header.join(sep), ...rows].join('\n') + '\n';
}
