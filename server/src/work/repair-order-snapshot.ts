import type { customers, vehicles } from '../db/schema/index.js';

type CustomerDetails = Pick<typeof customers.$inferSelect, 'name' | 'phone' | 'email'>;
type VehicleDetails = Pick<typeof vehicles.$inferSelect, 'year' | 'make' | 'model' | 'plate'>;

/**
 * The customer and vehicle as a repair order records them when it is written. The RO keeps these
 * for good: a later visit that changes the owner, the contact or the plate does not rewrite it.
 */
export function repairOrderSnapshot(customer: CustomerDetails, vehicle: VehicleDetails) {
  return {
    customerName: customer.name,
    customerPhone: customer.phone,
    customerEmail: customer.email,
    vehicleYear: vehicle.year,
    vehicleMake: vehicle.make,
    vehicleModel: vehicle.model,
    vehiclePlate: vehicle.plate,
  };
}
