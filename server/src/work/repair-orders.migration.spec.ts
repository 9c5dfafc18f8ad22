import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { afterAll, describe, expect, it } from 'vitest';
import { migrations, migrationsUpTo } from '../test-support/migrations.js';

describe('repair-order snapshot migrations', () => {
  const dir = mkdtempSync(join(tmpdir(), 'baytime-migrations-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('give each RO written before them its customer and vehicle, and make it searchable', () => {
    const connection = new Database(join(dir, 'shop.db'));
    try {
      const db = drizzle(connection);
      migrate(db, { migrationsFolder: migrationsUpTo('0000_initial', join(dir, 'before')) });
      connection.exec(`
        INSERT INTO customers (id, name, phone, email, created_at) VALUES (1, 'Wendell Farrow', '555-0142', 'wendell@example.test', 0);
        INSERT INTO vehicles (id, customer_id, vin, year, make, model, plate, last_odometer)
          VALUES (1, 1, '1M8GDM9AXKP042788', 2019, 'Halvard', 'Morrow', '7KX 221', 61200);
        INSERT INTO repair_orders (id, number, customer_id, vehicle_id, concern, odometer, status, created_at)
          VALUES (1, '4401', 1, 1, 'Service', 61200, 'closed', 0);
      `);
      migrate(db, { migrationsFolder: migrations });
      expect(
        connection
          .prepare(
            'SELECT customer_name, customer_phone, customer_email, vehicle_year, vehicle_make, vehicle_model, vehicle_plate FROM repair_orders',
          )
          .get(),
      ).toEqual({
        customer_name: 'Wendell Farrow',
        customer_phone: '555-0142',
        customer_email: 'wendell@example.test',
        vehicle_year: 2019,
        vehicle_make: 'Halvard',
        vehicle_model: 'Morrow',
        vehicle_plate: '7KX 221',
      });
      const found = (q: string) =>
        connection
          .prepare('SELECT rowid FROM repair_orders_search WHERE repair_orders_search MATCH ?')
          .all(q);
      expect(found('"5550142"')).toEqual([{ rowid: 1 }]);
      expect(found('"042788"')).toEqual([{ rowid: 1 }]);
    } finally {
      connection.close();
    }
  });
});
