import { localToday } from '@shared/dates';
import { formatMoney } from '@shared/fees/compute';
import type { MailPreview, MailTemplateList, OptionalMailKind } from '@shared/schemas/mail-templates';
import type { Db } from '../db/knex';
import { notFound } from '../errors';
import type { OutgoingMail } from '../mail/mailer';
import { paymentReceiptMail } from '../mail/fee-templates';
import { clubNewsMail } from '../mail/mailing-templates';
import { placeReleasedMail, shiftCalledOffMail, shiftDigestMail, shiftHelpMail, shiftReminderMail, shiftTakenMail, type ShiftWords } from '../mail/shift-templates';
import { clubSignupMail, inviteMail, offerMail, passwordResetMail, renewalMail, welcomeHolderMail } from '../mail/templates';
import { alreadyOnWaitlistMail, applicationReceivedMail } from '../mail/waitlist-templates';
import { stopUrls } from './mail-stops';

// Every template with sample data of the club, for coordinators to look at before anything is sent.
// Links go to .invalid addresses (RFC 2606: never resolvable), so nothing in a preview is a real token.

interface Sample {
  clubName: string;
  siteName: string;
  timeZone: string;
  currency: string;
  year: number;
  today: string;
}

const FAKE = 'https://preview.invalid';
const fake = (what: string) => `${FAKE}/${what}?token=sample-not-a-real-link`;
const to = 'sam.sample@example.invalid';
const name = 'Sam Sample';
const stop = (s: Sample, _kind: OptionalMailKind, what: string) => stopUrls(FAKE, 'sample-not-a-real-link', `${what} from ${s.clubName}`);

function sampleShift(s: Sample): ShiftWords {
  return {
    title: 'Water the raised beds',
    siteName: s.siteName,
    date: s.today,
    startTime: '18:00',
    endTime: '19:30',
    timeZone: s.timeZone,
    estHours: 1.5,
    instructions: 'Water at the base of the plants; the cans are in the shed.',
    caution: 'Lift full cans with bent knees and carry two half cans rather than one full one.',
  };
}

interface Template {
  name: string;
  label: string;
  optional: boolean;
  description: string;
  render(s: Sample): Promise<OutgoingMail>;
}

const inAWeek = (s: Sample) => new Date(`${s.today}T12:00:00Z`).getTime() + 7 * 86_400_000;

