import { Controller, Get, Query } from '@nestjs/common';
import { pageQuerySchema, type Page, type PageQuery, type TextboxEntry } from '@baytime/shared';
import { Roles } from '../common/decorators/auth.decorators.js';
import { TextboxService } from './textbox.service.js';

/** What the local fake text box received: the owner checks the shop's texts without a provider. */
@Roles('owner')
@Controller('textbox')
export class TextboxController {
  constructor(private readonly textbox: TextboxService) {}

  @Get()
  list(@Query({ schema: pageQuerySchema }) query: PageQuery): Page<TextboxEntry> {
    return this.textbox.list(query);
  }
}
