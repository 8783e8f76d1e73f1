/**
 * The registry of threshold methods, in the order they are shown. Adding a method means one
 * module and one line here; consensus and uncertainty work from this list.
 */
import type { DetectorEntry } from './detector';
import { excessCo2 } from './excess-co2';
import type { HingeMethod } from './hinge-method';
import { peto2 } from './peto2';
import { petco2 } from './petco2';
import { veVco2Ratio } from './ve-vco2-ratio';
import { veVsVco2 } from './ve-vs-vco2';
import { veVo2 } from './ventilatory-equivalents';
import { detect as vslope } from './vslope';
import { vslopeHinge } from './vslope-hinge';
import { detect as vslopeVe } from './vslope-shared';

export const VT1_METHODS: readonly DetectorEntry[] = [
  { threshold: 'vt1', method: 'vslope-ve', detect: vslopeVe },
  { threshold: 'vt1', method: 'vslope', detect: vslope },
  { threshold: 'vt1', method: 'vslope-hinge', detect: vslopeHinge.detect },
  { threshold: 'vt1', method: 've-vo2', detect: veVo2.detect },
  { threshold: 'vt1', method: 'excess-co2', detect: excessCo2.detect },
  { threshold: 'vt1', method: 'peto2', detect: peto2.detect },
];


export const VT2_METHODS: readonly DetectorEntry[] = [
  { threshold: 'vt2', method: 've-vco2-ratio', detect: veVco2Ratio.detect },
  { threshold: 'vt2', method: 'petco2', detect: petco2.detect },
  { threshold: 'vt2', method: 've-vs-vco2', detect: veVsVco2.detect },
];

/** The continuous two-segment methods, by id, for the bootstrap to refit. */
export const HINGE_METHODS: Readonly<Record<string, HingeMethod>> = {
  'vslope-hinge': vslopeHinge,
  've-vo2': veVo2,
  'excess-co2': excessCo2,
  peto2,
  've-vco2-ratio': veVco2Ratio,
  petco2,
  've-vs-vco2': veVsVco2,
};
