/** SHA-256 of whole analyses (bootstrap on) of generated tests, for the identity check of the bootstrap's scratch arrays. */
import { createHash } from 'node:crypto';
import { analyzeTest, noClinicalInputs } from '../../../core/analyze/analyze-test';
import { DEFAULT_SETTINGS } from '../../../core/model/settings';
import { defaultCycleParams, generateTest } from '../../../sample-tests/generator';

export function analysisDigest(seed: number, rampWPerMin: number): string {
  const base = defaultCycleParams();
  if (base.protocol.kind !== 'cycle-ramp') throw new Error('the default protocol is expected to be a cycle ramp');
  const table = generateTest({ ...base, name: 'digest', protocol: { ...base.protocol, rampWPerMin } }, seed).table;
  const result = analyzeTest(table, DEFAULT_SETTINGS, noClinicalInputs());
  return createHash('sha256').update(JSON.stringify(result)).digest('hex');
}
