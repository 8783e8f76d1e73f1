/**
 * German header words. `RR` in German clinical use is the blood pressure (after Riva-Rocci),
 * not the breathing rate, which is `AF` (Atemfrequenz) (common practice).
 */
import type { HeaderWords } from './types';

export const DE: HeaderWords = {
  language: 'de',
  name: 'German',
  columns: {
    timeS: ['Zeit', 'Testzeit', 'Belastungszeit', 'Dauer'],
    clock: ['Uhrzeit', 'Tageszeit'],
    vo2MlMin: ['O2-Aufnahme', 'Sauerstoffaufnahme'],
    vco2MlMin: ['CO2-Abgabe', 'Kohlendioxidabgabe'],
    veLMin: ['AMV', 'Atemminutenvolumen', 'Ventilation'],
    hrBpm: ['HF', 'Herzfrequenz', 'Puls'],
    workW: ['Last', 'Leistung', 'Belastung', 'Wattzahl'],
    speedKmh: ['Geschwindigkeit', 'Geschw', 'Tempo'],
    gradePct: ['Steigung', 'Neigung'],
    peto2Mmhg: ['endtidales O2'],
    petco2Mmhg: ['endtidales CO2'],
    rrPerMin: ['AF', 'Atemfrequenz', 'Atemzüge/min'],
    vtL: ['AZV', 'Atemzugvolumen', 'Tidalvolumen'],
    vo2MlKgMin: ['VO2 rel', 'rel. VO2'],
    rpe: ['Borg-Skala', 'Anstrengung'],
    marker: ['Markierung', 'Marker', 'Ereignis'],
    phase: ['Phase', 'Stufe', 'Abschnitt'],
    bloodPressure: ['RR', 'Blutdruck'],
  },
  metadata: {
    subjectId: ['Patient', 'Patienten-ID', 'Patientennummer', 'Proband', 'Probanden-ID', 'ID'],
    date: ['Datum', 'Testdatum', 'Untersuchungsdatum'],
    clock: ['Uhrzeit', 'Startzeit', 'Beginn'],
    ageY: ['Alter', 'Alter (Jahre)'],
    sex: ['Geschlecht'],
    heightCm: ['Größe', 'Körpergröße'],
    weightKg: ['Gewicht', 'Körpergewicht'],
    modality: ['Ergometer', 'Belastungsart', 'Ergometrie'],
    protocol: ['Protokoll'],
    barometricMmhg: ['Luftdruck', 'Barometerdruck'],
  },
  sex: { female: ['w', 'weiblich', 'Frau'], male: ['m', 'männlich', 'Mann'] },
  months: ['Januar', 'Februar', 'März', 'April', 'Mai', 'Juni', 'Juli', 'August', 'September', 'Oktober', 'November', 'Dezember'],
  modality: { cycle: ['Fahrrad', 'Fahrradergometer', 'Radergometer', 'Rad'], treadmill: ['Laufband', 'Laufbandergometer', 'Gehen', 'Laufen'] },
  dayFirst: true,
};
