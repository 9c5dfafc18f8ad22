import {
  Body,
  Controller,
  Get,
  Header,
  HttpCode,
  Param,
  Post,
  UseInterceptors,
  type StreamableFile,
} from '@nestjs/common';
import { z } from 'zod';
import {
  publicApprovalAnswerSchema,
  type PublicApproval,
  type PublicApprovalAnswerBody,
  type PublicApprovalResult,
} from '@baytime/shared';
import { Public } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { ApprovalThrottle } from './approval-throttle.js';
import { ApprovalsService } from './approvals.service.js';
import { Client, type ClientInfo } from './client-request.js';

/** Any text: a token of the wrong shape answers 404 like any wrong token, after it was counted. */
const tokenParam = z.string().max(200);

/** The customer's approval page, reached with the link's token and nothing else. */
@Public()
@UseInterceptors(ApprovalThrottle)
@Controller('public/approvals/:token')
export class PublicApprovalsController {
  constructor(private readonly approvals: ApprovalsService) {}

  @Get()
  @Header('Cache-Control', 'no-store')
  view(@Param('token', { schema: tokenParam }) token: string): PublicApproval {
    return this.approvals.view(token);
  }

  @Post()
  @HttpCode(200)
  @Header('Cache-Control', 'no-store')
  answer(
    @Param('token', { schema: tokenParam }) token: string,
    @Body({ schema: publicApprovalAnswerSchema }) body: PublicApprovalAnswerBody,
    @Client() client: ClientInfo,
  ): PublicApprovalResult {
    return this.approvals.answer(token, body, client);
  }

  @Get('photos/:id')
  @Header('X-Content-Type-Options', 'nosniff')
  @Header('Cache-Control', 'private, no-store')
  photo(
    @Param('token', { schema: tokenParam }) token: string,
    @Param('id', { schema: idParamSchema }) id: number,
  ): StreamableFile {
    return this.approvals.photo(token, id, 'original');
  }

  @Get('photos/:id/preview')
  @Header('X-Content-Type-Options', 'nosniff')
  @Header('Cache-Control', 'private, no-store')
  preview(
    @Param('token', { schema: tokenParam }) token: string,
    @Param('id', { schema: idParamSchema }) id: number,
  ): StreamableFile {
    return this.approvals.photo(token, id, 'preview');
  }
}
