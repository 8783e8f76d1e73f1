/** Test helper: the demo pair opened as a new case through the workbench service, as the intake screen does; returns its case id. */
import { dispatch } from '../../../host/workbench/api';
import type { createWiredService } from '../../../host/workbench/wiring';

export const NO_CLINICAL = { peakRpe: null, lactateMmolL: null, fev1L: null, mvvLMin: null, restingHrBpm: null };

export async function openDemoCase(service: ReturnType<typeof createWiredService>): Promise<string> {
  const demo = await dispatch(service, 'demoPair', {});
  if (!demo.ok) throw new Error(demo.error.message);
  const pair = demo.value as { day1: unknown; day2: unknown; title: string };
  const created = await dispatch(service, 'createCase', { title: pair.title, day1: pair.day1, day2: pair.day2, clinical: { day1: NO_CLINICAL, day2: NO_CLINICAL } });
  if (!created.ok) throw new Error(created.error.message);
  return (created.value as { caseId: string }).caseId;
}
