import type { Request, RequestHandler, Response } from 'express';
import { z, type ZodType } from 'zod';
import type { Actor, AppDeps } from '../app-deps.ts';

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * public: anyone, signed in or not. member: signed in, acting in the active firm.
 * tenantData says whether the route reads or writes a firm's records; the isolation test uses it.
 */
export interface RouteDefinition {
  method: HttpMethod;
  /** Express style, under /api: '/members/:id'. */
  path: string;
  summary: string;
  tag: string;
  access: 'public' | 'member';
  tenantData: boolean;
  /**
   * A read that builds a figure for the whole firm (the overview, the restock run, the stock grid): at most
   * HEAVY_READS_AT_ONCE of them are worked on at once in this process and the rest wait their turn, so a burst of
   * them does not hold every one's cells and answer in memory together (README, "Round two": resident memory).
   */
  heavy?: boolean;
  devOnly?: boolean;
  request: { params?: ZodType; query?: ZodType; body?: ZodType };
  /** A multipart upload: the file field and the text fields beside it (parsed by the route itself). */
  multipart?: { fileField: string; fields: ZodType };
  responses: Record<number, { description: string; schema?: ZodType }>;
  before?: (deps: AppDeps) => RequestHandler[];
  handle: (ctx: RouteContext<unknown, unknown, unknown>) => Promise<void>;
}

export interface RouteContext<P, Q, B> {
  params: P;
  query: Q;
  body: B;
  req: Request;
  res: Response;
  deps: AppDeps;
  /** Set for access 'member'; null on public routes. */
  actor: Actor | null;
}

type Infer<T> = T extends ZodType ? z.infer<T> : undefined;

export interface RouteSpec<
  P extends ZodType | undefined,
  Q extends ZodType | undefined,
  B extends ZodType | undefined,
  A extends 'public' | 'member',
> extends Omit<RouteDefinition, 'handle' | 'request' | 'access'> {
  access: A;
  request: { params?: P; query?: Q; body?: B };
  handle: (
    ctx: RouteContext<Infer<P>, Infer<Q>, Infer<B>> & { actor: A extends 'member' ? Actor : Actor | null },
  ) => Promise<void>;
}

export function defineRoute<
  P extends ZodType | undefined = undefined,
  Q extends ZodType | undefined = undefined,
  B extends ZodType | undefined = undefined,
  A extends 'public' | 'member' = 'member',
>(spec: RouteSpec<P, Q, B, A>): RouteDefinition {
  return spec as unknown as RouteDefinition;
}

export const emptyQuerySchema = z.strictObject({});
export const emptyParamsSchema = z.strictObject({});
