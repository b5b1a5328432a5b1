import { Router } from 'express';
import { idempotent } from '../middleware/idempotency';
import { HandoverBodySchema, SiteTaskQuerySchema, TaskCreateBodySchema, TaskStatusBodySchema, WaterQuerySchema } from '@shared/schemas/tasks';
import type { Deps } from '../deps';
import { csvText } from '../services/csv-files';
import { sendCsv } from '../csv-download';
import { parseInput } from '../errors';
import { requireRoleVia, requireUser } from '../middleware/auth';
import { clubOfSite } from '../services/sites';
import { kickTaskRuns, queueTaskRun, taskRunFor } from '../services/task-runs';
import {
  cancelHandover,
  createCoordinatorTasks,
  createHandover,
  deleteCoordinatorTask,
  plotTasks,
  setTaskStatus,
  siteTasks,
  waterSummary,
} from '../services/task-views';
import { idParam } from './params';

const kindWords = {
  water: 'Water',
  weed: 'Weed',
  thin: 'Thin',
  side_dress: 'Side-dress',
  mulch: 'Mulch',
  scout: 'Look over',
  harvest: 'Harvest',
  other: 'Other',
} as const;

/**
 * The season's tasks, mounted at /api: a plot's tasks for those who may read its plot book (who may
 * change them is checked in the services), a site's list, tasks and runs for coordinators, and the
 * site's water summary for every member.
 */
export function tasksRouter({ db }: Deps): Router {
  const router = Router();
  const siteCoordinator = requireRoleVia(db, 'siteId', clubOfSite, 'The site', 'coordinator');
  const siteMember = requireRoleVia(db, 'siteId', clubOfSite, 'The site');

  router.get('/plots/:plotId/tasks', requireUser, async (req, res) => {
    res.json(await plotTasks(db, { plotId: idParam(req, 'plotId'), userId: req.session.userId! }));
  });

  for (const [path, to] of [['done', 'done'], ['reopen', 'open'], ['skip', 'skipped']] as const) {
    router.post(`/tasks/:taskId/${path}`, requireUser, idempotent(db), async (req, res) => {
      const taskId = idParam(req, 'taskId');
      const body = parseInput(TaskStatusBodySchema, req.body);
      res.json(await setTaskStatus(db, { taskId, userId: req.session.userId!, to, version: body.version, note: body.note }));
    });
  }

  router.post('/plots/:plotId/handovers', requireUser, async (req, res) => {
    const plotId = idParam(req, 'plotId');
    const body = parseInput(HandoverBodySchema, req.body);
    res.status(201).json(await createHandover(db, { plotId, userId: req.session.userId!, body }));
  });

  router.delete('/handovers/:handoverId', requireUser, async (req, res) => {
    await cancelHandover(db, { handoverId: idParam(req, 'handoverId'), userId: req.session.userId! });
    res.status(204).end();
  });

  router.get('/sites/:siteId/tasks', siteCoordinator, async (req, res) => {
    const query = parseInput(SiteTaskQuerySchema, { ...req.query });
    res.json(await siteTasks(db, { siteId: idParam(req, 'siteId'), query }));
  });

  router.get('/sites/:siteId/tasks.csv', siteCoordinator, async (req, res) => {
    const query = parseInput(SiteTaskQuerySchema, { ...req.query });
    const list = await siteTasks(db, { siteId: idParam(req, 'siteId'), query });
    const us = list.units === 'us';
    const header = ['Due', 'From', 'To', 'Plot', 'Crop', 'Kind', 'Task', 'Details', us ? 'Amount (in)' : 'Amount (mm)', us ? 'Amount (US gal)' : 'Amount (L)', 'Status', 'For volunteers', 'Source'];
    const rows = list.items.map((t) => [
      t.dueOn,
      t.windowFrom,
      t.windowTo,
      t.plotLabel ?? '',
      t.cropName ?? '',
      kindWords[t.kind],
      t.title,
      t.details,
      t.amountMm === null ? '' : us ? (t.amountMm / 25.4).toFixed(2) : t.amountMm,
      t.amountL === null ? '' : us ? (t.amountL / 3.785411784).toFixed(1) : t.amountL,
      t.status,
      t.forVolunteers ? 'yes' : 'no',
      t.source,
    ]);
    sendCsv(res, `tasks-${list.today}.csv`, csvText(header, rows));
  });

  router.post('/sites/:siteId/tasks', siteCoordinator, async (req, res) => {
    const body = parseInput(TaskCreateBodySchema, req.body);
    res.status(201).json(await createCoordinatorTasks(db, { clubId: req.clubId!, siteId: idParam(req, 'siteId'), userId: req.session.userId!, body }));
  });

  router.delete('/tasks/:taskId', requireUser, async (req, res) => {
    await deleteCoordinatorTask(db, { taskId: idParam(req, 'taskId'), userId: req.session.userId! });
    res.status(204).end();
  });

  router.post('/sites/:siteId/task-runs', siteCoordinator, async (req, res) => {
    const run = await queueTaskRun(db, { clubId: req.clubId!, siteId: idParam(req, 'siteId'), userId: req.session.userId! });
    kickTaskRuns(db);
    res.status(202).json(run);
  });

  router.get('/task-runs/:runId', requireUser, async (req, res) => {
    res.json(await taskRunFor(db, { runId: idParam(req, 'runId'), userId: req.session.userId! }));
  });

  router.get('/sites/:siteId/water', siteMember, async (req, res) => {
    const query = parseInput(WaterQuerySchema, { ...req.query });
    res.json(await waterSummary(db, { siteId: idParam(req, 'siteId'), weeks: query.weeks }));
  });

  return router;
}
