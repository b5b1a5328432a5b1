import { Bug, Carrot, ClipboardList, Droplets, Layers, Scissors, Shovel, Sprout, Tractor, type LucideIcon } from 'lucide-react';
import type { ShiftKind } from '@shared/schemas/shifts';
import { kindWords } from '../lib/words';

/** The icon each kind of shift carries, always beside its word (the same icons as the task lists, plus the work day). */
export const kindIcons: Record<ShiftKind, LucideIcon> = {
  water: Droplets,
  weed: Shovel,
  thin: Scissors,
  side_dress: Sprout,
  mulch: Layers,
  scout: Bug,
  harvest: Carrot,
  other: ClipboardList,
  mixed: Tractor,
};

/** A shift's kind as an icon and a word; watering takes the palette's water, the rest stay neutral. */
export function KindTag({ kind }: { kind: ShiftKind }) {
  const Icon = kindIcons[kind];
  const tone = kind === 'water' ? 'border-water bg-water-50 text-water-700' : 'border-paper-300 bg-paper-100 text-soil';
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full border px-2.5 py-0.5 text-sm font-medium whitespace-nowrap ${tone}`}>
      <Icon className="size-4 shrink-0" aria-hidden="true" />
      {kindWords[kind]}
    </span>
  );
}
