/**
 * Types of the crop notes: reference crop data where every value carries where it came from.
 * Units are SI (cm, °C, days) whatever the source printed; a source's own unit is in its note.
 */

/** How far a value can be trusted. */
export type Evidence = 'published' | 'computed' | 'common_practice' | 'from_memory';

/** A publication (or a mark) that values point at, listed once in `sources.ts`. */
export interface CropSource {
  /** Stable key, e.g. `umaine-planting-chart`. */
  id: string;
  /** Publication in words, e.g. "University of Maine Cooperative Extension, Planting chart for the home vegetable garden". */
  title: string;
  evidence: Evidence;
  /** Address where one is known; never fetched by the product. */
  url?: string;
}

/** One value with its source key and, where useful, the table or row it was read from. */
export interface Sourced<T> {
  value: T;
  source: string;
  /** e.g. "Table 12, row 'Radish'" or "printed as 45–90 °F". */
  note?: string;
}

export interface Range {
  min: number;
  max: number;
}

export type CropKind = 'root' | 'leaf' | 'fruiting' | 'legume' | 'allium' | 'brassica' | 'herb' | 'flower';
export type SowingMethod = 'direct' | 'transplant' | 'either';
export type SunNeed = 'full_sun' | 'part_shade' | 'shade';
export type FrostTolerance = 'tender' | 'half_hardy' | 'hardy';
export type Feeding = 'heavy' | 'moderate' | 'light' | 'nitrogen_fixing';

/** FAO-56 Table 11 stage lengths in days: initial, development, mid-season, late season. */
export interface StageLengths {
  initial: number;
  development: number;
  mid: number;
  late: number;
}

/** FAO-56 Table 12 single crop coefficients. */
export interface CropCoefficients {
  initial: number;
  mid: number;
  /** Table 12 prints a range for some crops (tomato 0.70–0.90): keep both ends. */
  end: Range;
}

export interface Germination {
  /** Soil temperature, °C. */
  minC: number;
  optimumC: Range;
  maxC: number;
}

/**
 * Days to emergence at the Harrington soil temperatures (10, 15, 20, 25, 30 °C, printed as
 * 50/59/68/77/86 °F); `null` where the seed does not come up at that temperature.
 */
export type EmergenceTable = [number | null, number | null, number | null, number | null, number | null];

export interface Storage {
  temperatureC: Range;
  /** Relative humidity, per cent. */
  humidityPct: Range;
  /** How long it keeps, in days. */
  days: Range;
}

export interface SideDressing {
  needed: boolean;
  /** Weeks after emergence (or after transplanting for transplanted crops). */
  weeksAfterEmergence?: Range;
}

/** A crop of the reference catalogue. Optional values are absent where nothing could be found. */
export interface Crop {
  /** Stable slug, e.g. `radish`; club crops get their own. */
  slug: string;
  commonName: string;
  botanicalName: Sourced<string>;
  family: Sourced<string>;
  kind: CropKind;
  /** Spacing in centimetres. */
  inRowCm: Sourced<Range>;
  betweenRowCm: Sourced<Range>;
  /** Equal spacing on a square grid for intensive beds. */
  equalSpacingCm: Sourced<Range>;
  sowingDepthCm: Sourced<Range>;
  sowing: Sourced<SowingMethod>;
  daysToEmergence: Sourced<Range>;
  emergenceByTemperature?: Sourced<EmergenceTable>;
  germination: Sourced<Germination>;
  daysToMaturity: Sourced<Range & { from: 'sowing' | 'transplanting' }>;
  soilPh: Sourced<Range>;
  rootingDepthCm: Sourced<Range>;
  /**
   * The least depth of loose soil the crop needs to grow well in a raised bed or a container, in cm;
   * not the FAO-56 rooting depth, which is the depth roots reach for irrigation. The neighbour check's
   * site fit compares a raised bed's or a container's measured soil depth against it. The raised bed
   * figure is never below the container one.
   */
  minSoilDepthCm?: Sourced<{ raisedBed: number; container: number }>;
  matureHeightCm: Sourced<Range>;
  sun: Sourced<SunNeed>;
  frost: Sourced<FrostTolerance>;
  feeding: Sourced<Feeding>;
  sideDressing: Sourced<SideDressing>;
  kc?: Sourced<CropCoefficients>;
  stages?: Sourced<StageLengths>;
  storage: Sourced<Storage>;
  /** Pest and disease slugs from `pests.ts` worth scouting for on this crop. */
  watchFor: string[];
  /** Growing guidance in our own words: sowing, thinning, watering, feeding, pests. */
  guidance: {
    sowing: string;
    thinning: string;
    watering: string;
    feeding: string;
    pests: string;
  };
}

/** A pest or disease the plot book can record. */
export interface PestOrDisease {
  slug: string;
  name: string;
  kind: 'pest' | 'disease';
  /** True for soil-borne diseases: an observation is kept against the soil for rotation. */
  soilBorne: boolean;
  /** Source of the soil-borne flag (added: the flag changes rotation, so it must say where it came from). */
  source?: string;
}

/** A soil-borne disease that extends the rotation gap for the families (or crops) it names. */
export interface DiseaseRotationRule {
  disease: string;
  /** Families kept out of the soil, e.g. ['Brassicaceae']. */
  families: string[];
  /** Extra crops kept out outside those families (e.g. strawberry for Verticillium). */
  crops?: string[];
  years: Sourced<number>;
  note?: string;
  /** What keeps the disease down without clearing the soil, with its own source (added for clubroot liming). */
  suppression?: Sourced<string>;
}

export type RelationEffect = 'beneficial' | 'antagonistic';
export type RelationEvidence = 'research' | 'common_practice';

/** A companion or antagonist relation between two crops. */
export interface CropRelation {
  a: string;
  b: string;
  effect: RelationEffect;
  /** `same_plot`, or across neighbouring plots up to `distanceM` metres. */
  scope: { kind: 'same_plot' } | { kind: 'neighbours'; distanceM: number };
  reason: string;
  evidence: RelationEvidence;
  /** A clash (rather than a watch) only where the source says the harm is real. */
  severity?: 'clash' | 'watch';
  source: string;
}
