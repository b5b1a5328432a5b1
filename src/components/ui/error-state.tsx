import { CloudOff } from 'lucide-react';
import { Button } from './button';

export interface ErrorStateProps {
  title?: string;
  message: string;
  onRetry?: () => void;
  retrying?: boolean;
  requestId?: string;
  /** h1 when the error is the whole page (a link that no longer works), so the page still has its heading. */
  headingLevel?: 'h1' | 'h2';
}

/** Says what failed, offers a retry, and shows the request id for support. */
export function ErrorState({
  title = "That didn't load",
  message,
  onRetry,
  retrying = false,
  requestId,
  headingLevel: Heading = 'h2',
}: ErrorStateProps) {
  return (
    <div role="alert" className="flex flex-col items-center px-4 py-10 text-center">
      <span className="mb-4 flex size-14 items-center justify-center rounded-full bg-clay-50 text-clay-700">
        <CloudOff className="size-7" aria-hidden="true" />
      </span>
      <Heading className="text-xl font-semibold">{title}</Heading>
      <p className="mt-2 max-w-md text-stone">{message}</p>
      {requestId && <p className="mt-1 text-sm text-stone">Reference: {requestId}</p>}
      {onRetry && (
        <Button variant="secondary" className="mt-6" onClick={onRetry} loading={retrying} loadingText="Trying again…">
          Try again
        </Button>
      )}
    </div>
  );
}
