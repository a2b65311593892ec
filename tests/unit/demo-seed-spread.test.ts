import { describe, expect, it } from 'vitest';
import { chandlersChecklist, forgeChecklist, heronChecklist } from '../../seeds/demo-checklists';
import { runChecks, type ChecklistAnswers, type Light, type SiteMeasures, type UploadSummary } from '@/lib/readiness';

// The demo seed should show the office a spread of lights under the readiness rules. The
// expected lights are worked by hand from the same sources as the checks' own tests.
const today = new Date().toISOString().slice(0, 10);
const accepted = (kinds: UploadSummary['kind'][]): UploadSummary[] => kinds.map((kind) => ({ kind, status: 'accepted' }));
const photos = accepted(['meter_photo', 'cutout_photo', 'consumer_unit_photo', 'charger_location_photo']);

function lights(answers: unknown, uploads: UploadSummary[], site: SiteMeasures = {}): { light: Light; byCheck: Record<string, Light> } {
  const result = runChecks({ answers: answers as ChecklistAnswers, uploads, site, today });
  return { light: result.light, byCheck: Object.fromEntries(result.checks.map((c) => [c.id, c.light])) };
}

describe('the demo seed under the readiness rules', () => {
  it('27 Chandlers Way clears every check', () => {
    // Measured 24 A + 32 A (7.4 kW, 722.311) = 56 A: 44 A spare on 100 A, ≤ 60 A → connect and notify.
    // TN-S; 6 m through the wall → 4 mm² (4D4A method C 38 A ≥ In 32 A, from memory; 12 × 32 × 6 / 1000 = 2.3 V).
    const { light, byCheck } = lights(chandlersChecklist(), photos, { measuredMaxDemandAmps: 24 });
    expect(byCheck).toEqual(Object.fromEntries(Object.keys(byCheck).map((id) => [id, 'green'])));
    expect(light).toBe('green');
  });

  it('8 Heron Close needs attention but nothing blocks it', () => {
    // Measured 44 + 32 = 76 A: room on 100 A, but over 60 A → apply to connect (amber); 24 m is a long run (amber).
    const uploads = [...photos, ...accepted(['order_agreement', 'landlord_permission'])];
    const { light, byCheck } = lights(heronChecklist(), uploads, { measuredMaxDemandAmps: 44, earthingMeasure: 'open-pen-device' });
    expect(light).toBe('amber');
    expect(byCheck['supply-headroom']).toBe('green');
    expect(byCheck['network-operator']).toBe('amber');
    expect(byCheck['earthing']).toBe('green');
  });

  it('The Old Forge is blocked: a 10.5 kW shower, cooker and immersion on a 60 A cut-out', () => {
    // Even one socket circuit: 32 + 5.74 + 45.65 + 20.04 + 13.04 + 32 = 148.5 A > 60 A → red.
    const { light, byCheck } = lights(forgeChecklist(), [{ kind: 'consumer_unit_photo', status: 'rejected', reason: 'Too dark.' }]);
    expect(light).toBe('red');
    expect(byCheck['supply-headroom']).toBe('red');
    expect(byCheck['earthing']).toBe('amber');
  });
});
