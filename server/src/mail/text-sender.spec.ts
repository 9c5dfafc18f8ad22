import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import twilio from 'twilio';
import { afterAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../config/app-config.js';
import { TextSender } from './text-sender.js';
import { TextboxService } from './textbox.service.js';

type RequestOptions = Parameters<twilio.RequestClient['request']>[0];

/** Stands in for the provider's HTTP endpoint: records each request, answers as the API does. */
class RecordingClient extends twilio.RequestClient {
  readonly requests: RequestOptions[] = [];
  constructor(private readonly statusCode: number) {
    super();
  }
  override request(opts: RequestOptions) {
    this.requests.push(opts);
    const body =
      this.statusCode < 300
        ? { sid: 'SM00000000000000000000000000000000', status: 'queued' }
        : { code: 21211, message: "The 'To' number is not a valid phone number.", status: this.statusCode };
    return Promise.resolve({ statusCode: this.statusCode, body, headers: {} } as never);
  }
}

describe(TextSender.name, () => {
  const dataDir = mkdtempSync(join(tmpdir(), 'baytime-texts-'));
  afterAll(() => rmSync(dataDir, { recursive: true, force: true }));
  const env = {
    BAYTIME_DATA_DIR: dataDir,
    BAYTIME_TWILIO_ACCOUNT_SID: 'AC00000000000000000000000000000000',
    BAYTIME_TWILIO_AUTH_TOKEN: 'not-a-real-token',
    BAYTIME_TWILIO_FROM: '+16085550100',
  };

  it('sends through the provider’s SDK when configured, and nothing to the local text box', async () => {
    const config = loadConfig(env);
    const textbox = new TextboxService(config);
    const http = new RecordingClient(201);
    const sut = new TextSender(config, { httpClient: http }, textbox);
    sut.start();
    await sut.send('+16085550177', 'Your car is ready');
    expect(http.requests).toHaveLength(1);
    expect(http.requests[0]).toMatchObject({
      method: 'post',
      uri: 'https://api.twilio.com/2010-04-01/Accounts/AC00000000000000000000000000000000/Messages.json',
      data: { To: '+16085550177', Body: 'Your car is ready', From: '+16085550100' },
    });
    expect(textbox.list({ limit: 10 }).total).toBe(0);
  });

  it('fails the send when the provider refuses, so the outbox retries it', async () => {
    const config = loadConfig(env);
    const sut = new TextSender(config, { httpClient: new RecordingClient(400) }, new TextboxService(config));
    sut.start();
    await expect(sut.send('+16085550177', 'x')).rejects.toThrow(
      "The 'To' number is not a valid phone number.",
    );
  });

  it('refuses half a provider configuration at start-up', () => {
    expect(() => loadConfig({ ...env, BAYTIME_TWILIO_FROM: '' })).toThrow(
      'Set BAYTIME_TWILIO_ACCOUNT_SID, BAYTIME_TWILIO_AUTH_TOKEN and BAYTIME_TWILIO_FROM together',
    );
  });
});