const templates: Template[] = [
  {
    name: 'invite',
    label: 'Invitation',
    optional: false,
    description: 'A coordinator adds someone to the club.',
    render: (s) => inviteMail({ to, name, clubName: s.clubName, roles: ['plot_holder'], url: fake('invite'), expiresAt: new Date(inAWeek(s)), timeZone: s.timeZone }),
  },
  {
    name: 'club_signup',
    label: 'New club address check',
    optional: false,
    description: 'Someone starts a club on the sign-up page and confirms their address.',
    render: (s) => clubSignupMail({ to, name, clubName: s.clubName, url: fake('start-a-club'), expiresAt: new Date(new Date(`${s.today}T12:00:00Z`).getTime() + 86_400_000), timeZone: s.timeZone }),
  },
  {
    name: 'password_reset',
    label: 'Password link',
    optional: false,
    description: 'Someone asks to reset their password.',
    render: (s) => passwordResetMail({ to, name, url: fake('reset-password'), expiresAt: new Date(inAWeek(s)), timeZone: s.timeZone }),
  },
  {
    name: 'application_received',
    label: 'Waiting list confirmation',
    optional: false,
    description: 'An applicant filled in the application form.',
    render: (s) => applicationReceivedMail({ to, name, clubName: s.clubName, position: 4, preferredSize: 'small', needs: ['a raised bed'], siteName: s.siteName, offerDays: 7 }),
  },
  {
    name: 'already_on_waitlist',
    label: 'Already on the waiting list',
    optional: false,
    description: 'An address already waiting applied again.',
    render: (s) => alreadyOnWaitlistMail({ to, name, clubName: s.clubName, position: 4 }),
  },
  {
    name: 'offer',
    label: 'Plot offer',
    optional: false,
    description: 'A free plot is offered to the next person waiting.',
    render: (s) =>
      offerMail({ to, name, clubName: s.clubName, year: s.year, plotLabel: 'A7', siteName: s.siteName, size: '5 m × 10 m', fee: formatMoney(4000, s.currency), url: fake('respond/offer'), deadline: new Date(inAWeek(s)), timeZone: s.timeZone }),
  },
  {
    name: 'welcome_holder',
    label: 'Welcome to a plot',
    optional: false,
    description: 'An offer was accepted.',
    render: (s) =>
      welcomeHolderMail({ to, name, clubName: s.clubName, plotLabel: 'A7', siteName: s.siteName, year: s.year, feeDue: formatMoney(4000, s.currency), dueOn: s.today, timeZone: s.timeZone, passwordUrl: fake('reset-password') }),
  },
  {
    name: 'renewal',
    label: 'Renewal',
    optional: false,
    description: 'The season opens: last season’s holders keep or give up their plot.',
    render: (s) => renewalMail({ to, name, clubName: s.clubName, year: s.year, plotLabel: 'A7', siteName: s.siteName, url: fake('respond/renewal'), deadline: new Date(inAWeek(s)), timeZone: s.timeZone }),
  },
  {
    name: 'payment_receipt',
    label: 'Payment receipt',
    optional: false,
    description: 'A coordinator records a payment.',
    render: (s) =>
      paymentReceiptMail({
        to,
        name,
        clubName: s.clubName,
        description: `plot A7 (${s.year})`,
        currency: s.currency,
        payment: { kind: 'payment', amountMinor: 4000, method: 'bank_transfer', paidOn: s.today },
        balanceMinor: 0,
        depositHeldMinor: 1000,
      }),
  },
  {
    name: 'club_news',
    label: 'Club message',
    optional: true,
    description: 'A coordinator writes to members (Messages).',
    render: (s) =>
      clubNewsMail({
        to,
        name,
        clubName: s.clubName,
        senderName: 'Alex Example',
        subject: 'Work morning on Saturday',
        body: 'We are clearing the paths on Saturday from 10:00.\n\nBring gloves; tools are in the shed.',
        because: `you are a member of ${s.clubName}`,
        preferencesUrl: fake('email-choices'),
        stop: stop(s, 'club_news', 'club news'),
      }),
  },
  {
    name: 'shift_taken',
    label: 'Place on a shift',
    optional: false,
    description: 'A volunteer took a place (with the calendar file).',
    render: (s) =>
      shiftTakenMail({
        to,
        name,
        clubName: s.clubName,
        shift: sampleShift(s),
        releaseUrl: fake('shift-link/release'),
        doneUrl: fake('shift-link/done'),
        ics: { filename: 'shift.ics', contentType: 'text/calendar; charset=utf-8; method=PUBLISH', content: '' },
      }),
  },
  {
    name: 'shift_reminder',
    label: 'Shift reminder',
    optional: true,
    description: 'The day before a shift, to those holding a place.',
    render: (s) =>
      shiftReminderMail({
        to,
        name,
        clubName: s.clubName,
        shift: sampleShift(s),
        releaseUrl: fake('shift-link/release'),
        doneUrl: fake('shift-link/done'),
        choicesUrl: fake('my-shifts'),
        stop: stop(s, 'shift_reminder', 'shift reminders'),
      }),
  },
  {
    name: 'shift_released',
    label: 'Place given back',
    optional: false,
    description: 'To coordinators when a volunteer gives a place back.',
    render: (s) => placeReleasedMail({ to, name, clubName: s.clubName, who: 'Robin Example', shift: sampleShift(s), placesLeft: 1, shiftUrl: fake('shift') }),
  },
  {
    name: 'shift_called_off',
    label: 'Shift called off',
    optional: false,
    description: 'To those holding a place when a shift is called off.',
    render: (s) => shiftCalledOffMail({ to, name, clubName: s.clubName, shift: sampleShift(s) }),
  },
  {
    name: 'shift_digest',
    label: 'Weekly open shifts',
    optional: true,
    description: 'Once a week, on the volunteer’s day.',
    render: (s) =>
      shiftDigestMail({
        to,
        name,
        clubName: s.clubName,
        lines: [{ shift: sampleShift(s), placesLeft: 2, claimUrl: fake('shift-link/claim') }],
        choicesUrl: fake('my-shifts'),
        stop: stop(s, 'shift_digest', 'the weekly shift e-mail'),
      }),
  },
  {
    name: 'shift_help',
    label: 'Help wanted',
    optional: true,
    description: 'A coordinator asks the volunteers for help with a shift.',
    render: (s) =>
      shiftHelpMail({
        to,
        name,
        clubName: s.clubName,
        from: 'Alex Example',
        note: 'Two more pairs of hands would finish it in an hour.',
        item: { shift: sampleShift(s), placesLeft: 2, claimUrl: fake('shift-link/claim') },
        choicesUrl: fake('my-shifts'),
        stop: stop(s, 'shift_help', 'calls for help'),
      }),
  },
];

/** The names of every template (tests render each). */
export const mailTemplateNames = templates.map((t) => t.name);

export function listMailTemplates(): MailTemplateList {
  const items = templates.map(({ name, label, optional, description }) => ({ name, label, optional, description }));
  return { items, page: 1, total: items.length };
}

async function sampleOf(db: Db, clubId: number, now: Date): Promise<Sample> {
  const club = await db('clubs').where({ id: clubId }).first('name', 'time_zone', 'currency');
  if (!club) throw notFound('The club');
  const site = await db('sites').where({ club_id: clubId }).whereNull('archived_at').orderBy('id').first('name');
  const timeZone = club.time_zone ?? 'UTC';
  const today = localToday(timeZone, now);
  return { clubName: club.name, siteName: site?.name ?? 'North field', timeZone, currency: club.currency ?? 'GBP', year: Number(today.slice(0, 4)), today };
}

/** One template rendered with sample data of the club. */
export async function previewMailTemplate(db: Db, opts: { clubId: number; name: string; now?: Date }): Promise<MailPreview> {
  const template = templates.find((t) => t.name === opts.name);
  if (!template) throw notFound('The template');
  const mail = await template.render(await sampleOf(db, opts.clubId, opts.now ?? new Date()));
  return { name: template.name, subject: mail.subject, html: mail.html, text: mail.text, headers: mail.headers ?? {} };
}
