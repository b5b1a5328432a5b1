import type { Knex } from 'knex';
import { addCalendarDays, localToday } from '../shared/dates';
import { createCoordinatorTasks } from '../server/services/task-views';
import { createShift, siteInstant, shiftSuggestions } from '../server/services/shifts';

// The demo's shifts, all invented: last summer's holiday-cover watering done by the volunteers (their
// hours count for 2026), and the coming weeks' winter jobs at Mossgate Lane as the coordinator would
// set them up: shared-bed and site tasks grouped into shifts by the product's own suggestions, with a
// place or two already taken. Wren Osei volunteers without a password: the e-mailed links are enough.

const PAST: Array<{ date: string; title: string; hours: number; by: string[]; missed?: string[] }> = [
  { date: '2026-07-14', title: 'Tuesday evening watering, plots A-1 to A-4 (holiday cover)', hours: 1.5, by: ['lucia@example.org', 'ben@example.org'] },
  { date: '2026-07-18', title: 'Saturday morning weeding, the shared beds', hours: 2, by: ['priya@example.org', 'lucia@example.org'] },
  { date: '2026-07-21', title: 'Tuesday evening watering, plots A-1 to A-4 (holiday cover)', hours: 1.5, by: ['ben@example.org'], missed: ['wren@example.org'] },
  { date: '2026-08-04', title: 'Tuesday evening watering, plots B-1 and B-2', hours: 1, by: ['wren@example.org'] },
  { date: '2026-09-12', title: 'Saturday morning harvest, the shared beds', hours: 2.5, by: ['lucia@example.org', 'priya@example.org', 'ben@example.org'] },
];

/** The next `weekday` (0 Sunday … 6 Saturday) on or after `from`, as a date. */
function nextWeekday(from: string, weekday: number): string {
  let d = from;
  while (new Date(`${d}T12:00:00Z`).getUTCDay() !== weekday) d = addCalendarDays(d, 1);
  return d;
}

export async function seed(knex: Knex): Promise<void> {
  const club = await knex('clubs').where({ slug: 'mossgate' }).first('id', 'time_zone');
  await knex('clubs').where({ id: club.id }).update({ volunteer_hours_required: 8 });
  const site = await knex('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id', 'time_zone');
  const zone: string = site.time_zone;
  const maren = await knex('users').where({ email: 'maren@example.org' }).first('id');

  const [wren] = await knex('users').insert({ name: 'Wren Osei', email: 'wren@example.org', password_hash: null }).returning('id');
  await knex('memberships').insert({ club_id: club.id, user_id: wren.id, role: 'volunteer' });
  // Ben chose Thursdays for the weekly e-mail; Lucía wants no calls for help.
  const users = new Map<string, number>(
    (await knex('users').whereIn('email', ['lucia@example.org', 'ben@example.org', 'priya@example.org', 'wren@example.org']).select('id', 'email')).map((u: { id: number; email: string }) => [u.email, u.id]),
  );
  await knex('volunteer_settings').insert([
    { club_id: club.id, user_id: users.get('ben@example.org'), digest_day: 4, help_mail: true },
    { club_id: club.id, user_id: users.get('lucia@example.org'), digest_day: 1, help_mail: false },
  ]);

  for (const p of PAST) {
    const [start, end] = p.title.includes('evening') ? ['18:00', '18:00'] : ['10:00', '10:00'];
    const endTime = `${String(Number(end.slice(0, 2)) + Math.ceil(p.hours)).padStart(2, '0')}:00`;
    const [row] = await knex('shifts')
      .insert({
        club_id: club.id,
        site_id: site.id,
        title: p.title,
        kind: p.title.includes('watering') ? 'water' : p.title.includes('weeding') ? 'weed' : 'harvest',
        on_date: p.date,
        start_time: start,
        end_time: endTime,
        starts_at: siteInstant(p.date, start, zone),
        ends_at: siteInstant(p.date, endTime, zone),
        capacity: p.by.length + (p.missed?.length ?? 0),
        est_hours: p.hours,
        instructions: 'Fill the cans at the trough by the gate; water at the base of the plants.',
        created_by_user_id: maren.id,
      })
      .returning('id');
    const doneAt = siteInstant(p.date, endTime, zone);
    for (const email of p.by) {
      await knex('shift_claims').insert({ shift_id: row.id, user_id: users.get(email), via: 'link', status: 'done', done_at: doneAt, hours: p.hours, note: '' });
    }
    for (const email of p.missed ?? []) {
      await knex('shift_claims').insert({ shift_id: row.id, user_id: users.get(email), via: 'link', status: 'missed' });
    }
  }

  // The coming weeks: site and shared-bed jobs, then shifts made from the suggestions.
  const today = localToday(zone);
  const saturday = nextWeekday(addCalendarDays(today, 1), 6);
  const wednesday = nextWeekday(addCalendarDays(today, 1), 3);
  const add = (body: Parameters<typeof createCoordinatorTasks>[1]['body']) => createCoordinatorTasks(knex, { clubId: club.id, siteId: site.id, userId: maren.id, body });
  await add({
    plotId: null,
    kind: 'other',
    title: 'Turn the compost bays',
    details: 'Fork the older bay into the empty one so it heats up again; add a layer of leaves for every layer of greens.',
    dueOn: saturday,
    windowDays: 1,
    repeatEveryDays: 7,
    repeatUntil: addCalendarDays(saturday, 21),
  });
  await add({
    plotId: null,
    kind: 'mulch',
    title: 'Spread leaf mould on the shared beds',
    details: 'A 5 cm layer over the bare soil of the shared herb and fruit beds, kept off the stems.',
    dueOn: addCalendarDays(saturday, 7),
    windowDays: 1,
    repeatEveryDays: null,
    repeatUntil: null,
  });
  await add({
    plotId: null,
    kind: 'other',
    title: 'Check the water troughs for ice and lift the hoses',
    details: 'Break any ice, drain and coil the hoses into the shed so they do not split in a frost.',
    dueOn: wednesday,
    windowDays: 1,
    repeatEveryDays: 7,
    repeatUntil: addCalendarDays(wednesday, 14),
  });
  const suggestions = await shiftSuggestions(knex, { clubId: club.id, siteId: site.id, from: today, to: addCalendarDays(today, 27) });
  const viewer = { userId: maren.id, roles: ['coordinator' as const] };
  const made: number[] = [];
  for (const s of suggestions.items) {
    const shift = await createShift(knex, {
      clubId: club.id,
      userId: maren.id,
      viewer,
      body: {
        siteId: s.siteId,
        title: s.title,
        kind: s.kind,
        date: s.date,
        startTime: s.startTime,
        endTime: s.endTime,
        // Winter work goes better in company: two places at least.
        capacity: Math.max(2, s.capacity),
        estHours: s.estHours,
        instructions: 'Meet at the shed; tools and gloves are in the blue box.',
        taskIds: s.taskIds,
      },
    });
    made.push(shift.id);
  }
  // Lucía took the first compost morning, Ben the leaf mould (entered here without the e-mails).
  const first = await knex('shifts').whereIn('id', made).where('title', 'like', '%garden jobs%').orderBy('starts_at').first('id');
  const mulch = await knex('shifts').whereIn('id', made).where({ kind: 'mulch' }).first('id');
  if (first) await knex('shift_claims').insert({ shift_id: first.id, user_id: users.get('lucia@example.org'), via: 'board' });
  if (mulch) await knex('shift_claims').insert({ shift_id: mulch.id, user_id: users.get('ben@example.org'), via: 'link' });
}
