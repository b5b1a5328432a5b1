import { X } from 'lucide-react';
import { Alert } from './alert';

export interface Notice {
  tone: 'error' | 'success';
  text: string;
}

/**
 * A notice floating over the bottom of the window, so showing it never moves the page under the
 * pointer. Both live regions are always in the page, so a screen reader hears each new notice:
 * errors at once, the rest when it is free.
 */
export function NoticeToast({ notice, onDismiss }: { notice: Notice | null; onDismiss(): void }) {
  const box = (tone: Notice['tone']) =>
    notice?.tone === tone ? (
      <div className="pointer-events-auto w-full max-w-md shadow-lg">
        <Alert tone={tone} announce={false}>
          <div className="flex items-start gap-2">
            <p className="min-w-0 flex-1">{notice.text}</p>
            <button
              type="button"
              onClick={onDismiss}
              aria-label="Dismiss the notice"
              className="-my-2 -mr-2 inline-flex size-11 shrink-0 items-center justify-center rounded-lg hover:bg-black/5"
            >
              <X className="size-5" aria-hidden="true" />
            </button>
          </div>
        </Alert>
      </div>
    ) : null;
  return (
    <div className="pointer-events-none fixed inset-x-0 bottom-0 z-40 flex flex-col items-center gap-2 p-3 sm:items-end sm:p-4">
      <div role="alert" className="flex w-full justify-center sm:justify-end">
        {box('error')}
      </div>
      <div role="status" className="flex w-full justify-center sm:justify-end">
        {box('success')}
      </div>
    </div>
  );
}
