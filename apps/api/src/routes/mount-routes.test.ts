import { get } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type Response } from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { AppDeps } from '../app-deps.ts';
import { mountRoutes } from './mount-routes.ts';
import { defineRoute } from './route-registry.ts';

// Routes marked `heavy` (whole-firm reads) are worked on at most HEAVY_READS_AT_ONCE at a time; the rest wait their
// turn and are all answered (README, "Round two": the API's resident memory under a burst of them).
/** A public GET route for these tests, heavy or not, answering through `answer`. */
function testRoute(path: string, heavy: boolean, answer: (res: Response) => Promise<void>) {
  return defineRoute({
    method: 'get',
    path,
    tag: 'Test',
    access: 'public',
    tenantData: false,
    heavy,
    summary: heavy ? 'a slow whole-firm read' : 'a light read',
    request: {},
    responses: { 200: { description: 'ok' } },
    handle: ({ res }) => answer(res),
  });
}

const depsAllowing = (atOnce: number) =>
  ({ env: { NODE_ENV: 'production', HEAVY_READS_AT_ONCE: atOnce } }) as unknown as AppDeps;

describe('whole-firm reads worked on a few at a time', () => {
  it('eight at once: two are worked on at a time, all eight answered; a light route is not held behind them', async () => {
    let running = 0;
    let mostAtOnce = 0;
    const heavy = testRoute('/heavy', true, async (res) => {
      running += 1;
      mostAtOnce = Math.max(mostAtOnce, running);
      await new Promise((resolve) => setTimeout(resolve, 40));
      running -= 1;
      res.json({ n: mostAtOnce });
    });
    const light = testRoute('/light', false, async (res) => {
      res.json({ heavyRunning: running });
    });
    const app = express().use(mountRoutes([heavy, light], depsAllowing(2)));
    const server = app.listen(0);
    try {
      const heavyAnswers = Array.from({ length: 8 }, () => request(server).get('/heavy'));
      const lightAnswer = request(server).get('/light');
      const answers = await Promise.all([...heavyAnswers, lightAnswer]);
      expect(answers.map((a) => a.status)).toEqual(Array(9).fill(200));
      expect(mostAtOnce).toBe(2);
      // The light read was answered while heavy ones were still being worked on.
      expect(answers[8]!.body.heavyRunning).toBeGreaterThan(0);
    } finally {
      server.close();
    }
  });

  it('a queued read whose caller has gone is not worked on when its turn comes', async () => {
    let worked = 0;
    const heavy = testRoute('/heavy', true, async (res) => {
      worked += 1;
      await new Promise((resolve) => setTimeout(resolve, 150));
      res.json({ worked });
    });
    const server = express()
      .use(mountRoutes([heavy], depsAllowing(1)))
      .listen(0);
    const { port } = server.address() as AddressInfo;
    try {
      const first = request(server).get('/heavy');
      const firstAnswer = first.then((r) => r.status);
      // Three callers queue behind it and give up before their turn.
      const leavers = Array.from({ length: 3 }, () => {
        const call = get({ port, path: '/heavy' });
        call.on('error', () => undefined);
        setTimeout(() => call.destroy(), 50);
        return call;
      });
      expect(await firstAnswer).toBe(200);
      await new Promise((resolve) => setTimeout(resolve, 100));
      expect(leavers.every((call) => call.destroyed)).toBe(true);
      expect(worked).toBe(1);
      // One who stayed after them is answered.
      expect((await request(server).get('/heavy')).status).toBe(200);
      expect(worked).toBe(2);
    } finally {
      server.close();
    }
  });
});
