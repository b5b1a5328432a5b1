import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ArrowLeft, CircleAlert, Handshake, SearchX, Split, Bug } from 'lucide-react';
import { CAUTION_WORDS, SAFETY_CAUTION } from '@shared/crops/caution';
import { pestsAndDiseases } from '@shared/crops/pests';
import { companionCaution } from '@shared/crops/relations';
import { cropSourceById } from '@shared/crops/sources';
import type { CropDetail, CropRelationView, CropSourceView } from '@shared/schemas/crops';
import { Button } from '@/components/ui/button';
import { useDeleteCropRelation } from '../api/create-crop-relation';
import { AddClubRelation } from './add-club-relation';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { DeadEnd } from '@/components/ui/dead-end';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api/client';
import { paths } from '@/lib/paths';
import { useCrop } from '../api/get-crop';
import {
  feedingLabels,
  formatCm,
  formatCmRange,
  formatDays,
  formatMaturity,
  formatTemperature,
  formatTemperatureRange,
  frostLabels,
  kindLabels,
  sowingLabels,
  sunLabels,
  trimNumber,
  type TypedCropDetail,
} from '../lib/format';
import { ClubValue, type ClubValueField } from './club-value';
import { SourceNote } from './source-note';
import { CardSection } from '@/components/ui/page-section';

type Sourced<T> = { value: T; source: string; note?: string; overridden?: true };

function Value<T>({
  term,
  value,
  sources,
  action,
  children,
}: {
  term: string;
  value: Sourced<T> | undefined;
  sources: Map<string, CropSourceView>;
  /** The coordinator's "Use a club value" controls, when this value takes one. */
  action?: ReactNode;
  children: (v: T, note?: string) => ReactNode;
}) {
  return (
    <div className="border-b border-paper-200 py-3 last:border-b-0">
      <dt className="font-medium text-stone">{term}</dt>
      <dd className="min-w-0 break-words">
        {value === undefined ? (
          <span className="text-stone">Not known yet</span>
        ) : (
          <>
            <div className="text-lg">{children(value.value, value.note)}</div>
            <SourceNote source={sources.get(value.source)} note={value.note} overridden={value.overridden} />
          </>
        )}
        {action}
      </dd>
    </div>
  );
}

const termOf: Record<ClubValueField, string> = {
  sowing: 'How it is sown',
  sowingDepthCm: 'Sowing depth',
  inRowCm: 'Apart in the row',
  betweenRowCm: 'Between rows',
  equalSpacingCm: 'Equal spacing in a bed',
  daysToEmergence: 'Days to emergence',
  daysToMaturity: 'Days to maturity',
  matureHeightCm: 'Height when grown',
  rootingDepthCm: 'Rooting depth',
  feeding: 'Feeding',
  soilPh: 'Soil pH',
  sun: 'Sun',
  frost: 'Frost',
};

// The Harrington columns: soil temperatures of 10, 15, 20, 25 and 30 °C (printed as 50–86 °F).
const EMERGENCE_TEMPERATURES_C = [10, 15, 20, 25, 30];

