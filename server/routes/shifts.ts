import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import {
  AskForHelpBodySchema,
  HoursQuerySchema,
  LinkTokenBodySchema,
  ShiftCreateBodySchema,
  ShiftDoneBodySchema,
  ShiftQuerySchema,
  ShiftUpdateBodySchema,
  VolunteerSettingsBodySchema,
} from '@shared/schemas/shifts';
import { VersionSchema } from '@shared/schemas/common';
import { z } from 'zod';
import type { Deps } from '../deps';
import { sendCsv } from '../csv-download';
import { AppError, notFound, parseInput } from '../errors';
import { requireClubRole, requireRoleVia } from '../middleware/auth';
import { idempotent } from '../middleware/idempotency';
import { authRateLimit } from '../middleware/rate-limit';
import { feedByToken, feedStatus, resetFeed, shiftCalendar } from '../services/calendar-feeds';
import { csvText } from '../services/csv-files';
import { MAX_PHOTO_BYTES } from '../services/observations';
import {
  askForHelp,
  callOffShift,
  claimByLink,
  claimShift,
  doneByLink,
  doneShift,
  previewShiftLink,
  releaseByLink,
  releaseShift,
  shiftPhoto,
} from '../services/shift-claims';
import { getVolunteerSettings, hoursCsvRows, HOURS_CSV_FIELDS, hoursTable, myShifts, setVolunteerSettings } from '../services/shift-hours';
import { clubOfShift, createShift, listShifts, shiftDetail, shiftRows, shiftSuggestions, toShiftViews, updateShift, type ShiftRow } from '../services/shifts';
import { idParam } from './params';
import { sendStoredFile } from './stored-file';

/** Reads a done form: JSON, or multipart with the fields note, hours, token and one file `photo`. */
function doneForm(): RequestHandler {
  const parse = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 4, fieldSize: 4000, parts: 5 } }).single('photo');
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) return next();
    parse(req, res, (err: unknown) => {
      if (!err) return next();
      const message =
        err instanceof multer.MulterError
          ? err.code === 'LIMIT_FILE_SIZE'
            ? 'The image is larger than 8 MB'
            : 'Send a note, the hours and at most one photo in the field "photo"'
          : 'The upload could not be read; try again';
      next(new AppError('validation_failed', message, { photo: message }));
    });
  };
}

/** The done body from either form: multipart fields are text, so hours is read as a number here. */
function doneBody(body: Record<string, unknown>) {
  const { token: _token, ...rest } = body ?? {};
  const hours = rest.hours;
  return parseInput(ShiftDoneBodySchema, {
    ...rest,
    ...(typeof hours === 'string' ? { hours: hours.trim() === '' ? null : Number(hours.replace(',', '.')) } : {}),
  });
}

const VersionBodySchema = z.strictObject({ version: VersionSchema });

/**
 * Shifts, mounted at /api: the board and coordinators' work under /clubs/:clubId, one shift under
 * /shifts/:shiftId, the e-mailed links under /shift-links (no sign-in; the token is the key), and
 * calendar feeds under /feeds/:token.ics (a secret address).
 */
