import { formatDate as formatDateIn, formatDateTime as formatDateTimeIn } from '@shared/dates';

/** An ISO timestamp as the day it is in `timeZone` ("3 Mar 2026"), a calendar date as itself; the input when unreadable. */
export function formatDate(iso: string, timeZone: string): string {
  return formatDateIn(iso, timeZone);
}

/** Joins a list of words for reading aloud or in a sentence: "A", "A and B", "A, B and C". */
export function joinWords(words: readonly string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/** The first word of a person's name, for friendly greetings. */
export function firstName(name: string): string {
  return name.trim().split(/\s+/)[0] ?? name;
}

/** An ISO timestamp as date and time in `timeZone` ("8 Dec 2026, 22:58 GMT"); the input when unreadable. */
export function formatDateTime(iso: string, timeZone: string): string {
  return formatDateTimeIn(iso, timeZone);
}

/** "1 holder", "3 holders": a count with the word that fits it (`many` defaults to `one` + "s"). */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}
