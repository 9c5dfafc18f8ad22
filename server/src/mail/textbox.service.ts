import { Inject, Injectable, NotFoundException } from '@nestjs/common';
import { randomUUID } from 'node:crypto';
import { join } from 'node:path';
import type { Page, PageQuery, TextboxEntry } from '@baytime/shared';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { JsonIndex } from './json-index.js';

/**
 * The local stand-in for an SMS provider, used when none is configured: it keeps every text under
 * `dataDir/textbox/` so the owner can read what was sent, the way the local mailbox keeps e-mail.
 */
@Injectable()
export class TextboxService {
  private readonly index: JsonIndex<TextboxEntry>;

  constructor(@Inject(APP_CONFIG) config: AppConfig) {
    this.index = new JsonIndex(join(config.dataDir, 'textbox', 'index.json'));
  }

  record(from: string, to: string, body: string): TextboxEntry {
    const entry: TextboxEntry = { id: randomUUID(), from, to, body, date: new Date().toISOString() };
    this.index.append(entry);
    return entry;
  }

  list(query: PageQuery): Page<TextboxEntry> {
    return this.index.page(query);
  }

  get(id: string): TextboxEntry {
    const entry = this.index.find(id);
    if (!entry) throw new NotFoundException('Text not found');
    return entry;
  }
}
