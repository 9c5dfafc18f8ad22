import {
  Body,
  Controller,
  Get,
  HttpCode,
  Param,
  Patch,
  Post,
  Query,
  UploadedFiles,
  UseGuards,
  UseInterceptors,
} from '@nestjs/common';
import { FilesInterceptor } from '@nestjs/platform-express';
import {
  changeFindingAnswerSchema,
  createFindingSchema,
  findingAnswerSchema,
  findingsPageQuerySchema,
  MAX_FINDING_PHOTOS,
  type ChangeFindingAnswerBody,
  type CreateFindingBody,
  type FindingAnswerBody,
  type FindingAnswerResult,
  type FindingDto,
  type FindingsPage,
  type FindingsPageQuery,
  findingQuoteSchema,
  type FindingQuoteBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { FindingRateLimit } from './finding-rate-limit.js';
import { FindingsService } from './findings.service.js';
import { PhotoUploadErrors, photoUploadOptions, type UploadedPhoto } from './photo-upload.js';

@Controller()
export class FindingsController {
  constructor(private readonly findings: FindingsService) {}

  /** multipart/form-data: the text fields of `createFindingSchema` and up to 6 files in `photos`. */
  @Roles('technician', 'foreman', 'owner')
  @Post('job-lines/:id/findings')
  @UseGuards(FindingRateLimit)
  @UseInterceptors(PhotoUploadErrors, FilesInterceptor('photos', MAX_FINDING_PHOTOS, photoUploadOptions))
  create(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: createFindingSchema }) body: CreateFindingBody,
    @UploadedFiles() photos: UploadedPhoto[] | undefined,
    @CurrentUser() actor: Principal,
  ): Promise<FindingDto> {
    return this.findings.create(id, body, photos ?? [], actor);
  }

  @Roles('advisor', 'foreman', 'owner')
  @Get('findings')
  list(@Query({ schema: findingsPageQuerySchema }) query: FindingsPageQuery): FindingsPage {
    return this.findings.list(query);
  }

  @Roles('advisor', 'foreman', 'owner')
  @Post('findings/:id/answer')
  @HttpCode(200)
  answer(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: findingAnswerSchema }) body: FindingAnswerBody,
    @CurrentUser() actor: Principal,
  ): FindingAnswerResult {
    return this.findings.answer(id, body, actor);
  }

  @Roles('advisor', 'foreman', 'owner')
  @Patch('findings/:id/answer')
  changeAnswer(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: changeFindingAnswerSchema }) body: ChangeFindingAnswerBody,
    @CurrentUser() actor: Principal,
  ): FindingAnswerResult {
    return this.findings.changeAnswer(id, body, actor);
  }

  @Roles('advisor', 'owner')
  @Patch('findings/:id/quote')
  quote(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: findingQuoteSchema }) body: FindingQuoteBody,
    @CurrentUser() actor: Principal,
  ): FindingDto {
    return this.findings.quote(id, body, actor);
  }
}
