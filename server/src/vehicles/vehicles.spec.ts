import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { KnownVehicle } from '@baytime/shared';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { VehiclesService } from './vehicles.service.js';

// 49 CFR 565.15 worked example: check digit X, model year K = 2019.
const VIN = '1M8GDM9AXKP042788';

describe(VehiclesService.name, () => {
  let sut: TestApp;
  let advisor: string;
  const lookUp = (vin: string, token = advisor) =>
    sut
      .http()
      .get(`/api/vehicles?vin=${encodeURIComponent(vin)}`)
      .auth(token, { type: 'bearer' });
  const write = (customer: object, vehicle: object, odometer: number) =>
    sut
      .http()
      .post('/api/repair-orders')
      .auth(advisor, { type: 'bearer' })
      .send({
        customer,
        vehicle: { vin: VIN, year: 2019, make: 'Halvard', model: 'Morrow', odometer, ...vehicle },
        concern: 'Service',
        lines: [{ title: 'Inspect', bookHours: 0.5 }],
      })
      .expect(201);

  beforeAll(async () => {
    sut = await startTestApp();
    advisor = await sut.signIn(DEMO.advisor);
  });
  afterAll(() => sut.close());

  it('answers 404 for a VIN the shop has not seen', async () => {
    const { body } = await lookUp(VIN).expect(404);
    expect(body.message).toBe('Vehicle not found');
  });

  it('gives a returning vehicle with its owner now and its latest visit, whatever the spacing of the VIN', async () => {
    await write(
      { name: 'Wendell Farrow', phone: '(608) 555-0142', email: 'wendell@example.test' },
      {},
      61_200,
    );
    const { body: last } = await write(
      { name: 'Wendell Farrow' },
      { plate: '7KX 221', model: 'Morrow Touring' },
      64_950,
    );
    const { body } = await lookUp(' 1m8gdm9a-xkp 042788 ').expect(200);
    expect(body as KnownVehicle).toEqual({
      id: expect.any(Number),
      vin: VIN,
      year: 2019,
      make: 'Halvard',
      model: 'Morrow Touring',
      plate: '7KX 221',
      lastOdometer: 64_950,
      customer: {
        id: expect.any(Number),
        name: 'Wendell Farrow',
        phone: '+16085550142',
        email: 'wendell@example.test',
      },
      lastVisit: { repairOrderId: last.id, number: last.number, date: last.createdAt, odometer: 64_950 },
    });
  });

  it('refuses text that is no VIN at the field', async () => {
    const { body } = await lookUp('1M8*GDM').expect(400);
    expect(body.issues).toEqual([{ path: ['vin'], message: 'A VIN has only letters and digits' }]);
  });

  it('is for the office only', async () => {
    const tech = await sut.badge('1044');
    await lookUp(VIN, tech.accessToken).expect(403);
  });
});
