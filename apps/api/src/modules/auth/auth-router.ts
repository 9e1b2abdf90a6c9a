import {
  changePasswordInputSchema,
  createFirmInputSchema,
  csrfResponseSchema,
  meEnvelopeSchema,
  messageResponseSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  sessionEnvelopeSchema,
  setActiveFirmInputSchema,
  signInInputSchema,
  signUpConfirmSchema,
  signUpInputSchema,
} from '@heatfleet/domain';
import { generateCsrfToken } from '../../middleware/csrf.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import {
  buildMe,
  changePassword,
  confirmPasswordReset,
  confirmSignUp,
  createFirmForActor,
  requestPasswordReset,
  requestSignUp,
  setActiveFirm,
  signIn,
} from './auth-service.ts';
import { endSession, saveSession, startSession } from './session-helpers.ts';

const signedInSchema = sessionEnvelopeSchema;
const meSchema = meEnvelopeSchema;
const messageSchema = messageResponseSchema;
const SIGN_UP_ANSWER =
  'Check your e-mail: we have sent a link to that address. Open it to finish creating your firm. It works once, for 24 hours.';
const RESET_ANSWER =
  'If that e-mail belongs to a Heatfleet account, a link to choose a new password is on its way. It works once, for one hour.';

export const authRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/auth/csrf',
    tag: 'Auth',
    access: 'public',
    tenantData: false,
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
    method: 'post',
    path: '/auth/sign-up',
    tag: 'Auth',
    access: 'public',
    tenantData: false,
    summary:
      'Ask to create a firm: a link to finish is e-mailed (same answer whether or not the address has an account)',
    request: { body: signUpInputSchema },
    responses: {
      202: { description: 'Accepted: the e-mail is on its way', schema: messageSchema },
      429: { description: 'Too many sign-ups' },
    },
    before: (deps) => [deps.limiters.signUpByAddress, deps.limiters.signUpByAccount],
    handle: async ({ body, res, deps }) => {
      await requestSignUp(deps, body);
      res.status(202).json({ message: SIGN_UP_ANSWER });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/sign-up/confirm',
    tag: 'Auth',
    access: 'public',
    tenantData: false,
    summary:
      'Finish a sign-up with the link from its e-mail: the account and the firm are created, and the person is signed in as its Owner',
    request: { body: signUpConfirmSchema },
    responses: {
      201: { description: 'Signed in', schema: signedInSchema },
      400: { description: 'Link expired or used' },
      429: { description: 'Too many failed tries' },
    },
    before: (deps) => [deps.limiters.linkByAddress, deps.limiters.linkByToken],
    handle: async ({ body, req, res, deps }) => {
      const { userId, firmId } = await confirmSignUp(deps, body);
      const csrfToken = await startSession(req, userId, firmId, deps.clock.now());
      res.status(201).json({ me: await buildMe(deps.db, userId, firmId), csrfToken });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/sign-in',
    tag: 'Auth',
    access: 'public',
    tenantData: false,
    summary: 'Sign in with e-mail and password',
    request: { body: signInInputSchema },
    responses: {
      200: { description: 'Signed in', schema: signedInSchema },
      401: { description: 'Wrong e-mail or password' },
      429: { description: 'Too many failures' },
    },
    before: (deps) => [deps.limiters.signInByAddress, deps.limiters.signInByAccount],
    handle: async ({ body, req, res, deps }) => {
      const { userId, firmId } = await signIn(deps, body);
      const csrfToken = await startSession(req, userId, firmId, deps.clock.now());
      res.json({ me: await buildMe(deps.db, userId, firmId), csrfToken });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/sign-out',
    tag: 'Auth',
    access: 'public',
    tenantData: false,
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
    method: 'post',
    path: '/auth/password-reset',
    tag: 'Auth',
    access: 'public',
    tenantData: false,
    summary: 'E-mail a single-use link to choose a new password (same answer for any e-mail)',
    request: { body: passwordResetRequestSchema },
    responses: { 202: { description: 'Accepted', schema: messageSchema } },
    before: (deps) => [deps.limiters.resetRequestByAddress, deps.limiters.resetRequestByAccount],
    handle: async ({ body, res, deps }) => {
      await requestPasswordReset(deps, body.email);
      res.status(202).json({ message: RESET_ANSWER });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/password-reset/confirm',
    tag: 'Auth',
    access: 'public',
    tenantData: false,
    summary: 'Choose a new password with the link from the e-mail; every session of the account ends',
    request: { body: passwordResetConfirmSchema },
    responses: { 200: { description: 'Changed', schema: messageSchema }, 400: { description: 'Link expired or used' } },
    before: (deps) => [deps.limiters.linkByAddress, deps.limiters.linkByToken],
    handle: async ({ body, res, deps }) => {
      await confirmPasswordReset(deps, body);
      res.json({ message: 'Your password has been changed. Sign in with it now.' });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/me',
    tag: 'Me',
    access: 'member',
    tenantData: false,
    summary: 'The signed-in person, their firms, the active firm and their role in it',
    request: {},
    responses: { 200: { description: 'Me', schema: meSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ me: await buildMe(deps.db, actor.userId, actor.firmId) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/me/active-firm',
    tag: 'Me',
    access: 'member',
    tenantData: true,
    summary: 'Switch the active firm to another of the person\u2019s firms',
    request: { body: setActiveFirmInputSchema },
    responses: {
      200: { description: 'Switched', schema: meSchema },
      404: { description: 'Not a member of that firm' },
    },
    handle: async ({ body, req, res, deps, actor }) => {
      await setActiveFirm(deps, actor.userId, body.firmId);
      req.session.firmId = body.firmId;
      res.json({ me: await buildMe(deps.db, actor.userId, body.firmId) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/me/firms',
    tag: 'Me',
    access: 'member',
    tenantData: false,
    summary: 'Create a further firm from this account, as its Owner, and switch to it',
    request: { body: createFirmInputSchema },
    responses: { 201: { description: 'Created and switched to', schema: meSchema } },
    handle: async ({ body, req, res, deps, actor }) => {
      const firmId = await createFirmForActor(deps, actor.userId, body);
      req.session.firmId = firmId;
      res.status(201).json({ me: await buildMe(deps.db, actor.userId, firmId) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/me/password',
    tag: 'Me',
    access: 'member',
    tenantData: false,
    summary: 'Change password; every other session of the person ends',
    request: { body: changePasswordInputSchema },
    responses: {
      200: { description: 'Changed', schema: signedInSchema },
      429: { description: 'Too many wrong current passwords' },
    },
    before: (deps) => [deps.limiters.passwordChangeByAddress, deps.limiters.passwordChangeByAccount],
    handle: async ({ body, req, res, deps, actor }) => {
      await changePassword(deps, actor, body, req.sessionID);
      const csrfToken = await startSession(req, actor.userId, actor.firmId, deps.clock.now());
      res.json({ me: await buildMe(deps.db, actor.userId, actor.firmId), csrfToken });
    },
  }),
];
