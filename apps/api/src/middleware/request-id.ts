import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';

const incomingIdPattern = /^[A-Za-z0-9._-]{8,64}$/;

export const requestId: RequestHandler = (req, res, next) => {
  const incoming = req.get('x-request-id');
  req.id = incoming && incomingIdPattern.test(incoming) ? incoming : randomUUID();
  res.setHeader('X-Request-Id', req.id);
  next();
};

declare module 'express-serve-static-core' {
  interface Request {
    id: string;
  }
}
