import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asc, sql } from 'drizzle-orm';
import { DB, type Db } from '../db/database.js';
import { repairOrders } from '../db/schema/index.js';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
import { DemoShopSeeder } from './demo-shop.js';

describe(DemoShopSeeder.name, () => {
  let sut: TestApp;
  beforeAll(async () => (sut = await startTestApp()));
  afterAll(() => sut.close());

  // A shop numbers its repair orders as it writes them: the office lists them newest first.
  it('numbers its repair orders in the order they were written', () => {
    const written = sut.app
      .get<Db>(DB)
      .select({ number: repairOrders.number, createdAt: repairOrders.createdAt })
      .from(repairOrders)
      .orderBy(asc(sql`cast(${repairOrders.number} as integer)`))
      .all();
    expect(written.length).toBeGreaterThan(20);
    for (const { number } of written) expect(number).toMatch(/^\d+$/);
    const times = written.map((ro) => ro.createdAt.getTime());
    expect(times).toEqual([...times].sort((a, b) => a - b));
  });
});
