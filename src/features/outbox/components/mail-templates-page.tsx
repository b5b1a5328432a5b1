import { useSearchParams, Link } from 'react-router-dom';
import { Badge } from '@/components/ui/badge';
import { buttonClasses } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { PageSection } from '@/components/ui/page-section';
import { Select } from '@/components/ui/select';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useMailPreview, useMailTemplates } from '../api/get-mail-templates';

export interface MailTemplatesPageProps {
  clubId: number;
  clubName: string;
}

/**
 * Coordinators look at every e-mail the product sends, with sample data of the club: the HTML part in
 * a sandboxed frame (no scripts, no same origin) and the plain-text part beside it.
 */
export function MailTemplatesPage({ clubId, clubName }: MailTemplatesPageProps) {
  const [params, setParams] = useSearchParams();
  const templates = useMailTemplates(clubId);
  const items = templates.data?.items ?? [];
  const chosen = items.find((t) => t.name === params.get('template')) ?? items[0] ?? null;
  const preview = useMailPreview(clubId, chosen?.name ?? null);

  const choose = (name: string) => {
    const next = new URLSearchParams(params);
    next.set('template', name);
    setParams(next, { replace: true });
  };

  return (
    <>
      <title>{`E-mail templates · ${clubName} · Tillwell`}</title>
      <PageHeader
        eyebrow={clubName}
        title="E-mail templates"
        description="Every e-mail Tillwell sends for the club, filled in with sample data. Links in a preview go nowhere. Optional mail carries a link that stops it without signing in; the rest is about the person's own account, plot, payment or place and is always sent."
        actions={
          <Link to={paths.outgoingMail(clubId)} className={buttonClasses('secondary')}>
            Outgoing mail
          </Link>
        }
      />
      {templates.isPending ? (
        <LoadingState label="Loading the templates…" />
      ) : templates.isError ? (
        <ErrorState
          message={templates.error.message}
          requestId={isApiError(templates.error) ? templates.error.requestId : undefined}
          onRetry={() => void templates.refetch()}
          retrying={templates.isFetching}
        />
      ) : (
        <div className="flex flex-col gap-6">
          <Select label="Template" value={chosen?.name ?? ''} onChange={(e) => choose(e.target.value)} className="sm:w-96">
            {items.map((t) => (
              <option key={t.name} value={t.name}>
                {t.label} ({t.optional ? 'optional' : 'always sent'})
              </option>
            ))}
          </Select>
          {chosen && (
            <p className="flex flex-wrap items-center gap-2 text-stone">
              <Badge tone={chosen.optional ? 'straw' : 'leaf'}>{chosen.optional ? 'Optional' : 'Always sent'}</Badge>
              {chosen.description}
            </p>
          )}
          {preview.isPending ? (
            <LoadingState label="Rendering the preview…" />
          ) : preview.isError ? (
            <ErrorState message={preview.error.message} onRetry={() => void preview.refetch()} retrying={preview.isFetching} />
          ) : (
            <>
              <p className="break-words">
                <span className="font-semibold">Subject:</span> {preview.data.subject}
              </p>
              <PageSection id="html-part" title="As most mail programs show it">
                <iframe
                  title={`Preview of ${chosen?.label ?? 'the e-mail'}`}
                  // Its own address, served with a policy that lets e-mail's inline styles apply (a srcdoc frame would take the app's).
                  src={`/api/clubs/${clubId}/mail-templates/${encodeURIComponent(chosen?.name ?? '')}/preview.html`}
                  sandbox=""
                  className="h-[36rem] w-full rounded-xl border border-paper-200 bg-white"
                />
              </PageSection>
              <PageSection id="text-part" title="The plain-text part">
                <pre className="overflow-x-auto rounded-xl border border-paper-200 bg-paper p-4 text-sm whitespace-pre-wrap break-words">{preview.data.text}</pre>
              </PageSection>
            </>
          )}
        </div>
      )}
    </>
  );
}
