import { formatDate } from '@shared/dates';
import type { MailAttachment } from './mailer';
import { MailLayout, P, renderMail, type StopLink } from './layout';

// The shift e-mails: a place taken (with its calendar file), the reminder the day before, a place given
// back (to the coordinators), a shift called off, the weekly open shifts and a coordinator's call for help.

export interface ShiftWords {
  title: string;
  siteName: string;
  date: string;
  startTime: string;
  endTime: string;
  timeZone: string;
  estHours: number;
  instructions: string;
  caution: string;
}

/** "Tue 14 Jul 2026, 18:00–19:30 (Europe/London)" at the site, in its own zone. */
export function whenWords(s: Pick<ShiftWords, 'date' | 'startTime' | 'endTime' | 'timeZone'>): string {
  return `${formatDate(s.date, 'UTC')}, ${s.startTime}–${s.endTime} (${s.timeZone})`;
}

const hoursWords = (h: number) => `about ${h} ${h === 1 ? 'hour' : 'hours'}`;

const volunteerWhy = (clubName: string) => `You got this because you volunteer with ${clubName}.`;
const choices = (url: string) => ({ label: 'Change or stop shift e-mails', url });

interface ShiftTakenProps {
  to: string;
  name: string;
  clubName: string;
  shift: ShiftWords;
  releaseUrl: string;
  doneUrl: string;
  ics: MailAttachment;
}

export function ShiftTakenEmail(p: ShiftTakenProps) {
  return (
    <MailLayout
      preview={`${p.shift.title}: ${whenWords(p.shift)}`}
      greeting={`Hello ${p.name},`}
      actions={[
        { label: 'Give back my place', url: p.releaseUrl },
        { label: 'I did this shift', url: p.doneUrl },
      ]}
      why={`You got this because you took a place on a shift with ${p.clubName}. It cannot be switched off while you hold a place.`}
    >
      <P>{`Thank you: your place on “${p.shift.title}” at ${p.shift.siteName} is kept for you. When: ${whenWords(p.shift)}, ${hoursWords(p.shift.estHours)}.`}</P>
      {p.shift.instructions ? <P>{`What to do: ${p.shift.instructions}`}</P> : null}
      <P>{`Take care: ${p.shift.caution}`}</P>
      <P>
        The calendar file attached puts the shift in your calendar. If you cannot come, give the place back so someone else can take it. When you have
        done it, tell us with the second link.
      </P>
    </MailLayout>
  );
}

export async function shiftTakenMail(p: ShiftTakenProps) {
  const m = await renderMail(p.to, `You have a place: ${p.shift.title}, ${formatDate(p.shift.date, 'UTC')}`, <ShiftTakenEmail {...p} />);
  return { ...m, attachments: [p.ics] };
}

interface ShiftReminderProps {
  to: string;
  name: string;
  clubName: string;
  shift: ShiftWords;
  releaseUrl: string;
  doneUrl: string;
  choicesUrl: string;
  stop: StopLink;
}

export function ShiftReminderEmail(p: ShiftReminderProps) {
  return (
    <MailLayout
      preview={`${p.shift.title}: ${whenWords(p.shift)}`}
      greeting={`Hello ${p.name},`}
      actions={[
        { label: 'Give back my place', url: p.releaseUrl },
        { label: 'I did this shift', url: p.doneUrl },
      ]}
      why={`You got this because you hold a place on a shift with ${p.clubName}. One reminder is sent the day before each shift.`}
      choices={choices(p.choicesUrl)}
      stop={p.stop}
    >
      <P>{`A reminder of your shift at ${p.shift.siteName}: ${whenWords(p.shift)}, ${hoursWords(p.shift.estHours)}.`}</P>
      {p.shift.instructions ? <P>{`What to do: ${p.shift.instructions}`}</P> : null}
      <P>{`Take care: ${p.shift.caution}`}</P>
      <P>If you cannot come after all, give the place back so someone else can take it.</P>
    </MailLayout>
  );
}

export function shiftReminderMail(p: ShiftReminderProps) {
  return renderMail(p.to, `Tomorrow: ${p.shift.title}`, <ShiftReminderEmail {...p} />, p.stop);
}

interface PlaceReleasedProps {
  to: string;
  name: string;
  clubName: string;
  who: string;
  shift: ShiftWords;
  placesLeft: number;
  shiftUrl: string;
}

