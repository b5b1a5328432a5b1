import { Badge } from '@/components/ui/badge';

/** One text badge per need, or a dash when there are none. */
export function NeedsBadges({ needs }: { needs: string[] }) {
  if (needs.length === 0) return <span className="text-stone">–</span>;
  return (
    <ul className="flex flex-col items-start gap-1" aria-label="Needs">
      {needs.map((need) => (
        <li key={need} className="whitespace-nowrap">
          <Badge tone="straw">{need}</Badge>
        </li>
      ))}
    </ul>
  );
}
