import { hoursProgress } from '../lib/hours';

/** Hours given against the club's ask: a simple bar (for the eye only) and the same in words. */
export function HoursBar({ given, required, remaining }: { given: number; required: number | null; remaining?: number | null }) {
  const p = hoursProgress(given, required, remaining);
  return (
    <div className="flex flex-col gap-2">
      {p.percent !== null && (
        <div aria-hidden="true" className="h-4 w-full overflow-hidden rounded-full border border-paper-300 bg-paper-100">
          <div className="h-full rounded-full bg-leaf" style={{ width: `${p.percent}%` }} />
        </div>
      )}
      <p className="font-medium">{p.text}</p>
    </div>
  );
}
