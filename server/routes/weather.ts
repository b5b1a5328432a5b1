import { Router, type Request } from 'express';
import { idempotent } from '../middleware/idempotency';
import { parseIdText } from '@shared/schemas/common';
import { UnitsQuerySchema } from '@shared/schemas/sites';
import {
  WeatherCsvQuerySchema,
  WeatherDayBodySchema,
  WeatherDayTextSchema,
  WeatherImportBodySchema,
  WeatherRangeQuerySchema,
} from '@shared/schemas/weather';
import { sendCsv, siteFileName } from '../csv-download';
import type { Deps } from '../deps';
import { AppError, parseInput } from '../errors';
import { requireClubRole, requireUser } from '../middleware/auth';
import { deleteWeatherDay, getWeatherLog, listWeatherSites, putWeatherDay, weatherAccess } from '../services/weather';
import { exportWeatherCsv, importWeather, weatherTemplateCsv } from '../services/weather-imports';

/** The site id in the path, or a 400 naming it. */
function siteIdOf(req: Request): number {
  const id = parseIdText(req.params.siteId);
  if (id === null) throw new AppError('validation_failed', 'Invalid site id.', { siteId: 'Must be a whole number from 1 to 2147483647' });
  return id;
}

/** The calendar day in the path, or a 400 naming it. */
function dayOf(req: Request): string {
  const parsed = WeatherDayTextSchema.safeParse(req.params.day);
  if (!parsed.success) throw new AppError('validation_failed', 'Invalid day in the address.', { day: parsed.error.issues[0].message });
  return parsed.data;
}

/**
 * A site's daily weather log, its CSV files and import, mounted at /api. Who may do what is decided in
 * the service (services/weather.ts): members read, coordinators and this season's holders at the site
 * write, coordinators delete; outside the club every path answers 404.
 */
export function weatherRouter({ db }: Deps): Router {
  const router = Router();

  router.get('/clubs/:clubId/weather-sites', requireClubRole(db), async (req, res) => {
    res.json(await listWeatherSites(db, { clubId: req.clubId!, userId: req.session.userId! }));
  });

  router.get('/sites/:siteId/weather', requireUser, async (req, res) => {
    const siteId = siteIdOf(req);
    const { from, to } = parseInput(WeatherRangeQuerySchema, { ...req.query });
    res.json(await getWeatherLog(db, { siteId, userId: req.session.userId!, from, to }));
  });

  router.put('/sites/:siteId/weather/:day', requireUser, idempotent(db), async (req, res) => {
    const siteId = siteIdOf(req);
    const day = dayOf(req);
    const body = parseInput(WeatherDayBodySchema, req.body);
    // changedDays is where work that follows the weather (task regeneration) joins in; see the service.
    const saved = await putWeatherDay(db, { siteId, userId: req.session.userId!, day, body });
    res.status(saved.created ? 201 : 200).json(saved.day);
  });

  router.delete('/sites/:siteId/weather/:day', requireUser, async (req, res) => {
    const siteId = siteIdOf(req);
    const day = dayOf(req);
    await deleteWeatherDay(db, { siteId, userId: req.session.userId!, day });
    res.status(204).end();
  });

  router.get('/sites/:siteId/weather.csv', requireUser, async (req, res) => {
    const siteId = siteIdOf(req);
    const { from, to, units } = parseInput(WeatherCsvQuerySchema, { ...req.query });
    const { siteName, csv } = await exportWeatherCsv(db, { siteId, userId: req.session.userId!, units, from, to });
    sendCsv(res, siteFileName(siteName, 'weather.csv'), csv);
  });

  router.get('/sites/:siteId/weather-imports/template.csv', requireUser, async (req, res) => {
    const siteId = siteIdOf(req);
    const { units } = parseInput(UnitsQuerySchema, { ...req.query });
    const access = await weatherAccess(db, { siteId, userId: req.session.userId! });
    sendCsv(res, siteFileName(access.site.name, 'weather-template.csv'), weatherTemplateCsv(units ?? access.site.units));
  });

  router.post('/sites/:siteId/weather-imports', requireUser, async (req, res) => {
    const siteId = siteIdOf(req);
    const body = parseInput(WeatherImportBodySchema, req.body);
    const result = await importWeather(db, { siteId, userId: req.session.userId!, ...body });
    res.status(body.commit ? 201 : 200).json(result);
  });

  return router;
}
