import { useEffect, useId, useRef, type ReactNode } from 'react';
import { X } from 'lucide-react';
import { Button } from './button';

export interface DialogProps {
  open: boolean;
  onClose: () => void;
  title: string;
  description?: ReactNode;
  children: ReactNode;
}

/** A modal built on the native <dialog>: the browser traps focus, Escape closes it, and focus returns on close. */
export function Dialog({ open, onClose, title, description, children }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const ids = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={`${ids}-title`}
      aria-describedby={description ? `${ids}-description` : undefined}
      onClose={onClose}
      className="m-auto w-[calc(100%-2rem)] max-w-lg rounded-2xl border border-paper-200 bg-white p-0 text-soil shadow-xl backdrop:bg-soil/40"
    >
      {open && (
        <div className="flex flex-col gap-4 p-5 sm:p-6">
          <div className="flex items-start justify-between gap-3">
            <h2 id={`${ids}-title`} className="text-xl font-semibold">
              {title}
            </h2>
            <Button variant="ghost" className="-mt-2 -mr-2 px-2" onClick={onClose} aria-label="Close">
              <X className="size-5" aria-hidden="true" />
            </Button>
          </div>
          {description && (
            <div id={`${ids}-description`} className="-mt-2 text-stone">
              {description}
            </div>
          )}
          {children}
        </div>
      )}
    </dialog>
  );
}