export function shiftsRouter({ db, mailer, config, storage }: Deps): Router {
  const router = Router();
  const ctx = () => ({ db, mailer, publicUrl: config.publicUrl, storage });
  const member = requireClubRole(db);
  const coordinator = requireClubRole(db, 'coordinator');
  const shiftMember = requireRoleVia(db, 'shiftId', clubOfShift, 'The shift');
  const shiftCoordinator = requireRoleVia(db, 'shiftId', clubOfShift, 'The shift', 'coordinator');
  const viewer = (req: Parameters<RequestHandler>[0]) => ({ userId: req.session.userId!, roles: req.clubRoles! });
  const limit = authRateLimit(db, 'shift-links', config.authRateLimit * 3);

  router.get('/clubs/:clubId/shifts', member, async (req, res) => {
    const query = parseInput(ShiftQuerySchema, { ...req.query });
    res.json(await listShifts(db, { clubId: req.clubId!, viewer: viewer(req), query }));
  });
  router.get('/clubs/:clubId/shift-suggestions', coordinator, async (req, res) => {
    const q = parseInput(ShiftQuerySchema, { ...req.query });
    res.json(await shiftSuggestions(db, { clubId: req.clubId!, siteId: q.siteId, from: q.from, to: q.to }));
  });
  router.post('/clubs/:clubId/shifts', coordinator, idempotent(db), async (req, res) => {
    const body = parseInput(ShiftCreateBodySchema, req.body);
    res.status(201).json(await createShift(db, { clubId: req.clubId!, userId: req.session.userId!, viewer: viewer(req), body }));
  });
  router.get('/clubs/:clubId/my-shifts', member, async (req, res) => {
    res.json(await myShifts(db, { clubId: req.clubId!, viewer: viewer(req) }));
  });
  router.get('/clubs/:clubId/hours', coordinator, async (req, res) => {
    const { year } = parseInput(HoursQuerySchema, { ...req.query });
    res.json(await hoursTable(db, { clubId: req.clubId!, year }));
  });
  router.get('/clubs/:clubId/hours.csv', coordinator, async (req, res) => {
    const { year } = parseInput(HoursQuerySchema, { ...req.query });
    const table = await hoursTable(db, { clubId: req.clubId!, year });
    sendCsv(res, `volunteer-hours-${table.year}.csv`, csvText(HOURS_CSV_FIELDS, hoursCsvRows(table)));
  });
  router.get('/clubs/:clubId/volunteer-settings', member, async (req, res) => {
    res.json(await getVolunteerSettings(db, { clubId: req.clubId!, userId: req.session.userId! }));
  });
  router.put('/clubs/:clubId/volunteer-settings', member, async (req, res) => {
    const body = parseInput(VolunteerSettingsBodySchema, req.body);
    res.json(await setVolunteerSettings(db, { clubId: req.clubId!, userId: req.session.userId!, body }));
  });
  router.get('/clubs/:clubId/feeds', member, async (req, res) => {
    res.json(await feedStatus(db, { clubId: req.clubId!, userId: req.session.userId! }));
  });
  router.post('/clubs/:clubId/feeds/personal', member, async (req, res) => {
    res.json(await resetFeed(db, { clubId: req.clubId!, userId: req.session.userId!, kind: 'personal', publicUrl: config.publicUrl }));
  });
  router.post('/clubs/:clubId/feeds/club', coordinator, async (req, res) => {
    res.json(await resetFeed(db, { clubId: req.clubId!, userId: req.session.userId!, kind: 'club', publicUrl: config.publicUrl }));
  });

  router.get('/shifts/:shiftId', shiftMember, async (req, res) => {
    res.json(await shiftDetail(db, { shiftId: idParam(req, 'shiftId'), viewer: viewer(req) }));
  });
  router.patch('/shifts/:shiftId', shiftCoordinator, async (req, res) => {
    const body = parseInput(ShiftUpdateBodySchema, req.body);
    res.json(await updateShift(db, { shiftId: idParam(req, 'shiftId'), viewer: viewer(req), body }));
  });
  router.post('/shifts/:shiftId/call-off', shiftCoordinator, async (req, res) => {
    const { version } = parseInput(VersionBodySchema, req.body);
    res.json(await callOffShift(ctx(), { shiftId: idParam(req, 'shiftId'), viewer: viewer(req), version }));
  });
  router.post('/shifts/:shiftId/claim', shiftMember, async (req, res) => {
    res.json(await claimShift(ctx(), { shiftId: idParam(req, 'shiftId'), viewer: viewer(req) }));
  });
  router.post('/shifts/:shiftId/release', shiftMember, async (req, res) => {
    res.json(await releaseShift(ctx(), { shiftId: idParam(req, 'shiftId'), viewer: viewer(req) }));
  });
  router.post('/shifts/:shiftId/done', shiftMember, doneForm(), idempotent(db), async (req, res) => {
    const body = doneBody(req.body);
    res.json(await doneShift(ctx(), { shiftId: idParam(req, 'shiftId'), viewer: viewer(req), body, photo: req.file?.buffer }));
  });
  router.post('/shifts/:shiftId/ask-for-help', shiftCoordinator, idempotent(db), async (req, res) => {
    const { note } = parseInput(AskForHelpBodySchema, req.body ?? {});
    res.json(await askForHelp(ctx(), { shiftId: idParam(req, 'shiftId'), viewer: viewer(req), note }));
  });
  router.get('/shifts/:shiftId/claims/:claimId/photo', shiftMember, async (req, res) => {
    const found = await shiftPhoto(db, { shiftId: idParam(req, 'shiftId'), claimId: idParam(req, 'claimId'), viewer: viewer(req) });
    await sendStoredFile(res, storage, found, 'The photo');
  });

  router.get('/shift-links/preview', limit, async (req, res) => {
    const { token } = parseInput(LinkTokenBodySchema, { ...req.query });
    res.json(await previewShiftLink(db, { token }));
  });
  router.post('/shift-links/claim', limit, async (req, res) => {
    const { token } = parseInput(LinkTokenBodySchema, req.body);
    res.json(await claimByLink(ctx(), { token }));
  });
  router.post('/shift-links/release', limit, async (req, res) => {
    const { token } = parseInput(LinkTokenBodySchema, req.body);
    res.json(await releaseByLink(ctx(), { token }));
  });
  router.post('/shift-links/done', limit, doneForm(), async (req, res) => {
    const { token } = parseInput(LinkTokenBodySchema, { token: req.body?.token });
    res.json(await doneByLink(ctx(), { token, body: doneBody(req.body), photo: req.file?.buffer }));
  });

  router.get('/feeds/:file', limit, async (req, res) => {
    const m = /^([A-Za-z0-9_-]{20,100})\.ics$/.exec(String(req.params.file));
    if (!m) throw notFound('That calendar address');
    const feed = await feedByToken(db, m[1]);
    let q = shiftRows(db).where('sh.club_id', feed.clubId).where('sh.ends_at', '>', db.raw("now() - interval '60 days'"));
    if (feed.kind === 'personal') {
      q = q.whereIn('sh.id', db('shift_claims').where({ user_id: feed.userId }).whereIn('status', ['taken', 'done', 'missed']).select('shift_id'));
    }
    const rows: ShiftRow[] = await q.orderBy('sh.starts_at').limit(2000);
    const views = await toShiftViews(db, rows, null);
    const club = await db('clubs').where({ id: feed.clubId }).first('name');
    const ics = shiftCalendar(
      feed.kind === 'club' ? `${club.name}: all shifts` : `${club.name}: my shifts`,
      rows.map((r, i) => ({
        id: r.id,
        title: r.title,
        siteName: r.site_name,
        startsAt: new Date(r.starts_at),
        endsAt: new Date(r.ends_at),
        timeZone: r.time_zone,
        instructions: r.instructions,
        caution: views[i].caution,
        url: `${config.publicUrl}/clubs/${r.club_id}/shifts/${r.id}`,
        calledOff: r.called_off_at !== null,
      })),
      new URL(config.publicUrl).host,
    );
    res.set({ 'Content-Type': 'text/calendar; charset=utf-8', 'Cache-Control': 'private, max-age=300' }).send(ics);
  });

  return router;
}
