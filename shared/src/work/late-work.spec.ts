import { describe, expect, it } from 'vitest';
import { isLineLate } from './late-work.js';
import { repairOrderStatus } from './work.schema.js';

const now = new Date('2030-03-05T15:00:00Z');
const soon = '2030-03-05T17:00:00Z';
const past = '2030-03-05T14:00:00Z';

describe(isLineLate.name, () => {
  it('flags a waiting line whose forecast misses the promise, assigned or not', () => {
    expect(isLineLate({ status: 'queued', promisedAt: soon }, { late: true }, now)).toBe(true);
    expect(isLineLate({ status: 'queued', promisedAt: soon }, { late: false }, now)).toBe(false);
  });

  it('flags a held line (no forecast) once its promise has passed', () => {
    expect(isLineLate({ status: 'held', promisedAt: past }, null, now)).toBe(true);
    expect(isLineLate({ status: 'held', promisedAt: soon }, null, now)).toBe(false);
  });

  it('never flags finished or cancelled work, nor work promised for no time', () => {
    expect(isLineLate({ status: 'done', promisedAt: past }, { late: true }, now)).toBe(false);
    expect(isLineLate({ status: 'cancelled', promisedAt: past }, null, now)).toBe(false);
    expect(isLineLate({ status: 'working', promisedAt: null }, { late: true }, now)).toBe(false);
  });
});

describe(repairOrderStatus.name, () => {
  it('is done once every line is done or cancelled, open while one is not, closed once picked up', () => {
    expect(repairOrderStatus([{ status: 'done' }, { status: 'cancelled' }], null)).toBe('done');
    expect(repairOrderStatus([{ status: 'done' }, { status: 'held' }], null)).toBe('open');
    expect(repairOrderStatus([], null)).toBe('open');
    expect(repairOrderStatus([{ status: 'done' }], '2030-03-05T15:00:00Z')).toBe('closed');
  });
});
