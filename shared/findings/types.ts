import type { Crop, DiseaseRotationRule, Evidence, RelationEvidence } from '../crops/types';
import type { PlacedRect } from '../geometry';

// Inputs and outputs of the neighbour check. Pure data: the server loads it in a fixed number of
// queries for a site, the engine (this folder) turns it into findings without any I/O.

export type FindingSeverity = 'clash' | 'watch' | 'good';
export type FindingKind = 'rotation' | 'companion' | 'shade' | 'site_fit';

/** Which rule made a finding; with the planting ids it makes the finding's stable key. */
export type FindingRule =
  | 'rotation_family'
  | 'rotation_disease'
  | 'companion_harm'
  | 'companion_help'
  | 'shade'
  | 'soil_ph'
  | 'soil_depth'
  | 'frost'
  | 'soil_temperature';

/** Evidence of the rule behind a finding: the crop notes' levels plus the relations' "research". */
export type FindingEvidence = Evidence | RelationEvidence;

export interface FindingSource {
  /** Key in shared/crops/sources.ts, or `tillwell` for a rule of our own with no outside source. */
  id: string;
  title: string;
  evidence: FindingEvidence;
  url?: string;
}

/** Another planting a finding names (the earlier crop in a rotation, the neighbour in a pairing). */
export interface FindingPeer {
  plantingId: number;
  plotId: number;
  plotLabel: string;
  cropName: string;
  seasonYear: number;
}

export interface Finding {
  /** Stable within a planting: rule plus the other plantings or observation, e.g. `rotation_family:412`. */
  key: string;
  severity: FindingSeverity;
  kind: FindingKind;
  rule: FindingRule;
  /** A short line, e.g. "Same family within 3 years". */
  title: string;
  /** The plain explanation with its numbers. */
  message: string;
  /** The planting the finding is about; 0 for a draft that is not saved yet. */
  plantingId: number;
  plotId: number;
  plotLabel: string;
  cropName: string;
  seasonYear: number;
  peers: FindingPeer[];
  source: FindingSource;
  /** The numbers in the message, for tables and tests (e.g. { shadowM: 1.07, distanceM: 0.9 }). */
  numbers: Record<string, number>;
}

/** The plot part a planting covers, in metres from the plot's own corner (see `plantingFootprint`). */
export interface PartRect {
  x: number;
  y: number;
  width: number;
  length: number;
}

export type CheckPlotKind = 'in_ground' | 'raised_bed' | 'container' | 'shared_bed';

export interface CheckPlot extends PlacedRect<number> {
  label: string;
  kind: CheckPlotKind;
  /** Metres; null when not measured. */
  soilDepthM: number | null;
  soilPh: number | null;
}

export interface CheckSite {
  id: number;
  latitude: number;
  pathWidthM: number;
  /** Typical dates as MM-DD, or null. */
  lastSpringFrost: string | null;
  firstAutumnFrost: string | null;
  /** Twelve monthly soil temperatures (°C, January first), or null. */
  soilTempsC: number[] | null;
}

export interface CheckPlanting {
  /** 0 for a draft. */
  id: number;
  plotId: number;
  seasonYear: number;
  cropId: number;
  part: PartRect | null;
  method: 'sown' | 'transplanted';
  /** YYYY-MM-DD in the site's zone. */
  plantedOn: string;
  status: 'planned' | 'sown' | 'up' | 'harvesting' | 'finished' | 'failed';
}

export interface CheckObservation {
  id: number;
  plotId: number;
  plantingId: number | null;
  pestSlug: string | null;
  name: string;
  isSoilBorne: boolean;
  part: PartRect | null;
  /** YYYY-MM-DD. */
  observedOn: string;
}

/** A crop as the club sees it (reference data with the club's own values applied). */
export interface CheckCrop {
  id: number;
  data: Crop;
}

/** A relation between two crops by crop id (reference relations and the club's own). */
export interface CheckRelation {
  cropA: number;
  cropB: number;
  effect: 'beneficial' | 'antagonistic';
  /** Null: within the same plot only; otherwise across neighbouring plots up to this many metres. */
  distanceM: number | null;
  severity: 'clash' | 'watch' | null;
  reason: string;
  evidence: RelationEvidence;
  source: string;
}

/** Everything the engine needs for one site. */
export interface CheckContext {
  site: CheckSite;
  plots: CheckPlot[];
  /** Plantings of every season on the site's plots. */
  plantings: CheckPlanting[];
  /** Observations on the site's plots (the engine uses the soil-borne ones). */
  observations: CheckObservation[];
  crops: Map<number, CheckCrop>;
  relations: CheckRelation[];
  rotationGapYears: number;
  diseaseRules: DiseaseRotationRule[];
  /** Tolerance in metres for the neighbour geometry (stored lengths are rounded to the millimetre). */
  eps?: number;
}
