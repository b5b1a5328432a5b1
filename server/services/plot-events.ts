import type { PlotEvent } from '@shared/schemas/plots';
import type { Db } from '../db/knex';

/** Writes one line of a plot's history. */
export async function recordPlotEvent(
  db: Db,
  e: { plotId: number; userId: number | null; kind: string; details?: Record<string, unknown> },
): Promise<void> {
  await db('plot_events').insert({
    plot_id: e.plotId,
    user_id: e.userId,
    kind: e.kind,
    details: JSON.stringify(e.details ?? {}),
  });
}

const fmt = (v: unknown) => (typeof v === 'number' ? `${Math.round(v * 100) / 100} m` : String(v));

function summarise(kind: string, d: Record<string, unknown>): string {
  const changes = (d.changes ?? {}) as Record<string, { from: unknown; to: unknown }>;
  const list = Object.entries(changes)
    .map(([k, c]) => `${k} ${fmt(c.from)} → ${fmt(c.to)}`)
    .join(', ');
  switch (kind) {
    case 'created':
      return `Drawn on the map as ${String(d.label ?? '')}`.trim();
    case 'imported':
      return `Imported from a CSV file as ${String(d.label ?? '')}`.trim();
    case 'moved':
      return `Moved: ${list}`;
    case 'resized':
      return `Resized: ${list}`;
    case 'edited':
      return `Details changed: ${list}`;
    case 'deleted':
      return 'Removed from the map';
    default:
      return typeof d.summary === 'string' ? d.summary : kind;
  }
}

/** Who the history credits for steps no signed-in person took. */
export const AUTOMATIC_BY = 'Tillwell';

/** A plot's history, newest first, with who did each step. */
export async function listPlotEvents(db: Db, plotId: number, limit = 200): Promise<PlotEvent[]> {
  const rows = await db('plot_events as e')
    .leftJoin('users as u', 'u.id', 'e.user_id')
    .where('e.plot_id', plotId)
    .orderBy([{ column: 'e.created_at', order: 'desc' }, { column: 'e.id', order: 'desc' }])
    .limit(limit)
    .select('e.id', 'e.kind', 'e.details', 'e.created_at', 'e.user_id', 'u.name as by_name');
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    summary: summarise(r.kind, r.details),
    details: r.details,
    // No one's doing: the deadline sweep, a lapse or an answer from an e-mailed link, recorded by the product.
    byName: r.user_id === null ? AUTOMATIC_BY : (r.by_name ?? null),
    at: new Date(r.created_at).toISOString(),
  }));
}