function Values({ crop, clubId, canSetClubValues }: { crop: TypedCropDetail; clubId: number; canSetClubValues: boolean }) {
  const sources = new Map(crop.sources.map((s) => [s.id, s]));
  // Club values are for reference crops; a club crop's values are all the club's already.
  const editable = canSetClubValues && !crop.isClubCrop;
  const v = (field?: ClubValueField) => ({
    sources,
    action:
      editable && field ? <ClubValue clubId={clubId} cropId={crop.id} field={field} term={termOf[field]} current={crop[field]} /> : undefined,
  });
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <CardSection id="crop-names" title="Name and family">
        <dl>
          <Value term="Botanical name" value={crop.botanicalName} {...v()}>
            {(name) => <i>{name}</i>}
          </Value>
          <Value term="Botanical family" value={crop.family} {...v()}>
            {(family) => family}
          </Value>
        </dl>
      </CardSection>
      <CardSection id="crop-sowing" title="Sowing and spacing">
        <dl>
          <Value term={termOf.sowing} value={crop.sowing} {...v('sowing')}>
            {(s) => sowingLabels[s]}
          </Value>
          <Value term={termOf.sowingDepthCm} value={crop.sowingDepthCm} {...v('sowingDepthCm')}>
            {formatCmRange}
          </Value>
          <Value term={termOf.inRowCm} value={crop.inRowCm} {...v('inRowCm')}>
            {formatCmRange}
          </Value>
          <Value term={termOf.betweenRowCm} value={crop.betweenRowCm} {...v('betweenRowCm')}>
            {formatCmRange}
          </Value>
          <Value term={termOf.equalSpacingCm} value={crop.equalSpacingCm} {...v('equalSpacingCm')}>
            {formatCmRange}
          </Value>
        </dl>
      </CardSection>
      <CardSection id="crop-germination" title="Germination and emergence">
        <dl>
          <Value term="Soil temperature for germination" value={crop.germination} {...v()}>
            {(g, note) => (
              <ul>
                <li>Lowest: {formatTemperature(g.minC, note)}</li>
                <li>Best: {formatTemperatureRange(g.optimumC, note)}</li>
                <li>Highest: {formatTemperature(g.maxC, note)}</li>
              </ul>
            )}
          </Value>
          <Value term={termOf.daysToEmergence} value={crop.daysToEmergence} {...v('daysToEmergence')}>
            {formatDays}
          </Value>
          {crop.emergenceByTemperature && (
            <Value term="Days to emergence by soil temperature" value={crop.emergenceByTemperature} {...v()}>
              {(table) => (
                <ul>
                  {table.map((days, i) => (
                    <li key={EMERGENCE_TEMPERATURES_C[i]}>
                      {formatTemperature(EMERGENCE_TEMPERATURES_C[i], '°F')}:{' '}
                      {days === null ? 'does not come up' : `${days} ${days === 1 ? 'day' : 'days'}`}
                    </li>
                  ))}
                </ul>
              )}
            </Value>
          )}
        </dl>
      </CardSection>
      <CardSection id="crop-growth" title="Growth and harvest">
        <dl>
          <Value term={termOf.daysToMaturity} value={crop.daysToMaturity} {...v('daysToMaturity')}>
            {formatMaturity}
          </Value>
          <Value term={termOf.matureHeightCm} value={crop.matureHeightCm} {...v('matureHeightCm')}>
            {formatCmRange}
          </Value>
          <Value term={termOf.rootingDepthCm} value={crop.rootingDepthCm} {...v('rootingDepthCm')}>
            {formatCmRange}
          </Value>
          <Value term={termOf.feeding} value={crop.feeding} {...v('feeding')}>
            {(f) => feedingLabels[f]}
          </Value>
          <Value term="Side-dressing" value={crop.sideDressing} {...v()}>
            {(s) =>
              !s.needed
                ? 'Not needed'
                : s.weeksAfterEmergence
                  ? `${trimNumber(s.weeksAfterEmergence.min)}–${trimNumber(s.weeksAfterEmergence.max)} weeks after emergence (or after transplanting)`
                  : 'Needed'
            }
          </Value>
        </dl>
      </CardSection>
      <CardSection id="crop-soil" title="Soil, sun and frost">
        <dl>
          <Value term="Least soil depth" value={crop.minSoilDepthCm} {...v()}>
            {(d, note) => (
              <ul>
                <li>In a raised bed: {formatCm(d.raisedBed, note)}</li>
                <li>In a container: {formatCm(d.container, note)}</li>
              </ul>
            )}
          </Value>
          <Value term={termOf.soilPh} value={crop.soilPh} {...v('soilPh')}>
            {(r) => (r.min === r.max ? trimNumber(r.min) : `${trimNumber(r.min)}–${trimNumber(r.max)}`)}
          </Value>
          <Value term={termOf.sun} value={crop.sun} {...v('sun')}>
            {(s) => sunLabels[s]}
          </Value>
          <Value term={termOf.frost} value={crop.frost} {...v('frost')}>
            {(f) => frostLabels[f]}
          </Value>
        </dl>
      </CardSection>
      {(crop.kc || crop.stages) && (
        <CardSection id="crop-water" title="Water (FAO-56)">
          <dl>
            {crop.kc && (
              <Value term="Crop coefficient Kc" value={crop.kc} {...v()}>
                {(kc) => (
                  <ul>
                    <li>Initial stage: {trimNumber(kc.initial, 2)}</li>
                    <li>Mid-season: {trimNumber(kc.mid, 2)}</li>
                    <li>
                      At the end: {kc.end.min === kc.end.max ? trimNumber(kc.end.min, 2) : `${trimNumber(kc.end.min, 2)}–${trimNumber(kc.end.max, 2)}`}
                    </li>
                  </ul>
                )}
              </Value>
            )}
            {crop.stages && (
              <Value term="Growth stages" value={crop.stages} {...v()}>
                {(s) => (
                  <ul>
                    <li>Initial stage: {s.initial} days</li>
                    <li>Development: {s.development} days</li>
                    <li>Mid-season: {s.mid} days</li>
                    <li>Late season: {s.late} days</li>
                  </ul>
                )}
              </Value>
            )}
          </dl>
        </CardSection>
      )}
      <CardSection id="crop-storage" title="Storage">
        <dl>
          <Value term="How it keeps" value={crop.storage} {...v()}>
            {(s, note) => (
              <ul>
                <li>At {formatTemperatureRange(s.temperatureC, note)}</li>
                <li>
                  Humidity{' '}
                  {s.humidityPct.min === s.humidityPct.max ? s.humidityPct.min : `${s.humidityPct.min}–${s.humidityPct.max}`} %
                </li>
                <li>Keeps {formatDays(s.days)}</li>
              </ul>
            )}
          </Value>
        </dl>
      </CardSection>
    </div>
  );
}

