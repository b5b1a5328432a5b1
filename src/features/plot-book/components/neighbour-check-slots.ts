import type { ComponentType, ReactNode } from 'react';
import type { FindingView } from '@shared/schemas/findings';
import type { PlotPart } from '@shared/schemas/plot-book';
import type { PlantingCheckInput } from '../lib/check-draft';

/**
 * The neighbour check's pieces the plot book shows. Features do not import each other, so src/app hands these in
 * (from src/features/findings); left out, the plot book simply goes without them.
 */
export interface NeighbourCheckSlots {
  /** Under the planting form: the dry run of what is filled in so far; says when it holds a clash. */
  PlantingCheck: ComponentType<{ plotId: number; draft: PlantingCheckInput | null; onClashChange: (clash: boolean) => void }>;
  /** The season's findings, grouped by planting. */
  NeighbourCheck: ComponentType<{ findings: readonly FindingView[]; plantings: readonly { id: number; name: string }[]; showKeptReasons: boolean }>;
  /** The club's crops ranked for this plot (or a part drawn with the part picker) on a date. */
  WhatFits: ComponentType<{
    plotId: number;
    plantingsStamp: string;
    renderPartPicker?: (value: PlotPart | null, onChange: (part: PlotPart | null) => void) => ReactNode;
    showKeptReasons: boolean;
  }>;
}

/**
 * The season's tasks for the plot (src/app hands it in from src/features/tasks); shown only in the current
 * season's book, under a heading whose id is "tasks" so the home page can link straight to it.
 */
export type TasksSlot = ComponentType<{ clubId: number; plotId: number; plotLabel: string; siteId: number; siteName: string }>;
