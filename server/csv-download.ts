import type { Response } from 'express';

// A byte-order mark makes spreadsheet programs read the file as UTF-8 (common practice); imports drop it.
const BOM = '\uFEFF';

/** Sends CSV text as a download named `name`, kept out of shared caches. */
export function sendCsv(res: Response, name: string, csv: string): void {
  res.attachment(name);
  res.set({ 'Content-Type': 'text/csv; charset=utf-8', 'Cache-Control': 'private, no-cache' });
  res.send(BOM + csv);
}

/** A download name from a site's name, without the characters file systems refuse. */
export const siteFileName = (name: string, suffix: string) =>
  `${name.replace(/[\\/:*?"<>|\p{Cc}]+/gu, '-').trim() || 'site'}-${suffix}`;
