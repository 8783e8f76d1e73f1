/**
 * Spanish header words. A sex of `M` is both `masculino` and `mujer` in Spanish forms, so it
 * is listed under both and never read (common practice; `H`/`V` and `F` are unambiguous).
 */
import type { HeaderWords } from './types';

export const ES: HeaderWords = {
  language: 'es',
  name: 'Spanish',
  columns: {
    timeS: ['Tiempo', 'Duración', 'Tiempo de prueba'],
    clock: ['Hora'],
    vo2MlMin: ['Consumo de O2', 'Consumo O2'],
    vco2MlMin: ['Producción de CO2'],
    veLMin: ['Ventilación', 'Ventilación minuto'],
    hrBpm: ['FC', 'Frecuencia cardiaca', 'Frecuencia cardíaca'],
    workW: ['Carga', 'Potencia'],
    speedKmh: ['Velocidad'],
    gradePct: ['Pendiente', 'Inclinación'],
    peto2Mmhg: ['PO2 teleespiratoria'],
    petco2Mmhg: ['PCO2 teleespiratoria'],
    rrPerMin: ['FR', 'Frecuencia respiratoria'],
    vtL: ['VC', 'Volumen corriente', 'Volumen tidal'],
    vo2MlKgMin: ['VO2 relativo'],
    rer: ['CR', 'Cociente respiratorio'],
    rpe: ['Esfuerzo percibido'],
    marker: ['Marcador', 'Evento'],
    phase: ['Fase', 'Etapa'],
    bloodPressure: ['PA', 'Presión arterial', 'TA', 'Tensión arterial'],
  },
  metadata: {
    subjectId: ['Paciente', 'ID paciente', 'Código paciente', 'Sujeto', 'Identificador'],
    date: ['Fecha', 'Fecha de la prueba'],
    clock: ['Hora', 'Hora de inicio'],
    ageY: ['Edad', 'Edad (años)'],
    sex: ['Sexo'],
    heightCm: ['Talla', 'Altura', 'Estatura'],
    weightKg: ['Peso'],
    modality: ['Ergómetro', 'Modalidad', 'Tipo de prueba'],
    protocol: ['Protocolo'],
    barometricMmhg: ['Presión barométrica', 'Presión atmosférica'],
  },
  sex: { female: ['f', 'm', 'femenino', 'mujer'], male: ['h', 'v', 'm', 'masculino', 'hombre', 'varón'] },
  months: ['enero', 'febrero', 'marzo', 'abril', 'mayo', 'junio', 'julio', 'agosto', 'septiembre', 'octubre', 'noviembre', 'diciembre'],
  modality: { cycle: ['cicloergómetro', 'bicicleta', 'bicicleta estática'], treadmill: ['cinta', 'cinta rodante', 'tapiz rodante', 'cinta sin fin'] },
  dayFirst: true,
};
