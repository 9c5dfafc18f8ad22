import { z } from 'zod';
import { vinTextSchema } from './vin.js';

/** `GET /api/vehicles?vin=`: spaces and dashes in the VIN do not matter. */
export const vehicleLookupQuerySchema = z.object({ vin: vinTextSchema });
export type VehicleLookupQuery = z.infer<typeof vehicleLookupQuerySchema>;

/** A vehicle the shop has seen: its details now, its current owner, and its latest repair order. */
export interface KnownVehicle {
  id: number;
  vin: string;
  year: number;
  make: string;
  model: string;
  plate: string | null;
  /** The highest reading the shop has recorded. */
  lastOdometer: number | null;
  customer: { id: number; name: string; phone: string | null; email: string | null };
  lastVisit: { repairOrderId: number; number: string; date: string; odometer: number } | null;
}
