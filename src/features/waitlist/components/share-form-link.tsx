import { useId, useState } from 'react';
import { Copy, ExternalLink } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { inputClasses } from '@/components/ui/field';

/** The public application form's address, to copy into a newsletter, a poster or the club's website. */
export function ShareFormLink({ url }: { url: string }) {
  const id = useId();
  const [copied, setCopied] = useState<'yes' | 'no' | null>(null);

  const copy = async () => {
    try {
      await navigator.clipboard.writeText(url);
      setCopied('yes');
    } catch {
      setCopied('no');
    }
  };

  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="font-medium">
        Application form for people who want a plot
      </label>
      <div className="flex flex-col gap-2 sm:flex-row">
        <input
          id={id}
          readOnly
          value={url}
          onFocus={(event) => event.currentTarget.select()}
          className={`${inputClasses} font-mono text-sm sm:max-w-md`}
        />
        <div className="flex gap-2">
          <Button variant="secondary" onClick={() => void copy()}>
            <Copy className="size-5" aria-hidden="true" />
            Copy
          </Button>
          <a href={url} target="_blank" rel="noreferrer" className="inline-flex min-h-11 items-center gap-1.5 px-2 underline">
            <ExternalLink className="size-5" aria-hidden="true" />
            Open
          </a>
        </div>
      </div>
      <p className="text-sm text-stone" aria-live="polite">
        {copied === 'yes'
          ? 'Copied. Paste it wherever people ask how to get a plot.'
          : copied === 'no'
            ? 'Copying is blocked here; select the address and copy it yourself.'
            : 'No account needed: anyone with the link can apply, and gets their place by e-mail.'}
      </p>
    </div>
  );
}
