import { formatDate } from '@shared/dates';
import type { MailAttachment } from './mailer';
import { renderMail } from './templates';

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

const choicesWhy = (clubName: string, choicesUrl: string) =>
  `You got this because you volunteer with ${clubName}. Change or stop shift e-mails here: ${choicesUrl}`;

export function shiftTakenMail(p: {
  to: string;
  name: string;
  clubName: string;
  shift: ShiftWords;
  releaseUrl: string;
  doneUrl: string;
  ics: MailAttachment;
}) {
  const m = renderMail({
    to: p.to,
    subject: `You have a place: ${p.shift.title}, ${formatDate(p.shift.date, 'UTC')}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `Thank you: your place on “${p.shift.title}” at ${p.shift.siteName} is kept for you. When: ${whenWords(p.shift)}, ${hoursWords(p.shift.estHours)}.`,
      ...(p.shift.instructions ? [`What to do: ${p.shift.instructions}`] : []),
      `Take care: ${p.shift.caution}`,
      'The calendar file attached puts the shift in your calendar. If you cannot come, give the place back so someone else can take it. When you have done it, tell us with the second link.',
    ],
    actions: [
      { label: 'Give back my place', url: p.releaseUrl },
      { label: 'I did this shift', url: p.doneUrl },
    ],
    why: `You got this because you took a place on a shift with ${p.clubName}. It cannot be switched off while you hold a place.`,
  });
  return { ...m, attachments: [p.ics] };
}

export function shiftReminderMail(p: { to: string; name: string; clubName: string; shift: ShiftWords; releaseUrl: string; doneUrl: string }) {
  return renderMail({
    to: p.to,
    subject: `Tomorrow: ${p.shift.title}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `A reminder of your shift at ${p.shift.siteName}: ${whenWords(p.shift)}, ${hoursWords(p.shift.estHours)}.`,
      ...(p.shift.instructions ? [`What to do: ${p.shift.instructions}`] : []),
      `Take care: ${p.shift.caution}`,
      'If you cannot come after all, give the place back so someone else can take it.',
    ],
    actions: [
      { label: 'Give back my place', url: p.releaseUrl },
      { label: 'I did this shift', url: p.doneUrl },
    ],
    why: `You got this because you hold a place on a shift with ${p.clubName}. One reminder is sent the day before each shift.`,
  });
}

export function placeReleasedMail(p: { to: string; name: string; clubName: string; who: string; shift: ShiftWords; placesLeft: number; shiftUrl: string }) {
  return renderMail({
    to: p.to,
    subject: `A place is free again: ${p.shift.title}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `${p.who} gave back their place on “${p.shift.title}” (${whenWords(p.shift)}). ${p.placesLeft} ${p.placesLeft === 1 ? 'place is' : 'places are'} free now.`,
      'You can ask the volunteers for help by e-mail from the shift’s page.',
    ],
    action: { label: 'Open the shift', url: p.shiftUrl },
    why: `You got this because you coordinate ${p.clubName}.`,
  });
}

export function shiftCalledOffMail(p: { to: string; name: string; clubName: string; shift: ShiftWords }) {
  return renderMail({
    to: p.to,
    subject: `Called off: ${p.shift.title}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [`The coordinators have called off “${p.shift.title}” at ${p.shift.siteName} (${whenWords(p.shift)}). You do not need to come. Thank you for taking a place.`],
    why: `You got this because you held a place on this shift with ${p.clubName}.`,
  });
}

export interface OpenShiftLine {
  shift: ShiftWords;
  placesLeft: number;
  claimUrl: string;
}

const line = (l: OpenShiftLine) => `${l.shift.title}, ${whenWords(l.shift)}, ${hoursWords(l.shift.estHours)}; ${l.placesLeft} ${l.placesLeft === 1 ? 'place' : 'places'} free.`;

export function shiftDigestMail(p: { to: string; name: string; clubName: string; lines: OpenShiftLine[]; choicesUrl: string }) {
  return renderMail({
    to: p.to,
    subject: `${p.lines.length} ${p.lines.length === 1 ? 'shift needs' : 'shifts need'} people at ${p.clubName}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      'These shifts still need people. Each link opens a page that asks you to confirm; nothing is taken until you do.',
      ...p.lines.map(line),
    ],
    actions: p.lines.map((l) => ({ label: `Take a place: ${l.shift.title}, ${formatDate(l.shift.date, 'UTC')}`, url: l.claimUrl })),
    why: choicesWhy(p.clubName, p.choicesUrl),
  });
}

export function shiftHelpMail(p: { to: string; name: string; clubName: string; from: string; note: string; item: OpenShiftLine; choicesUrl: string }) {
  return renderMail({
    to: p.to,
    subject: `Help wanted: ${p.item.shift.title}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `${p.from} asks for help with a shift at ${p.item.shift.siteName}.`,
      ...(p.note ? [p.note] : []),
      line(p.item),
      ...(p.item.shift.instructions ? [`What to do: ${p.item.shift.instructions}`] : []),
      `Take care: ${p.item.shift.caution}`,
      'The link opens a page that asks you to confirm; nothing is taken until you do.',
    ],
    action: { label: 'Take a place', url: p.item.claimUrl },
    why: choicesWhy(p.clubName, p.choicesUrl),
  });
}
