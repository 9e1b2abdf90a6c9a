import { describe, expect, it } from 'vitest';
import { formatLogLine } from './log-format.ts';

describe('formatLogLine', () => {
  it('shortens a request line to method, path, status and time', () => {
    const line = JSON.stringify({
      level: 30,
      time: Date.UTC(2026, 11, 1, 23, 36, 10),
      req: { id: 'r1', method: 'POST', url: '/api/auth/password-reset', headers: { host: 'localhost' } },
      res: { statusCode: 202, headers: {} },
      responseTime: 65,
      msg: 'request completed',
    });
    expect(formatLogLine(line)).toBe('23:36:10 INFO  request completed POST /api/auth/password-reset -> 202 in 65 ms');
  });

  it('shows the error type and message', () => {
    const line = JSON.stringify({
      level: 50,
      msg: 'database unavailable',
      err: { type: 'Error', message: 'connect ECONNREFUSED' },
    });
    expect(formatLogLine(line)).toBe('ERROR database unavailable (Error: connect ECONNREFUSED)');
  });

  it('leaves other lines alone', () => {
    expect(formatLogLine('  VITE v8.3.8  ready in 445 ms')).toBe('  VITE v8.3.8  ready in 445 ms');
    expect(formatLogLine('{not json')).toBe('{not json');
    expect(formatLogLine('{"a":1}')).toBe('{"a":1}');
  });
});
