import { Body, Controller, Delete, HttpCode, Param, Patch, Post } from '@nestjs/common';
import {
  cancelJobLineSchema,
  editJobLineSchema,
  finishLineSchema,
  holdLineSchema,
  patchJobLineSchema,
  resolutionSchema,
  type CancelJobLineBody,
  type EditJobLineBody,
  type FinishLineBody,
  type HoldLineBody,
  type JobLineDto,
  type PatchJobLineBody,
  type ResolutionBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { JobLinesService } from './job-lines.service.js';

@Controller('job-lines')
export class JobLinesController {
  constructor(private readonly lines: JobLinesService) {}

  @Roles('foreman', 'owner')
  @Patch(':id')
  patch(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: patchJobLineSchema }) body: PatchJobLineBody,
    @CurrentUser() actor: Principal,
  ): JobLineDto {
    return this.lines.patch(id, body, actor);
  }

  @Roles('advisor', 'foreman', 'owner')
  @Patch(':id/details')
  editDetails(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: editJobLineSchema }) body: EditJobLineBody,
    @CurrentUser() actor: Principal,
  ): JobLineDto {
    return this.lines.editDetails(id, body, actor);
  }

  @Roles('advisor', 'foreman', 'owner')
  @Post(':id/cancel')
  @HttpCode(200)
  cancel(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: cancelJobLineSchema }) body: CancelJobLineBody,
    @CurrentUser() actor: Principal,
  ): JobLineDto {
    return this.lines.cancel(id, body, actor);
  }

  @Roles('advisor', 'foreman', 'owner')
  @Delete(':id')
  @HttpCode(204)
  remove(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): void {
    this.lines.remove(id, actor);
  }

  @Roles('technician', 'foreman', 'owner')
  @Post(':id/hold')
  @HttpCode(200)
  hold(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: holdLineSchema }) body: HoldLineBody,
    @CurrentUser() actor: Principal,
  ): JobLineDto {
    return this.lines.hold(id, body, actor);
  }

  @Roles('technician', 'foreman', 'owner')
  @Post(':id/resume')
  @HttpCode(200)
  resume(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): JobLineDto {
    return this.lines.resume(id, actor);
  }

  @Roles('technician', 'foreman', 'owner')
  @Post(':id/done')
  @HttpCode(200)
  finish(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: finishLineSchema }) body: FinishLineBody,
    @CurrentUser() actor: Principal,
  ): JobLineDto {
    return this.lines.finish(id, body, actor);
  }

  /** A line done with too little clocked time: a foreman vouches for it, with a reason (audited). */
  @Roles('foreman', 'owner')
  @Post(':id/sign-off')
  @HttpCode(200)
  signOff(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: resolutionSchema }) body: ResolutionBody,
    @CurrentUser() actor: Principal,
  ): JobLineDto {
    return this.lines.signOff(id, body, actor);
  }
}
