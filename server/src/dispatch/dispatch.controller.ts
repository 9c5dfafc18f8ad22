import { Controller, Get } from '@nestjs/common';
import type { DispatchBoard } from '@baytime/shared';
import { Roles } from '../common/decorators/auth.decorators.js';
import { DispatchService } from './dispatch.service.js';

@Controller('dispatch')
export class DispatchController {
  constructor(private readonly dispatch: DispatchService) {}

  @Roles('foreman', 'owner', 'advisor')
  @Get()
  view(): DispatchBoard {
    return this.dispatch.view();
  }
}
