import { Alert } from '@/components/ui/alert';

/** The server's caution for the work (sprays, tools, heat, lifting), always shown where a place is taken or confirmed. */
export function CautionNote({ caution, compact = false }: { caution: string; compact?: boolean }) {
  if (!caution.trim()) return null;
  return (
    <Alert tone="warning" announce={false} title="Take care" className={compact ? 'p-3 text-sm' : ''}>
      <p className="whitespace-pre-line">{caution}</p>
    </Alert>
  );
}
