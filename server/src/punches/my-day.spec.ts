import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FindingDto, MyDay } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { findings } from '../db/schema/index.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { MyDayService } from './my-day.service.js';

describe(MyDayService.name, () => {
  let sut: TestApp;
  let advisor: string;
  let dana: string;
  let jo: string;

  const myDay = async (token: string) =>
    (await sut.http().get('/api/me/day').auth(token, { type: 'bearer' }).expect(200)).body as MyDay;
  const raiseFinding = async (token: string, lineId: number, note: string) =>
    (
      await sut
        .http()
        .post(`/api/job-lines/${lineId}/findings`)
        .auth(token, { type: 'bearer' })
        .field('note', note)
        .field('severity', 'soon')
        .field('holdForApproval', 'true')
        .expect(201)
    ).body as FindingDto;
  const answer = (findingId: number, body: object) =>
    sut
      .http()
      .post(`/api/findings/${findingId}/answer`)
      .auth(advisor, { type: 'bearer' })
      .send({ channel: 'phone', ...body })
      .expect(200);

  beforeAll(async () => {
    sut = await startTestApp();
    advisor = await sut.signIn(DEMO.advisor);
    dana = (await sut.badge('1041')).accessToken;
    jo = (await sut.badge('1045')).accessToken;
  });
  afterAll(() => sut.close());

  describe('answeredFindings', () => {
    it('lists the answers to findings on the technician’s own lines, with the note, for 24 hours', async () => {
      const danaLine = (await myDay(dana)).lines[0]!;
      const joDay = await myDay(jo);
      const joLine = joDay.lines[0]!;
      expect(joDay.lines.map((line) => line.id)).not.toContain(danaLine.id);

      const approved = await raiseFinding(dana, danaLine.id, 'Torn boot on the\ninner tie rod end');
      const declined = await raiseFinding(dana, danaLine.id, 'Coolant seeping at the water pump');
      const stale = await raiseFinding(dana, danaLine.id, 'Rear wiper blade split');
      const joFinding = await raiseFinding(jo, joLine.id, 'Cabin filter clogged with leaves');
      expect((await myDay(dana)).answeredFindings).toEqual([]);

      await answer(approved.id, { answer: 'approved', bookHours: 1.1 });
      await answer(declined.id, { answer: 'declined' });
      await answer(stale.id, { answer: 'declined' });
      await answer(joFinding.id, { answer: 'approved', bookHours: 0.3 });
      const db = sut.app.get<Db>(DB);
      db.update(findings)
        .set({ answeredAt: new Date(Date.now() - 25 * 3600_000) })
        .where(eq(findings.id, stale.id))
        .run();

      const day = await myDay(dana);
      expect([...day.answeredFindings].sort((a, b) => a.findingId - b.findingId)).toEqual([
        {
          findingId: approved.id,
          jobLineId: danaLine.id,
          note: 'Torn boot on the\ninner tie rod end',
          answer: 'approved',
          answeredAt: expect.any(String),
        },
        {
          findingId: declined.id,
          jobLineId: danaLine.id,
          note: 'Coolant seeping at the water pump',
          answer: 'declined',
          answeredAt: expect.any(String),
        },
      ]);
      for (const answered of day.answeredFindings)
        expect(Date.now() - Date.parse(answered.answeredAt)).toBeLessThan(60_000);
      // Jo's own answer is on her day, and only there.
      expect((await myDay(jo)).answeredFindings.map((a) => a.findingId)).toEqual([joFinding.id]);
    });
  });
});
