// The checklist's steps over the data sections: every field on exactly one step of its own
// section, progress per step (details from the invitation count as "to check"), and the home
// page's "what's next" list. The rules are this product's own (no published source).
import { describe, expect, it } from 'vitest';
import { checklistSteps, dataSteps, resumeStep, stepFromHash, stepOfField, stepProgress } from '@/lib/checklist-steps';
import { customerNext } from '@/lib/customer-next';
import { fieldDefs } from '@/components/checklist/field-defs';
import { sectionProgress } from '@/lib/schemas/checklist';

describe('steps', () => {
  it('puts every field on one step of its own section (the car’s socket beside parking aside), and every step shows at least one field', () => {
    for (const def of fieldDefs) {
      const step = dataSteps.find((s) => s.id === stepOfField(def.path))!;
      expect(step.section, def.path).toBe(def.path === 'vehicle.chargePort' ? 'parking' : def.section);
    }
    for (const step of dataSteps) expect(fieldDefs.some((d) => stepOfField(d.path) === step.id), step.id).toBe(true);
    // The photos of the supply come after the consumer unit's step, and hold no answers.
    expect(checklistSteps.map((s) => s.id)).toEqual(['about', 'home', 'vehicle', 'supply', 'fusebox', 'supplyphotos', 'loads', 'parking', 'charger', 'chargepoint', 'review']);
    expect(fieldDefs.some((d) => (stepOfField(d.path) as string) === 'supplyphotos')).toBe(false);
  });

  it('splits the supply section: meter and fuse, fuse box and earthing, big loads', () => {
    expect(stepOfField('supply.mpanCore')).toBe('supply');
    expect(stepOfField('supply.mainFuseAmps')).toBe('supply');
    expect(stepOfField('supply.earthing')).toBe('fusebox');
    expect(stepOfField('supply.loads.socketCircuits')).toBe('loads');
    expect(stepOfField('vehicle.chargePort')).toBe('parking');
  });

  it('reads the step from the address, old links included', () => {
    expect(stepFromHash('#step=supply')).toBe('supply');
    expect(stepFromHash('#step=loads')).toBe('loads');
    expect(stepFromHash('#step=nonsense')).toBeNull();
  });

  it('loses no gap in the split: the steps list exactly the sections’ missing fields', () => {
    const checklist = { supply: { mainFuseAmps: 80 as const }, charger: { preference: 'tethered' as const } };
    const bySection = sectionProgress(checklist).flatMap((s) => s.missing.map((f) => `${s.id}.${f}`)).sort();
    const bySteps = stepProgress(checklist).flatMap((s) => s.missing).sort();
    expect(bySteps).toEqual(bySection);
  });

  it('counts an unconfirmed detail from the invitation as a gap "to check"', () => {
    const checklist = { about: { fullName: 'Tobias Wren', email: 'tobias@example.com', phone: '+441134960456' } };
    const [about] = stepProgress(checklist, ['about.fullName', 'about.email', 'about.phone']);
    expect(about).toMatchObject({ id: 'about', complete: false, toConfirm: ['about.fullName', 'about.email', 'about.phone'], started: false });
    expect(stepProgress(checklist)[0]).toMatchObject({ complete: true, missing: [] });
    expect(resumeStep(stepProgress(checklist, ['about.email']))).toBe('about');
    expect(resumeStep(stepProgress(checklist))).toBe('home');
  });
});

describe('what’s next on the home page', () => {
  it('lists answers to give, details to check and uploads to send, each with its step, in checklist order', () => {
    const next = customerNext(
      { about: { fullName: 'Tobias Wren', email: 'tobias@example.com', phone: '+441134960456' }, vehicle: { condition: 'new' } },
      ['about.fullName'],
      [{ kind: 'order_agreement', status: 'rejected', reason: 'The page is cut off' }],
    );
    expect(next.needed[0]).toEqual({ step: 'about', stepTitle: 'About you', text: 'Check the details your installer filled in, and confirm them.' });
    expect(next.needed[1]!.step).toBe('home');
    expect(next.needed[1]!.text).toMatch(/^Add the first line of the address, the town, the postcode, whether you own or rent the home and whether it is a house or a flat\.$/);
    const order = next.needed.find((n) => n.text.includes('order agreement'))!;
    expect(order).toEqual({ step: 'vehicle', stepTitle: 'Your vehicle', text: 'Send a new order agreement for the car — your installer said: “The page is cut off”.' });
    expect(next.needed.find((n) => n.text.includes('meter'))).toMatchObject({ step: 'supplyphotos', stepTitle: 'Photos of your supply', text: 'Send a photo of your electricity meter.' });
    expect(next.needed.find((n) => n.step === 'loads')!.text).toBe('Add the big electrical appliances in the home, and how many socket circuits there are.');
    expect(next.done).toEqual([]);
  });
});