export function PlaceReleasedEmail(p: PlaceReleasedProps) {
  return (
    <MailLayout
      preview={`${p.who} gave back their place`}
      greeting={`Hello ${p.name},`}
      actions={[{ label: 'Open the shift', url: p.shiftUrl }]}
      why={`You got this because you coordinate ${p.clubName}.`}
    >
      <P>{`${p.who} gave back their place on “${p.shift.title}” (${whenWords(p.shift)}). ${p.placesLeft} ${p.placesLeft === 1 ? 'place is' : 'places are'} free now.`}</P>
      <P>You can ask the volunteers for help by e-mail from the shift’s page.</P>
    </MailLayout>
  );
}

export function placeReleasedMail(p: PlaceReleasedProps) {
  return renderMail(p.to, `A place is free again: ${p.shift.title}`, <PlaceReleasedEmail {...p} />);
}

interface ShiftCalledOffProps {
  to: string;
  name: string;
  clubName: string;
  shift: ShiftWords;
}

export function ShiftCalledOffEmail(p: ShiftCalledOffProps) {
  return (
    <MailLayout preview="You do not need to come" greeting={`Hello ${p.name},`} why={`You got this because you held a place on this shift with ${p.clubName}.`}>
      <P>{`The coordinators have called off “${p.shift.title}” at ${p.shift.siteName} (${whenWords(p.shift)}). You do not need to come. Thank you for taking a place.`}</P>
    </MailLayout>
  );
}

export function shiftCalledOffMail(p: ShiftCalledOffProps) {
  return renderMail(p.to, `Called off: ${p.shift.title}`, <ShiftCalledOffEmail {...p} />);
}

export interface OpenShiftLine {
  shift: ShiftWords;
  placesLeft: number;
  claimUrl: string;
}

const line = (l: OpenShiftLine) => `${l.shift.title}, ${whenWords(l.shift)}, ${hoursWords(l.shift.estHours)}; ${l.placesLeft} ${l.placesLeft === 1 ? 'place' : 'places'} free.`;

interface ShiftDigestProps {
  to: string;
  name: string;
  clubName: string;
  lines: OpenShiftLine[];
  choicesUrl: string;
  stop: StopLink;
}

export function ShiftDigestEmail(p: ShiftDigestProps) {
  return (
    <MailLayout
      preview="Shifts that still need people"
      greeting={`Hello ${p.name},`}
      actions={p.lines.map((l) => ({ label: `Take a place: ${l.shift.title}, ${formatDate(l.shift.date, 'UTC')}`, url: l.claimUrl }))}
      why={volunteerWhy(p.clubName)}
      choices={choices(p.choicesUrl)}
      stop={p.stop}
    >
      <P>These shifts still need people. Each link opens a page that asks you to confirm; nothing is taken until you do.</P>
      {p.lines.map((l) => (
        <P key={l.claimUrl}>{line(l)}</P>
      ))}
    </MailLayout>
  );
}

export function shiftDigestMail(p: ShiftDigestProps) {
  return renderMail(p.to, `${p.lines.length} ${p.lines.length === 1 ? 'shift needs' : 'shifts need'} people at ${p.clubName}`, <ShiftDigestEmail {...p} />, p.stop);
}

interface ShiftHelpProps {
  to: string;
  name: string;
  clubName: string;
  from: string;
  note: string;
  item: OpenShiftLine;
  choicesUrl: string;
  stop: StopLink;
}

export function ShiftHelpEmail(p: ShiftHelpProps) {
  return (
    <MailLayout
      preview={`${p.from} asks for help`}
      greeting={`Hello ${p.name},`}
      actions={[{ label: 'Take a place', url: p.item.claimUrl }]}
      why={volunteerWhy(p.clubName)}
      choices={choices(p.choicesUrl)}
      stop={p.stop}
    >
      <P>{`${p.from} asks for help with a shift at ${p.item.shift.siteName}.`}</P>
      {p.note ? <P>{p.note}</P> : null}
      <P>{line(p.item)}</P>
      {p.item.shift.instructions ? <P>{`What to do: ${p.item.shift.instructions}`}</P> : null}
      <P>{`Take care: ${p.item.shift.caution}`}</P>
      <P>The link opens a page that asks you to confirm; nothing is taken until you do.</P>
    </MailLayout>
  );
}

export function shiftHelpMail(p: ShiftHelpProps) {
  return renderMail(p.to, `Help wanted: ${p.item.shift.title}`, <ShiftHelpEmail {...p} />, p.stop);
}
