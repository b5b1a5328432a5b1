import type { Role } from '@shared/schemas/auth';

/**
 * Who is asking, for services whose answer depends on it. The rule (see DEVELOPERS.md): applicants,
 * fees, arrears and other people's names are the coordinator's; a plot holder or volunteer sees
 * whether a plot is free or taken, and their own holding with their own name.
 */
export interface Viewer {
  userId: number;
  roles: Role[];
}

/** Coordinators see people: applicants, holders, renewals, fees and the full plot history. */
export const seesPeople = (v: Viewer) => v.roles.includes('coordinator');

/** Plot history kinds about the plot itself (drawn, moved, resized…), not about people. */
export const physicalPlotEvents = new Set(['created', 'imported', 'moved', 'resized', 'edited', 'deleted']);
