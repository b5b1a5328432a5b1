import type { PestOrDisease } from './types';

// Soil-borne diseases carry the UConn source because their flag changes the rotation gap;
// the rest rest on memory.
const uconn = 'uconn-disease-rotation';
const mem = 'from-memory';

/** Pests and diseases a plot book can record; soil-borne ones are kept against the soil. */
export const pestsAndDiseases: PestOrDisease[] = [
  { slug: 'aphids', name: 'Aphids (greenfly, blackfly)', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'slugs', name: 'Slugs and snails', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'cabbage-caterpillars', name: 'Cabbage caterpillars (cabbage white, diamondback moth)', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'flea-beetles', name: 'Flea beetles', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'cucumber-beetles', name: 'Cucumber beetles', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'squash-vine-borer', name: 'Squash vine borer', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'whitefly', name: 'Whitefly', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'colorado-potato-beetle', name: 'Colorado potato beetle', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'corn-earworm', name: 'Corn earworm (tomato fruitworm)', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'carrot-fly', name: 'Carrot fly (carrot rust fly)', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'onion-fly', name: 'Onion fly (onion maggot)', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'cabbage-root-fly', name: 'Cabbage root fly (cabbage maggot)', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'onion-thrips', name: 'Onion thrips', kind: 'pest', soilBorne: false, source: mem },
  { slug: 'leaf-miners', name: 'Leaf miners', kind: 'pest', soilBorne: false, source: mem },
  // Nematodes live in the soil, so a sighting should count against the soil like a disease.
  { slug: 'root-knot-nematodes', name: 'Root-knot nematodes', kind: 'pest', soilBorne: true, source: 'ufifas-eny056' },
  { slug: 'late-blight', name: 'Late blight', kind: 'disease', soilBorne: false, source: mem },
  { slug: 'early-blight', name: 'Early blight', kind: 'disease', soilBorne: true, source: 'cornell-early-blight-rotation' },
  { slug: 'powdery-mildew', name: 'Powdery mildew', kind: 'disease', soilBorne: false, source: mem },
  { slug: 'downy-mildew', name: 'Downy mildew', kind: 'disease', soilBorne: false, source: mem },
  { slug: 'clubroot', name: 'Clubroot', kind: 'disease', soilBorne: true, source: uconn },
  { slug: 'verticillium-wilt', name: 'Verticillium wilt', kind: 'disease', soilBorne: true, source: uconn },
  { slug: 'fusarium-wilt', name: 'Fusarium wilt', kind: 'disease', soilBorne: true, source: mem },
  { slug: 'onion-white-rot', name: 'White rot of onion', kind: 'disease', soilBorne: true, source: mem },
  { slug: 'blackleg', name: 'Blackleg of cabbage-family crops', kind: 'disease', soilBorne: true, source: uconn },
  { slug: 'black-rot', name: 'Black rot of cabbage-family crops', kind: 'disease', soilBorne: true, source: uconn },
  { slug: 'bottom-rot-drop', name: 'Bottom rot and drop of lettuce', kind: 'disease', soilBorne: true, source: uconn },
  { slug: 'cercospora-leaf-spot', name: 'Cercospora leaf spot of beet and chard', kind: 'disease', soilBorne: true, source: uconn },
  { slug: 'bean-anthracnose', name: 'Bean anthracnose', kind: 'disease', soilBorne: true, source: uconn },
  { slug: 'bean-bacterial-blight', name: 'Bacterial blight of bean', kind: 'disease', soilBorne: true, source: uconn },
  { slug: 'cucumber-scab', name: 'Cucumber scab', kind: 'disease', soilBorne: true, source: uconn },
  { slug: 'cucumber-leaf-spot', name: 'Cucumber leaf spot', kind: 'disease', soilBorne: true, source: uconn },
];

const bySlug = new Map(pestsAndDiseases.map((p) => [p.slug, p]));

/** The pest or disease with this slug, or undefined when there is none. */
export function pestBySlug(slug: string): PestOrDisease | undefined {
  return bySlug.get(slug);
}
