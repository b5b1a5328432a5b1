// The value lists and labels that the schemas build their enums from, with no zod, so that the first page can
// show them without loading zod (DEVELOPERS.md, "First page without zod"). The schema modules re-export them.

export const roles = ['coordinator', 'plot_holder', 'volunteer'] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  coordinator: 'Coordinator',
  plot_holder: 'Plot holder',
  volunteer: 'Volunteer',
};

/** Roles as words in a sentence, in the order of `roles`: "plot holder, volunteer" ("coordinator" for one). */
export function roleWords(held: readonly Role[]): string {
  return roles.filter((r) => held.includes(r)).map((r) => roleLabels[r].toLowerCase()).join(', ');
}

export const plotKinds = ['in_ground', 'raised_bed', 'container', 'shared_bed'] as const;
export type PlotKind = (typeof plotKinds)[number];
export const plotKindLabels: Record<PlotKind, string> = {
  in_ground: 'In-ground plot',
  raised_bed: 'Raised bed',
  container: 'Container',
  shared_bed: 'Shared bed',
};

export const taskKinds = ['water', 'weed', 'thin', 'side_dress', 'mulch', 'scout', 'harvest', 'other'] as const;
