import { Controller, Get, Param, Query } from '@nestjs/common';
import { z } from 'zod';
import {
  pageQuerySchema,
  type MailboxEntry,
  type MailboxMessage,
  type Page,
  type PageQuery,
} from '@baytime/shared';
import { Roles } from '../common/decorators/auth.decorators.js';
import { MailboxService } from './mailbox.service.js';

/** What the local fake SMTP server received: the owner checks the shop's e-mail without a mail server. */
@Roles('owner')
@Controller('mailbox')
export class MailboxController {
  constructor(private readonly mailbox: MailboxService) {}

  @Get()
  list(@Query({ schema: pageQuerySchema }) query: PageQuery): Page<MailboxEntry> {
    return this.mailbox.list(query);
  }

  @Get(':id')
  get(@Param('id', { schema: z.uuid('A message id is a uuid') }) id: string): MailboxMessage {
    return this.mailbox.get(id);
  }
}
