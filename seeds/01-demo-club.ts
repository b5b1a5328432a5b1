import type { Knex } from 'knex';
import type { Role } from '@shared/schemas/auth';
import { loadReferenceCrops } from '../server/services/reference-crops';
import { buildClub, buildUser } from '../tests/factories';

// Demo data for an invented club; every name and address here is made up.
export const DEMO_PASSWORD = 'demo-garden-2027';

export const demoPeople: Array<{ name: string; email: string; roles: Role[]; club: 'mossgate' | 'cinder' }> = [
  { name: 'Maren Okafor', email: 'maren@example.org', roles: ['coordinator'], club: 'mossgate' },
  { name: 'Teodor Lind', email: 'teodor@example.org', roles: ['plot_holder'], club: 'mossgate' },
  { name: 'Priya Raman', email: 'priya@example.org', roles: ['plot_holder', 'volunteer'], club: 'mossgate' },
  { name: 'Jonah Whitcombe', email: 'jonah@example.org', roles: ['plot_holder'], club: 'mossgate' },
  { name: 'Aiko Brandt', email: 'aiko@example.org', roles: ['plot_holder'], club: 'mossgate' },
  { name: 'Samir Haddad', email: 'samir@example.org', roles: ['plot_holder'], club: 'mossgate' },
  { name: 'Lucía Ferreira', email: 'lucia@example.org', roles: ['volunteer'], club: 'mossgate' },
  { name: 'Ben Achterberg', email: 'ben@example.org', roles: ['volunteer'], club: 'mossgate' },
  { name: 'Odile Nkem', email: 'odile@example.org', roles: ['coordinator'], club: 'cinder' },
];

/** The coordinator also volunteers at the second club, so the demo shows the club switcher. */
const extraMemberships: Array<{ email: string; club: 'mossgate' | 'cinder'; role: Role }> = [
  { email: 'maren@example.org', club: 'cinder', role: 'volunteer' },
];

/** Each demo person with every role they hold in any club, for the start-up summary. */
export function demoSignIns(): Array<{ email: string; roles: Role[] }> {
  return demoPeople.map((p) => ({
    email: p.email,
    roles: [...p.roles, ...extraMemberships.filter((m) => m.email === p.email).map((m) => m.role)],
  }));
}

export async function seed(knex: Knex): Promise<void> {
  await knex.raw('truncate table memberships, invites, password_resets, users, clubs restart identity cascade');
  // The cascade through clubs empties every crop row, the reference ones too: put those back.
  await loadReferenceCrops(knex);
  const mossgate = await buildClub(knex, { name: 'Mossgate Community Garden Club', slug: 'mossgate' });
  const cinder = await buildClub(knex, { name: 'Cinder Lane Growers', slug: 'cinder-lane' });
  // What the public application form tells applicants (club settings); the fee matches the demo schedule.
  await knex('clubs').where({ id: mossgate.id }).update({
    fee_note: '£2.50 a square metre a season (a 3 × 6 m plot is £45), half for concessions, plus a £15 deposit returned when you leave.',
    typical_wait: 'About a year; sooner for a raised bed.',
  });
  const clubIds = { mossgate: mossgate.id, cinder: cinder.id };
  for (const p of demoPeople) {
    const user = await buildUser(knex, { name: p.name, email: p.email, password: DEMO_PASSWORD });
    await knex('memberships').insert(p.roles.map((role) => ({ club_id: clubIds[p.club], user_id: user.id, role })));
  }
  for (const m of extraMemberships) {
    const user = await knex('users').where({ email: m.email }).first('id');
    await knex('memberships').insert({ club_id: clubIds[m.club], user_id: user.id, role: m.role });
  }
}
