import { get } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import type { AppDeps } from '../app-deps.ts';
import { mountRoutes } from './mount-routes.ts';
import { defineRoute } from './route-registry.ts';

// Routes marked `heavy` (whole-firm reads) are worked on at most HEAVY_READS_AT_ONCE at a time; the rest wait their
// turn and are all answered (README, "Round two": the API's resident memory under a burst of them).
describe('whole-firm reads worked on a few at a time', () => {
  it('eight at once: two are worked on at a time, all eight answered; a light route is not held behind them', async () => {
    let running = 0;
    let mostAtOnce = 0;
    const heavy = defineRoute({
      method: 'get',
      path: '/heavy',
      tag: 'Test',
      access: 'public',
      tenantData: false,
      heavy: true,
      summary: 'a slow whole-firm read',
      request: {},
      responses: { 200: { description: 'ok', schema: z.object({ n: z.number() }) } },
      handle: async ({ res }) => {
        running += 1;
        mostAtOnce = Math.max(mostAtOnce, running);
        await new Promise((resolve) => setTimeout(resolve, 40));
        running -= 1;
        res.json({ n: mostAtOnce });
      },
    });
    const light = defineRoute({
      method: 'get',
      path: '/light',
      tag: 'Test',
      access: 'public',
      tenantData: false,
      summary: 'a light read',
      request: {},
      responses: { 200: { description: 'ok' } },
      handle: async ({ res }) => {
        res.json({ heavyRunning: running });
      },
    });
    const deps = { env: { NODE_ENV: 'production', HEAVY_READS_AT_ONCE: 2 } } as unknown as AppDeps;
    const app = express().use(mountRoutes([heavy, light], deps));
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
    const heavy = defineRoute({
      method: 'get',
      path: '/heavy',
      tag: 'Test',
      access: 'public',
      tenantData: false,
      heavy: true,
      summary: 'a slow whole-firm read',
      request: {},
      responses: { 200: { description: 'ok' } },
      handle: async ({ res }) => {
        worked += 1;
        await new Promise((resolve) => setTimeout(resolve, 150));
        res.json({ worked });
      },
    });
    const deps = { env: { NODE_ENV: 'production', HEAVY_READS_AT_ONCE: 1 } } as unknown as AppDeps;
    const server = express()
      .use(mountRoutes([heavy], deps))
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
