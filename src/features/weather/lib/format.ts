import { formatDate } from '@shared/dates';
import type { UnitSystem } from '@shared/geometry';
import type { WeatherDay, WeatherSource } from '@shared/schemas/weather';
import { formatWeather, toDisplayWeather, weatherUnitLabel, type WeatherKind } from '@shared/weather';

// A day of the log is a calendar day at the site, so it is shown as itself ("3 Jun 2026"): no zone can
// move it. Values arrive in SI and are shown in the site's units.

/** "3 Jun 2026". */
export function dayText(day: string): string {
  return formatDate(day, 'UTC');
}

/** "3 Jun" in the year of `today`, "3 Jun 2025" in any other. */
export function shortDayText(day: string, today: string): string {
  const full = dayText(day);
  return day.slice(0, 4) === today.slice(0, 4) ? full.replace(/ \d{4}$/, '') : full;
}

/** "Wed", the day of the week of a calendar day. */
export function weekdayText(day: string): string {
  return new Intl.DateTimeFormat('en-GB', { weekday: 'short', timeZone: 'UTC' }).format(new Date(`${day}T12:00:00Z`));
}

const show = (kind: WeatherKind, v: number, units: UnitSystem) => String(toDisplayWeather(kind, v, units));

/** "8.5 to 17.3 °C", "lowest 8.5 °C", "highest 17.3 °C", or null when neither is known. */
export function temperatureText(d: Pick<WeatherDay, 'tMinC' | 'tMaxC'>, units: UnitSystem): string | null {
  const unit = weatherUnitLabel('temperature', units);
  if (d.tMinC !== null && d.tMaxC !== null) return `${show('temperature', d.tMinC, units)} to ${show('temperature', d.tMaxC, units)} ${unit}`;
  if (d.tMinC !== null) return `lowest ${show('temperature', d.tMinC, units)} ${unit}`;
  if (d.tMaxC !== null) return `highest ${show('temperature', d.tMaxC, units)} ${unit}`;
  return null;
}

/** "12 mm", "0.47 in", or null. */
export function rainText(d: Pick<WeatherDay, 'rainMm'>, units: UnitSystem): string | null {
  return d.rainMm === null ? null : formatWeather('rain', d.rainMm, units);
}

/** "52–96 %, mean 74 %", or null. */
export function humidityText(d: Pick<WeatherDay, 'rhMinPct' | 'rhMaxPct' | 'rhMeanPct'>): string | null {
  const pct = (v: number) => show('percent', v, 'metric');
  const parts: string[] = [];
  if (d.rhMinPct !== null && d.rhMaxPct !== null) parts.push(`${pct(d.rhMinPct)}–${pct(d.rhMaxPct)} %`);
  else if (d.rhMinPct !== null) parts.push(`lowest ${pct(d.rhMinPct)} %`);
  else if (d.rhMaxPct !== null) parts.push(`highest ${pct(d.rhMaxPct)} %`);
  if (d.rhMeanPct !== null) parts.push(`mean ${pct(d.rhMeanPct)} %`);
  return parts.length ? parts.join(', ') : null;
}

/** "2.4 m/s at 2 m", "5.4 mph", or null. */
export function windText(d: Pick<WeatherDay, 'windMs' | 'windHeightM'>, units: UnitSystem): string | null {
  if (d.windMs === null) return null;
  const speed = formatWeather('speed', d.windMs, units);
  return d.windHeightM === null ? speed : `${speed} at ${formatWeather('height', d.windHeightM, units)}`;
}

/** "6.5 h of sun, 18.2 MJ/m²", or null. */
export function sunText(d: Pick<WeatherDay, 'sunshineH' | 'solarMjM2'>): string | null {
  const parts: string[] = [];
  if (d.sunshineH !== null) parts.push(`${show('hours', d.sunshineH, 'metric')} h of sun`);
  if (d.solarMjM2 !== null) parts.push(formatWeather('solar', d.solarMjM2, 'metric'));
  return parts.length ? parts.join(', ') : null;
}

export const sourceWords: Record<WeatherSource, string> = { gauge: 'Rain gauge', form: 'Typed in', import: 'CSV import' };

/** "°C, mm and m/s" or "°F, inches and mph": how the site's values are shown. */
export function unitsSentence(units: UnitSystem): string {
  return units === 'us' ? '°F, inches and mph' : '°C, mm and m/s';
}
