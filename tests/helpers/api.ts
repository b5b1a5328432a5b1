import type { Knex } from 'knex';
import { expect } from 'vitest';
import type { Role } from '@shared/schemas/auth';
import { buildMember } from '../factories';
import { browserLikeAgent } from './app';

export type Agent = Awaited<ReturnType<typeof browserLikeAgent>>;

/** Builds a member of the club with the given roles and signs them in; the agent carries the person. */
export async function signedInMember(t: { db: Knex; app: Parameters<typeof browserLikeAgent>[0] }, clubId: number, roles: Role[]) {
  const person = await buildMember(t.db, { clubId, roles });
  const c = await browserLikeAgent(t.app);
  expect((await c.signIn(person.email, person.password!)).status).toBe(200);
  return Object.assign(c, { person });
}

/** Makes a 40 m × 30 m site in London through the API, with any further fields given. */
export async function addSite(c: Agent, clubId: number, name: string, more: Record<string, unknown> = {}) {
  const res = await c.post(`/api/clubs/${clubId}/sites`, {
    name,
    latitude: 51.5,
    longitude: -0.1,
    timeZone: 'Europe/London',
    width: 40,
    length: 30,
    ...more,
  });
  expect(res.status).toBe(201);
  return res.body as { id: number; name: string };
}
