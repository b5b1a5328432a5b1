import type { ReactNode } from 'react';

type BadgeTone = 'neutral' | 'leaf' | 'straw';

const tones: Record<BadgeTone, string> = {
  neutral: 'bg-paper-100 text-soil border-paper-300',
  leaf: 'bg-leaf-50 text-leaf-800 border-leaf-100',
  straw: 'bg-straw-100 text-soil border-straw',
};

/** A small label such as a role name or "Coming soon". */
export function Badge({ tone = 'neutral', children }: { tone?: BadgeTone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center rounded-full border px-2.5 py-0.5 text-sm font-medium ${tones[tone]}`}>
      {children}
    </span>
  );
}
