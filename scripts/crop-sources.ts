// Prints how many values of the crop notes (shared/crops) rest on each source, as a Markdown table,
// for the README and for reviewing the catalogue: `npx tsx scripts/crop-sources.ts`.
import { companionCaution, cropRelations, crops, cropSources, defaultRotationGap, diseaseRotationRules, pestsAndDiseases } from '../shared/crops';

const counts = new Map<string, number>();
function walk(x: unknown): void {
  if (x === null || typeof x !== 'object') return;
  const o = x as Record<string, unknown>;
  if (!Array.isArray(x) && typeof o.source === 'string') counts.set(o.source, (counts.get(o.source) ?? 0) + 1);
  for (const v of Object.values(o)) walk(v);
}
walk({ crops, diseaseRotationRules, defaultRotationGap, cropRelations, pestsAndDiseases, companionCaution });

const words = { published: 'published', computed: 'computed', common_practice: 'common practice', from_memory: 'from memory' } as const;
let total = 0;
console.log(`${crops.length} crops, ${cropRelations.length} relations, ${diseaseRotationRules.length} disease rules, ${pestsAndDiseases.length} pests and diseases.\n`);
console.log('| Source | Evidence | Values |\n|---|---|---|');
for (const s of cropSources) {
  const n = counts.get(s.id) ?? 0;
  total += n;
  console.log(`| ${s.title} | ${words[s.evidence]} | ${n} |`);
}
console.log(`| **All** | | **${total}** |`);
