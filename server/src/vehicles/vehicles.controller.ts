import { Controller, Get, Query } from '@nestjs/common';
import { vehicleLookupQuerySchema, type KnownVehicle, type VehicleLookupQuery } from '@baytime/shared';
import { Roles } from '../common/decorators/auth.decorators.js';
import { VehiclesService } from './vehicles.service.js';

@Roles('owner', 'foreman', 'advisor')
@Controller('vehicles')
export class VehiclesController {
  constructor(private readonly vehicles: VehiclesService) {}

  @Get()
  byVin(@Query({ schema: vehicleLookupQuerySchema }) query: VehicleLookupQuery): KnownVehicle {
    return this.vehicles.byVin(query.vin);
  }
}
