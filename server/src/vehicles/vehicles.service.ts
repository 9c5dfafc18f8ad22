import { Inject, Injectable } from '@nestjs/common';
import { desc, eq } from 'drizzle-orm';
import type { KnownVehicle } from '@baytime/shared';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { customers, repairOrders, vehicles } from '../db/schema/index.js';

@Injectable()
export class VehiclesService {
  constructor(@Inject(DB) private readonly db: Db) {}

  /** A returning vehicle by its VIN, with its owner and its latest repair order. */
  byVin(vin: string): KnownVehicle {
    const { vehicle, customer } = foundOrFail(
      this.db
        .select({ vehicle: vehicles, customer: customers })
        .from(vehicles)
        .innerJoin(customers, eq(customers.id, vehicles.customerId))
        .where(eq(vehicles.vin, vin))
        .get(),
      'Vehicle',
    );
    const visit = this.db
      .select({
        repairOrderId: repairOrders.id,
        number: repairOrders.number,
        date: repairOrders.createdAt,
        odometer: repairOrders.odometer,
      })
      .from(repairOrders)
      .where(eq(repairOrders.vehicleId, vehicle.id))
      .orderBy(desc(repairOrders.createdAt), desc(repairOrders.id))
      .limit(1)
      .get();
    return {
      id: vehicle.id,
      vin: vehicle.vin,
      year: vehicle.year,
      make: vehicle.make,
      model: vehicle.model,
      plate: vehicle.plate,
      lastOdometer: vehicle.lastOdometer,
      customer: { id: customer.id, name: customer.name, phone: customer.phone, email: customer.email },
      lastVisit: visit ? { ...visit, date: visit.date.toISOString() } : null,
    };
  }
}
