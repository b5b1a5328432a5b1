import { cropSourceById } from '../crops/sources';
import type { FindingEvidence, FindingSource } from './types';

/**
 * Sources of the check's own rules (beside the crop notes' sources): the noon shadow is computed
 * from the sun's position, and the few thresholds we chose ourselves say so.
 */
const ownSources: FindingSource[] = [
  {
    id: 'noon-shadow',
    title: 'Sun elevation at solar noon from the suncalc package (checked against the NOAA Solar Calculator); shadow length = height ÷ tan(elevation), computed',
    evidence: 'computed',
  },
];

/** The source behind a value or rule, as a finding shows it; an unknown key says so rather than failing. */
export function findingSource(id: string, evidence?: FindingEvidence): FindingSource {
  const own = ownSources.find((s) => s.id === id);
  if (own) return own;
  const crop = cropSourceById(id);
  if (crop) return { id: crop.id, title: crop.title, evidence: evidence ?? crop.evidence, ...(crop.url ? { url: crop.url } : {}) };
  return { id, title: id, evidence: evidence ?? 'from_memory' };
}
