import { describe, expect, it } from 'vitest';
import { failedModuleUrl, loadFailure, probeModule, probeTarget } from './load-failure';

const MODULE = 'https://shop.test/kiosk/assets/sign-in-Bq3x9.js';
const chromium = new TypeError(`Failed to fetch dynamically imported module: ${MODULE}`);
const safari = new TypeError('Importing a module script failed.');
const html = { status: 200, contentType: 'text/html; charset=UTF-8' };
const script = { status: 200, contentType: 'text/javascript; charset=UTF-8' };

describe('loadFailure', () => {
  it('takes a module that fails to load offline for the network, not for an update', () => {
    expect(loadFailure(chromium, 'unreachable')).toBe('offline');
    expect(loadFailure(safari, 'unreachable')).toBe('offline');
  });

  it('says the kiosk was updated once the server answers the module’s address with a page', () => {
    expect(loadFailure(chromium, html)).toBe('updated');
    expect(loadFailure(chromium, { status: 404, contentType: 'application/json' })).toBe('updated');
  });

  it('offers to try again when the module is there after all', () => {
    expect(loadFailure(chromium, script)).toBe('retry');
  });

  it('asks for a reload when the server is there but the browser did not name the module', () => {
    expect(loadFailure(safari, html)).toBe('updated');
  });

  it('waits for the answer, and leaves other errors alone', () => {
    expect(loadFailure(chromium, null)).toBe('checking');
    expect(loadFailure(new Error('boom'), 'unreachable')).toBe('other');
    expect(loadFailure('boom', null)).toBe('other');
  });
});

describe('probeTarget', () => {
  it('asks for the module the browser named, or else the start page', () => {
    expect(failedModuleUrl(chromium)).toBe(MODULE);
    expect(probeTarget(chromium, '/kiosk/')).toBe(MODULE);
    expect(probeTarget(safari, '/kiosk/')).toBe('/kiosk/');
  });
});

describe('probeModule', () => {
  it('reports what answered, and nothing answering as unreachable', async () => {
    const answering: typeof fetch = (_url, init) => {
      expect(init?.method).toBe('HEAD');
      return Promise.resolve(new Response(null, { status: 200, headers: { 'content-type': 'text/html' } }));
    };
    const offline: typeof fetch = () => Promise.reject(new TypeError('Failed to fetch'));
    expect(await probeModule(MODULE, answering)).toEqual({ status: 200, contentType: 'text/html' });
    expect(await probeModule(MODULE, offline)).toBe('unreachable');
  });
});
