import { z } from 'zod';
import type { UnitSystem } from '@shared/geometry';
import { WeatherDayTextSchema } from '@shared/schemas/weather';
import {
  crossFieldProblems,
  rangeProblem,
  storedSi,
  toDisplayWeather,
  weatherQuantity,
  type WeatherValueKey,
  type WeatherValues,
} from '@shared/weather';

// The weather forms hold what was typed, in the site's units, under the API's own names (tMinC holds
// °F on a US site), so the server's field errors land on the right input. Reading a form turns the
// texts into SI values with the same bounds and rules as the server (shared/weather).

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;

export type WeatherTexts = Partial<Record<WeatherValueKey, string>>;

/** A blank input: `null` clears the stored value (the day's form), `omit` leaves it as stored (the rain gauge's temperatures). */
export type BlankRule = 'null' | 'omit';

/** The texts of a form as SI values, with a message for each input that is wrong. */
export function readWeatherTexts(
  texts: WeatherTexts,
  units: UnitSystem,
  blank: BlankRule,
): { values: Partial<WeatherValues>; problems: Partial<Record<WeatherValueKey, string>> } {
  const values: Partial<WeatherValues> = {};
  const problems: Partial<Record<WeatherValueKey, string>> = {};
  for (const [key, raw] of Object.entries(texts) as Array<[WeatherValueKey, string | undefined]>) {
    const text = (raw ?? '').trim();
    if (text === '') {
      if (blank === 'null') values[key] = null;
      continue;
    }
    if (!NUMBER.test(text)) {
      problems[key] = 'Enter a number, like 2.5 (with a dot for decimals)';
      continue;
    }
    const q = weatherQuantity[key];
    const problem = rangeProblem(q, Number(text), units);
    if (problem) problems[key] = problem;
    else values[key] = storedSi(q, Number(text), units);
  }
  for (const [key, message] of Object.entries(crossFieldProblems(values)) as Array<[WeatherValueKey, string]>) problems[key] ??= message;
  return { values, problems };
}

/** A stored SI value as the text its input starts with, in the site's units ('' when not known). */
export function valueText(key: WeatherValueKey, value: number | null, units: UnitSystem): string {
  return value === null ? '' : String(toDisplayWeather(weatherQuantity[key].kind, value, units));
}

/** What a weather form holds: the day and the texts of its inputs. */
export type WeatherFormValues = { day: string } & WeatherTexts;

/** What a weather form gives once read: the day and its values in SI. */
export interface WeatherFormResult {
  day: string;
  values: Partial<WeatherValues>;
}

/**
 * A form schema for some weather inputs and a day: checks them in the units typed and turns them into
 * `{ day, values }` in SI. `required` inputs must be filled (the rain gauge's rain).
 */
export function weatherFormSchema(opts: {
  keys: readonly WeatherValueKey[];
  units: UnitSystem;
  blank: BlankRule;
  required?: readonly WeatherValueKey[];
  /** The latest day allowed: the site's today. */
  today: string;
}): z.ZodType<WeatherFormResult, WeatherFormValues> {
  const textsOf = (v: WeatherFormValues): WeatherTexts => Object.fromEntries(opts.keys.map((k) => [k, v[k] ?? '']));
  return z
    .object({ day: z.string() })
    .catchall(z.string())
    .superRefine((raw, ctx) => {
      const v = raw as WeatherFormValues;
      const day = WeatherDayTextSchema.safeParse(v.day);
      if (!day.success) ctx.addIssue({ code: 'custom', path: ['day'], message: day.error.issues[0].message });
      else if (v.day > opts.today) ctx.addIssue({ code: 'custom', path: ['day'], message: 'Not after today at the site' });
      const texts = textsOf(v);
      for (const k of opts.required ?? []) {
        if ((texts[k] ?? '').trim() === '') ctx.addIssue({ code: 'custom', path: [k], message: 'Enter a value' });
      }
      const { values, problems } = readWeatherTexts(texts, opts.units, opts.blank);
      for (const [key, message] of Object.entries(problems)) ctx.addIssue({ code: 'custom', path: [key], message });
      const empty = Object.values(values).every((x) => x === null || x === undefined);
      if (Object.keys(problems).length === 0 && empty && !opts.required?.length) {
        ctx.addIssue({ code: 'custom', path: [opts.keys[0]], message: 'Give at least one value for the day' });
      }
    })
    .transform((raw) => {
      const v = raw as WeatherFormValues;
      return { day: v.day, values: readWeatherTexts(textsOf(v), opts.units, opts.blank).values };
    }) as unknown as z.ZodType<WeatherFormResult, WeatherFormValues>;
}
