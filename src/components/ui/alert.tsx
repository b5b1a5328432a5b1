import { CircleCheck, CircleExclamationPoint, Info, TriangleExclamationPoint, type LucideIcon } from 'lucide-react';
import type { ReactNode } from 'react';

export type AlertTone = 'info' | 'success' | 'warning' | 'error';

const tones: Record<AlertTone, { box: string; icon: LucideIcon }> = {
  info: { box: 'border-water bg-water-50 text-water-700', icon: Info },
  success: { box: 'border-leaf bg-leaf-50 text-leaf-800', icon: CircleCheck },
  warning: { box: 'border-straw bg-straw-100 text-soil', icon: TriangleExclamationPoint },
  error: { box: 'border-clay bg-clay-50 text-clay-700', icon: CircleExclamationPoint },
};

export interface AlertProps {
  tone?: AlertTone;
  title?: string;
  children: ReactNode;
  className?: string;
  /** Set false when a live region around it already announces it. */
  announce?: boolean;
}

/** An inline message box; errors interrupt screen readers, the other tones wait politely. */
export function Alert({ tone = 'info', title, children, className = '', announce = true }: AlertProps) {
  const { box, icon: Icon } = tones[tone];
  return (
    <div
      role={announce ? (tone === 'error' ? 'alert' : 'status') : undefined}
      className={`flex gap-3 rounded-lg border-l-4 p-4 ${box} ${className}`}
    >
      <Icon className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
      <div className="min-w-0">
        {title && <p className="font-semibold">{title}</p>}
        <div className={title ? 'mt-1' : ''}>{children}</div>
      </div>
    </div>
  );
}
