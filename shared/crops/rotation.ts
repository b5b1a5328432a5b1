import type { DiseaseRotationRule, Sourced } from './types';

/**
 * Years a botanical family should stay out of the same soil when no disease has been seen.
 * WVU gives 2–3 years; "not more than once in 3 years" is the common advice, so take 3.
 */
export const defaultRotationGapYears = 3;

/** Where the default gap comes from, for a finding to show. */
export const defaultRotationGap: Sourced<number> = {
  value: defaultRotationGapYears,
  source: 'wvu-rotation',
  note: "printed as 2–3 years; the upper end, matching the common advice 'not more than once in 3 years' (NC State, Surry County, says 4 years is best)",
};

const uconn = (years: number, note: string): Sourced<number> => ({ value: years, source: 'uconn-disease-rotation', note });

/** Soil-borne diseases that lengthen the gap (UConn IPM, rotation periods for vegetable diseases). */
export const diseaseRotationRules: DiseaseRotationRule[] = [
  {
    disease: 'clubroot',
    families: ['Brassicaceae'],
    years: uconn(7, "cabbage family, 'clubroot 7 years (avoid turnip and radish too)'"),
    note: 'Radish and turnip are in the cabbage family and count here; spores survive in soil for many years.',
    suppression: {
      value:
        'Liming to keep the soil pH above about 7.2 suppresses clubroot but does not kill the spores, so the gap still applies. Follow the product label, wear gloves and eye protection when spreading lime, and defer to local regulations and licensed advice.',
      source: 'clubroot-liming',
    },
  },
  {
    disease: 'verticillium-wilt',
    families: ['Solanaceae'],
    crops: ['strawberry'],
    years: uconn(4, "eggplant, 'Verticillium wilt 4 years (avoid tomato, potato, pepper, strawberry)'"),
    note: 'Strawberry is not in the catalogue yet; a club crop with slug strawberry is kept out too.',
  },
  { disease: 'blackleg', families: ['Brassicaceae'], years: uconn(4, 'cabbage family, printed as 3–4 years; the upper end taken') },
  { disease: 'black-rot', families: ['Brassicaceae'], years: uconn(3, 'cabbage family, printed as 2–3 years; the upper end taken') },
  { disease: 'cercospora-leaf-spot', families: [], crops: ['beet', 'chard'], years: uconn(3, "beet, 'Cercospora leaf spot 3'; chard is the same species") },
  { disease: 'bottom-rot-drop', families: [], crops: ['lettuce'], years: uconn(3, "lettuce, 'bottom rot and drop 3'") },
  { disease: 'bean-anthracnose', families: [], crops: ['bush-bean'], years: uconn(2, "beans, 'anthracnose 2'") },
  { disease: 'bean-bacterial-blight', families: [], crops: ['bush-bean'], years: uconn(2, "beans, 'bacterial blight 2'") },
  { disease: 'cucumber-scab', families: [], crops: ['cucumber'], years: uconn(2, "cucumber, 'scab 2'") },
  { disease: 'cucumber-leaf-spot', families: [], crops: ['cucumber'], years: uconn(2, "cucumber, 'leaf spot 2'") },
];
