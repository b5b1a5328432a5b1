import { Ban, CircleCheck, CircleMinus, UserPlus, UsersRound, type LucideIcon } from 'lucide-react';
import type { ShiftState } from '@shared/schemas/shifts';
import { stateWords } from '../lib/words';

/** Each state's icon: a different shape for each, so the state reads without its colour. */
export const stateIcons: Record<ShiftState, LucideIcon> = {
  needs_people: UserPlus,
  covered: UsersRound,
  done: CircleCheck,
  not_done: CircleMinus,
  called_off: Ban,
};

/** Each state's colours from the palette; the word and the icon say the same thing. */
const stateTones: Record<ShiftState, string> = {
  needs_people: 'border-straw border-dashed bg-straw-100 text-soil',
  covered: 'border-leaf-100 bg-leaf-50 text-leaf-800',
  done: 'border-leaf bg-leaf text-white',
  not_done: 'border-clay bg-clay-50 text-clay-700',
  called_off: 'border-paper-300 bg-paper-100 text-soil',
};

/** A shift's state as an icon and its word. */
export function StateTag({ state }: { state: ShiftState }) {
  const Icon = stateIcons[state];
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full border-2 px-2.5 py-0.5 text-sm font-semibold whitespace-nowrap ${stateTones[state]}`}>
      <Icon className="size-4 shrink-0" aria-hidden="true" />
      {stateWords[state]}
    </span>
  );
}