const evidenceWords = { research: 'research-backed', common_practice: 'common practice' } as const;

function scopeText(scope: CropRelationView['scope']): string {
  return scope.kind === 'same_plot' ? 'In the same plot' : `Same plot or neighbouring plots within ${trimNumber(scope.distanceM, 2)} m`;
}

function RelationItem({ clubId, relation, canEdit }: { clubId: number; relation: CropRelationView; canEdit: boolean }) {
  const apart = relation.effect === 'antagonistic';
  const remove = useDeleteCropRelation(clubId);
  return (
    <li className="py-2">
      <p className="flex flex-wrap items-center gap-2">
        {apart ? (
          <Split className="size-5 text-clay-700" aria-hidden="true" />
        ) : (
          <Handshake className="size-5 text-leaf" aria-hidden="true" />
        )}
        <Link to={paths.crop(clubId, relation.otherCrop.id)} className="inline-flex min-h-11 items-center font-semibold">
          {relation.otherCrop.commonName}
        </Link>
        {relation.severity && <Badge tone={relation.severity === 'clash' ? 'straw' : 'neutral'}>{relation.severity}</Badge>}
        {relation.isClubRelation && <Badge tone="straw">club relation</Badge>}
      </p>
      <p className="mt-1 text-sm font-medium">{scopeText(relation.scope)}</p>
      <p className="mt-1">{relation.reason}</p>
      <p className="mt-1 text-sm text-stone">
        <span className="font-semibold text-soil">{evidenceWords[relation.evidence]}</span>
        {relation.source.evidence === 'common_practice' ? <>: no single published source</> : <>: {relation.source.title}</>}
      </p>
      {canEdit && relation.isClubRelation && (
        <Button
          variant="ghost"
          className="mt-1 -ml-3"
          loading={remove.isPending}
          loadingText="Removing…"
          onClick={() => remove.mutate(relation.id)}
          aria-label={`Remove the club relation with ${relation.otherCrop.commonName}`}
        >
          Remove the club relation
        </Button>
      )}
      {remove.isError && <p className="text-sm font-medium text-clay-700">{remove.error.message}</p>}
    </li>
  );
}

function Relations({ clubId, crop, canEdit }: { clubId: number; crop: CropDetail; canEdit: boolean }) {
  const good = crop.relations.filter((r) => r.effect === 'beneficial');
  const apart = crop.relations.filter((r) => r.effect === 'antagonistic');
  const cautionSource = cropSourceById(companionCaution.source);
  return (
    <CardSection id="crop-relations" title="Companions">
      {canEdit && (
        <div className="mb-4">
          <AddClubRelation clubId={clubId} cropId={crop.id} cropName={crop.commonName} />
        </div>
      )}
      <div className="grid gap-6 md:grid-cols-2">
        <div>
          <h3 className="text-lg font-semibold">Good pairings</h3>
          {good.length === 0 ? (
            <p className="py-3 text-stone">None noted.</p>
          ) : (
            <ul className="divide-y divide-paper-200">
              {good.map((r) => (
                <RelationItem key={r.id} clubId={clubId} relation={r} canEdit={canEdit} />
              ))}
            </ul>
          )}
        </div>
        <div>
          <h3 className="text-lg font-semibold">Keep apart</h3>
          {apart.length === 0 ? (
            <p className="py-3 text-stone">None noted.</p>
          ) : (
            <ul className="divide-y divide-paper-200">
              {apart.map((r) => (
                <RelationItem key={r.id} clubId={clubId} relation={r} canEdit={canEdit} />
              ))}
            </ul>
          )}
        </div>
      </div>
      <div className="mt-4 flex gap-3 rounded-lg border-l-4 border-water bg-water-50 p-4 text-water-700">
        <CircleAlert className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
        <div>
          <p className="font-semibold">About companion planting</p>
          <p className="mt-1">{companionCaution.value}</p>
          {cautionSource && <p className="mt-1 text-sm">published: {cautionSource.title}</p>}
        </div>
      </div>
    </CardSection>
  );
}

const guidanceParts = [
  ['sowing', 'Sowing'],
  ['thinning', 'Thinning'],
  ['watering', 'Watering'],
  ['feeding', 'Feeding'],
  ['pests', 'Pests and diseases'],
] as const;

// The catalogue appends the caution to every text that needs it; the page shows it once, above.
const withoutCaution = (text: string) => text.split(SAFETY_CAUTION).join('').replace(/\s+/g, ' ').trim();

