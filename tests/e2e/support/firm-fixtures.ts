import { expect } from '@playwright/test';
import type { Me, OutboxMessage, OutboxMessageSummary, Role } from '@heatfleet/domain';
import { callApi, openApiSession, type ApiSession } from './api-session';
import { runId } from './e2e-helpers';

// Invented people, firms and an invented domain: each test builds its own firm, so it never depends on the demo seed.

/** A member of a fixture firm, signed in to the API, with what the browser needs to sign in as them. */
export interface Person {
  name: string;
  email: string;
  password: string;
  memberId: number;
  session: ApiSession;
}

export interface Firm {
  id: number;
  name: string;
  owner: Person;
  baseURL: string;
}

/** Long and unrelated to the address, so it passes the password rules (README, Security). */
const FIXTURE_PASSWORD = 'juniper-ferry-lantern-58';

interface SessionEnvelope {
  me: Me;
  csrfToken: string;
}

/**
 * The link to `pathPrefix` in the newest e-mail to `to`, read from the dev-only Outbox API (the local
 * mail catcher). The worker sends after the request commits, so it may take a moment to arrive.
 */
export async function emailLink(session: ApiSession, to: string, pathPrefix: string): Promise<string> {
  let found: OutboxMessageSummary | undefined;
  await expect
    .poll(
      async () => {
        const { messages } = await callApi<{ messages: OutboxMessageSummary[] }>(session, 'get', '/api/outbox');
        found = messages.find((m) => m.to.some((t) => t.toLowerCase().includes(to.toLowerCase())));
        return found !== undefined;
      },
      { message: `an e-mail to ${to}`, timeout: 30_000 },
    )
    .toBe(true);
  const { message } = await callApi<{ message: OutboxMessage }>(session, 'get', `/api/outbox/${found!.id}`);
  const link = message.links.find((l) => new URL(l).pathname.startsWith(pathPrefix));
  expect(link, `a ${pathPrefix} link in "${message.subject}"`).toBeDefined();
  return link!;
}

function tokenOf(link: string): string {
  return new URL(link).pathname.split('/').pop()!;
}

/** A new firm through sign-up: the link is e-mailed (202), and confirming it signs the Owner in (201). */
export async function signUpFirm(baseURL: string, ownerName = 'Rowan Ellery'): Promise<Firm> {
  const id = runId();
  const name = `Fixture Heating ${id}`;
  const email = `owner-${id}@fixture-heating.example`;
  const session = await openApiSession(baseURL);
  await callApi(session, 'post', '/api/auth/sign-up', {
    data: { firmName: name, name: ownerName, email, password: FIXTURE_PASSWORD },
    status: 202,
  });
  const link = await emailLink(session, email, '/sign-up/confirm/');
  const { me, csrfToken } = await callApi<SessionEnvelope>(session, 'post', '/api/auth/sign-up/confirm', {
    data: { token: tokenOf(link) },
  });
  session.csrf = csrfToken;
  return {
    id: me.activeFirm.id,
    name,
    baseURL,
    owner: { name: ownerName, email, password: FIXTURE_PASSWORD, memberId: me.memberId, session },
  };
}

/** Someone new joins the firm with `role`: the Owner invites them and they accept the e-mailed link with a new account. */
export async function inviteMember(firm: Firm, role: Role, name: string): Promise<Person> {
  const email = `${role}-${runId()}@fixture-heating.example`;
  await callApi(firm.owner.session, 'post', '/api/invitations', { data: { email, role } });
  const link = await emailLink(firm.owner.session, email, '/invitations/');
  const session = await openApiSession(firm.baseURL);
  const { me, csrfToken } = await callApi<SessionEnvelope>(
    session,
    'post',
    `/api/invitations/by-token/${tokenOf(link)}/accept`,
    {
      data: { name, password: FIXTURE_PASSWORD },
      status: 200,
    },
  );
  expect(me.activeFirm.id).toBe(firm.id);
  session.csrf = csrfToken;
  return { name, email, password: FIXTURE_PASSWORD, memberId: me.memberId, session };
}
