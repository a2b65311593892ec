// Customers read customer words only; odd ids and numbers are answered 404/422, never 500.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { newCustomer, newStaff } from '../helpers/people';

// PME earthing with no open soil by the charge point: BS 7671:2018+A2:2022 Regulation 722.411.4.1
// asks for an open-PEN device or an electrode; the check tells the firm to choose one ("The office or surveyor to
// record the 722.411.4.1 measure…") — a staff action the customer must not be shown.
const checklist = {
  supply: { mainFuseAmps: 100, looped: 'no', earthing: 'pme', loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false } },
  charger: { cableRunMetres: 8, route: 'through-wall', softGround: false },
};

let admin: Client;
beforeAll(async () => {
  admin = (await newStaff('admin')).client;
});

describe('customers see customer words only', () => {
  it('leaves staffText, figures and the firm’s own actions out of every answer a customer gets', async () => {
    const { client, case: c } = await newCustomer({ checklist });
    const staff = await admin.json(`/api/cases/${c!.id}/readiness`);
    expect(staff.body.checks.some((x: { staffText?: string }) => typeof x.staffText === 'string')).toBe(true);
    // Every action a check writes is for the firm; none may reach the customer, however worded.
    const staffActions = staff.body.checks.flatMap((x: { actions: string[] }) => x.actions) as string[];
    expect(staffActions.some((a) => /^the (office|installer|surveyor)/i.test(a))).toBe(true);

    const answers = [
      await client.json(`/api/cases/${c!.id}/readiness`),
      await client.json(`/api/cases/${c!.id}`),
      await client.send('PATCH', `/api/cases/${c!.id}/checklist`, { about: { fullName: 'Orla Penhallow' } }),
    ];
    for (const a of answers) {
      expect(a.status).toBe(200);
      const text = JSON.stringify(a.body);
      expect(text).not.toContain('staffText');
      expect(text).not.toContain('"figures"');
      expect(text).not.toContain('"actions"');
      for (const action of staffActions) expect(text).not.toContain(action);
    }
    // The customer still gets their own words and the things they can do.
    const mine = answers[0]!.body.checks as { light: string; customerText: string; customerActions: { place: string; text: string }[] }[];
    expect(mine.every((x) => x.customerText.length > 0)).toBe(true);
    expect(mine.filter((x) => x.light !== 'green').every((x) => x.customerActions.length > 0)).toBe(true);
  });

  it('answers bad ids and numbers with 404 or 422, never 500', async () => {
    const { client } = await newCustomer();
    const badIds = ['not-a-uuid', '-'.repeat(36), '00000000-0000-0000-0000-00000000000g', 'ZZZZZZZZ-ZZZZ-ZZZZ-ZZZZ-ZZZZZZZZZZZZ'];
    for (const id of badIds) {
      for (const path of [`/api/cases/${id}`, `/api/cases/${id}/readiness`, `/api/cases/${id}/uploads`, `/api/uploads/${id}`, `/my/cases/${id}`]) {
        const r = await client.fetch(path);
        expect(r.status, path).toBe(404);
      }
      for (const path of [`/api/cases/${id}/audit`, `/api/cases/${id}/emails`, `/api/cases/${id}/pack.pdf`, `/office/cases/${id}`]) {
        const r = await admin.fetch(path);
        expect(r.status, path).toBe(404);
      }
      expect((await admin.send('PATCH', `/api/staff/${id}`, { active: false })).status).toBe(404);
    }
    for (const q of ['page=1e308', 'page=-1', 'page=NaN', 'pageSize=1e308', 'deliveryWithin=1e400', 'page=99999999999999999999']) {
      const r = await admin.json(`/api/cases?${q}`);
      expect(r.status, q).toBe(422);
      expect(r.body.error.code).toBe('invalid');
    }
    expect((await admin.fetch('/office?page=1e308')).status).toBeLessThan(500);
  });
});