function Guidance({ crop }: { crop: CropDetail }) {
  const parts = guidanceParts.filter(([key]) => crop.guidance[key]);
  const needsCaution = parts.some(([key]) => CAUTION_WORDS.test(crop.guidance[key] ?? ''));
  return (
    <CardSection id="crop-guidance" title="Growing guidance">
      {needsCaution && (
        <Alert tone="warning" title="Take care with sprays, soaps, oils, lime, manure and fertiliser" className="mb-4" announce={false}>
          <p>{SAFETY_CAUTION} This is guidance, not a prescription.</p>
        </Alert>
      )}
      {parts.length === 0 ? (
        <p className="text-stone">No guidance written for this crop yet.</p>
      ) : (
        <dl>
          {parts.map(([key, label]) => (
            <div key={key} className="border-b border-paper-200 py-3 last:border-b-0">
              <dt className="font-semibold">{label}</dt>
              <dd className="mt-1 max-w-prose">{withoutCaution(crop.guidance[key] ?? '')}</dd>
            </div>
          ))}
        </dl>
      )}
      <p className="mt-3 text-sm text-stone">Written in our own words; the values above name their sources.</p>
    </CardSection>
  );
}

const pestBySlug = new Map(pestsAndDiseases.map((p) => [p.slug, p]));

function WatchFor({ crop }: { crop: CropDetail }) {
  return (
    <CardSection id="crop-watch" title="Watch for">
      {crop.watchFor.length === 0 ? (
        <p className="text-stone">Nothing listed for this crop.</p>
      ) : (
        <ul className="divide-y divide-paper-200">
          {crop.watchFor.map((slug) => {
            const pest = pestBySlug.get(slug);
            return (
              <li key={slug} className="flex gap-3 py-2.5">
                <Bug className="mt-0.5 size-5 shrink-0 text-stone" aria-hidden="true" />
                <div className="flex min-w-0 flex-wrap items-center gap-2">
                  <span className="font-medium">{pest?.name ?? slug}</span>
                  {pest && <Badge>{pest.kind}</Badge>}
                  {pest?.soilBorne && <Badge tone="straw">stays in the soil: lengthens the rotation</Badge>}
                </div>
              </li>
            );
          })}
        </ul>
      )}
    </CardSection>
  );
}

export interface CropPageProps {
  clubId: number;
  /** Coordinators see the club-value controls; the server still decides. */
  canSetClubValues?: boolean;
  /** From the URL; NaN when the URL holds no number. */
  cropId: number;
}

function CropNotFound({ clubId }: { clubId: number }) {
  return (
    <DeadEnd clubId={clubId} icon={SearchX} title="We can't find that crop">
      <p>The link may belong to another club. The crop notes list every crop this club can see.</p>
    </DeadEnd>
  );
}

/** One crop's notes: its values in plain words with their sources, its companions, guidance and pests. */
export function CropPage({ clubId, cropId, canSetClubValues = false }: CropPageProps) {
  const query = useCrop(clubId, cropId);
  if (!Number.isInteger(cropId) || cropId < 1 || isApiError(query.error, 404) || isApiError(query.error, 400)) {
    return <CropNotFound clubId={clubId} />;
  }
  if (query.isPending) return <LoadingState label="Loading the crop…" />;
  if (query.isError) {
    return (
      <ErrorState
        message={query.error.message}
        requestId={isApiError(query.error) ? query.error.requestId : undefined}
        onRetry={() => void query.refetch()}
        retrying={query.isFetching}
      />
    );
  }
  const crop = query.data as TypedCropDetail;
  return (
    <>
      <title>{`${crop.commonName} · Crop notes · Tillwell`}</title>
      <Link to={paths.crops(clubId)} className="mb-4 inline-flex min-h-11 items-center gap-1.5 font-medium">
        <ArrowLeft className="size-5" aria-hidden="true" />
        All crop notes
      </Link>
      <PageHeader
        eyebrow="Crop notes"
        title={crop.commonName}
        description={
          <div className="flex flex-col gap-2">
            <p>
              <i>{crop.botanicalName.value}</i> · {crop.family.value} · {kindLabels[crop.kind]}
            </p>
            {crop.isClubCrop && (
              <p>
                <Badge tone="straw">Club crop</Badge> Added by the club; its values are the club's own.
              </p>
            )}
          </div>
        }
      />
      <div className="flex flex-col gap-6">
        <Values crop={crop} clubId={clubId} canSetClubValues={canSetClubValues} />
        <Relations clubId={clubId} crop={crop} canEdit={canSetClubValues} />
        <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
          <Guidance crop={crop} />
          <WatchFor crop={crop} />
        </div>
      </div>
    </>
  );
}
