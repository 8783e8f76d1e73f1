/** English header words (common practice of English-speaking labs). Trade abbreviations are in trade.ts. */
import type { HeaderWords } from './types';

export const EN: HeaderWords = {
  language: 'en',
  name: 'English',
  columns: {
    timeS: ['t', 'time', 'elapsed', 'elapsed time', 'test time'],
    clock: ['clock', 'clock time', 'time of day'],
    vo2MlMin: ['O2 uptake'],
    vco2MlMin: ['CO2 output'],
    veLMin: ['ventilation', 'minute ventilation'],
    hrBpm: ['HR', 'heart rate'],
    workW: ['load', 'power', 'work', 'workload', 'work rate', 'WR'],
    speedKmh: ['speed'],
    gradePct: ['grade', 'incline'],
    peto2Mmhg: ['end tidal O2'],
    petco2Mmhg: ['end tidal CO2'],
    rrPerMin: ['BF', 'RR', 'fR', 'RF', 'breathing frequency', 'respiratory rate', 'resp rate', 'breaths/min'],
    vtL: ['tidal volume', 'tidal vol'],
    vo2MlKgMin: ['VO2 per kg', 'rel VO2'],
    rpe: ['perceived exertion', 'exertion'],
    marker: ['marker', 'event'],
    phase: ['phase', 'stage'],
  },
  metadata: {
    subjectId: ['subject', 'subject id', 'subject code', 'patient', 'patient id', 'patient code', 'participant', 'participant id', 'id'],
    date: ['date', 'test date'],
    clock: ['time', 'start time', 'test time'],
    ageY: ['age', 'age y', 'age years'],
    sex: ['sex', 'gender'],
    heightCm: ['height', 'stature'],
    weightKg: ['weight', 'body mass', 'body weight', 'mass'],
    protocol: ['protocol'],
    barometricMmhg: ['barometric', 'barometric pressure', 'pb', 'pbar', 'barometer', 'air pressure'],
  },
  sex: { female: ['f', 'female', 'woman', 'w'], male: ['m', 'male', 'man'] },
  dayFirst: false,
};
