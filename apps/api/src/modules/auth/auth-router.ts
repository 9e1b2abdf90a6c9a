import { z } from 'zod';
import {
  changePasswordInputSchema,
  csrfResponseSchema,
  meResponseSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  setActiveFirmInputSchema,
  signInInputSchema,
  signUpInputSchema,
} from '@heatfleet/domain';
import { generateCsrfToken } from '../../middleware/csrf.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import {
  buildMe,
  changePassword,
  confirmPasswordReset,
  requestPasswordReset,
  setActiveFirm,
  signIn,
  signUp,
} from './auth-service.ts';
import { endSession, saveSession, startSession } from './session-helpers.ts';

const signedInSchema = z.object({ me: meResponseSchema, csrfToken: z.string() });
const meSchema = z.object({ me: meResponseSchema });
const messageSchema = z.object({ message: z.string() });
const RESET_ANSWER = 'If that e-mail belongs to a Heatfleet account, a link to choose a new password is on its way. It works once, for one hour.';

export const authRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get', path: '/auth/csrf', tag: 'Auth', access: 'public', tenantData: false,
    summary: 'The CSRF token of this session, to send back in X-CSRF-Token',
    request: {},
    responses: { 200: { description: 'Token', schema: csrfResponseSchema } },
    handle: async ({ req, res }) => {
      const csrfToken = generateCsrfToken(req);
      // Saved before answering: a token the store never kept would only fail the next request.
      await saveSession(req);
      res.json({ csrfToken });
    },
  }),
  defineRoute({
    method: 'post', path: '/auth/sign-up', tag: 'Auth', access: 'public', tenantData: false,
    summary: 'Create a firm; the person becomes its Owner and is signed in',
    request: { body: signUpInputSchema },
    responses: { 201: { description: 'Signed in', schema: signedInSchema }, 409: { description: 'E-mail taken' } },
    handle: async ({ body, req, res, deps }) => {
      const { userId, firmId } = await signUp(deps, body);
      const csrfToken = await startSession(req, userId, firmId, deps.clock.now());
      res.status(201).json({ me: await buildMe(deps.db, userId, firmId), csrfToken });
    },
  }),
  defineRoute({
    method: 'post', path: '/auth/sign-in', tag: 'Auth', access: 'public', tenantData: false,
    summary: 'Sign in with e-mail and password',
    request: { body: signInInputSchema },
    responses: { 200: { description: 'Signed in', schema: signedInSchema }, 401: { description: 'Wrong e-mail or password' }, 429: { description: 'Too many failures' } },
    before: (deps) => [deps.signInLimiter.byAddress, deps.signInLimiter.byAccount],
    handle: async ({ body, req, res, deps }) => {
      const { userId, firmId } = await signIn(deps, body);
      const csrfToken = await startSession(req, userId, firmId, deps.clock.now());
      res.json({ me: await buildMe(deps.db, userId, firmId), csrfToken });
    },
  }),
  defineRoute({
    method: 'post', path: '/auth/sign-out', tag: 'Auth', access: 'public', tenantData: false,
    summary: 'Sign out: the session ends on the server',
    request: {},
    responses: { 204: { description: 'Signed out' } },
    handle: async ({ req, res }) => {
      await endSession(req);
      res.clearCookie('heatfleet.sid');
      res.status(204).end();
    },
  }),
  defineRoute({
    method: 'post', path: '/auth/password-reset', tag: 'Auth', access: 'public', tenantData: false,
    summary: 'E-mail a single-use link to choose a new password (same answer for any e-mail)',
    request: { body: passwordResetRequestSchema },
    responses: { 202: { description: 'Accepted', schema: messageSchema } },
    before: (deps) => [deps.signInLimiter.passwordResetByAccount],
    handle: async ({ body, res, deps }) => {
      await requestPasswordReset(deps, body.email);
      res.status(202).json({ message: RESET_ANSWER });
    },
  }),
  defineRoute({
    method: 'post', path: '/auth/password-reset/confirm', tag: 'Auth', access: 'public', tenantData: false,
    summary: 'Choose a new password with the link from the e-mail; every session of the account ends',
    request: { body: passwordResetConfirmSchema },
    responses: { 200: { description: 'Changed', schema: messageSchema }, 400: { description: 'Link expired or used' } },
    handle: async ({ body, res, deps }) => {
      await confirmPasswordReset(deps, body);
      res.json({ message: 'Your password has been changed. Sign in with it now.' });
    },
  }),
  defineRoute({
    method: 'get', path: '/me', tag: 'Me', access: 'member', tenantData: false,
    summary: 'The signed-in person, their firms, the active firm and their role in it',
    request: {},
    responses: { 200: { description: 'Me', schema: meSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ me: await buildMe(deps.db, actor.userId, actor.firmId) });
    },
  }),
  defineRoute({
    method: 'put', path: '/me/active-firm', tag: 'Me', access: 'member', tenantData: true,
    summary: 'Switch the active firm to another of the person\u2019s firms',
    request: { body: setActiveFirmInputSchema },
    responses: { 200: { description: 'Switched', schema: meSchema }, 404: { description: 'Not a member of that firm' } },
    handle: async ({ body, req, res, deps, actor }) => {
      await setActiveFirm(deps, actor.userId, body.firmId);
      req.session.firmId = body.firmId;
      res.json({ me: await buildMe(deps.db, actor.userId, body.firmId) });
    },
  }),
  defineRoute({
    method: 'put', path: '/me/password', tag: 'Me', access: 'member', tenantData: false,
    summary: 'Change password; every other session of the person ends',
    request: { body: changePasswordInputSchema },
    responses: { 200: { description: 'Changed', schema: signedInSchema } },
    handle: async ({ body, req, res, deps, actor }) => {
      await changePassword(deps, actor, body, req.sessionID);
      const csrfToken = await startSession(req, actor.userId, actor.firmId, deps.clock.now());
      res.json({ me: await buildMe(deps.db, actor.userId, actor.firmId), csrfToken });
    },
  }),
];
