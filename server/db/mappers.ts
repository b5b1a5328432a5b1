import type { Plot } from '@shared/schemas/plots';
import type { Site } from '@shared/schemas/sites';
import { area } from '@shared/geometry';

// Rows stay snake_case in here; the API speaks camelCase.

/**
 * Lengths are stored to the millimetre, so a gap computed from three stored values can be off
 * by up to 1.5 mm, and a path width by 0.5 mm: geometry on stored plots allows 2 mm.
 */
export const STORED_LENGTH_EPS = 0.002;

export interface SiteRow {
  id: number;
  club_id: number;
  name: string;
  address: string;
  latitude: number;
  longitude: number;
  time_zone: string;
  units: 'metric' | 'us';
  path_width_m: number;
  grid_m: number;
  width_m: number;
  length_m: number;
  last_spring_frost: string | null;
  first_autumn_frost: string | null;
  soil_notes: string;
  soil_temps_c?: unknown;
  elevation_m?: number | null;
  background_file: string | null;
  background_mime: string | null;
  background_width_px: number | null;
  background_height_px: number | null;
  background_m_per_px: number | null;
  version: number;
  updated_at: Date;
  plot_count?: number;
}

export interface PlotRow {
  id: number;
  site_id: number;
  label: string;
  x_m: number;
  y_m: number;
  width_m: number;
  length_m: number;
  rotation: 0 | 90;
  kind: Plot['kind'];
  soil_depth_m: number | null;
  soil_ph: number | null;
  soil_tested_on: string | null;
  sun: Plot['sun'];
  is_accessible: boolean;
  has_water_tap: boolean;
  notes: string;
  version: number;
  updated_at: Date;
  deleted_at: Date | null;
}

/** A site row as the API shows it. */
export function toSite(r: SiteRow): Site {
  return {
    id: r.id,
    clubId: r.club_id,
    name: r.name,
    address: r.address,
    latitude: r.latitude,
    longitude: r.longitude,
    timeZone: r.time_zone,
    units: r.units,
    pathWidth: r.path_width_m,
    grid: r.grid_m,
    width: r.width_m,
    length: r.length_m,
    lastSpringFrost: r.last_spring_frost,
    firstAutumnFrost: r.first_autumn_frost,
    soilNotes: r.soil_notes,
    soilTempsC: Array.isArray(r.soil_temps_c) && r.soil_temps_c.length === 12 ? (r.soil_temps_c as number[]) : null,
    elevationM: r.elevation_m ?? null,
    background:
      r.background_file && r.background_width_px && r.background_height_px
        ? {
            url: `/api/sites/${r.id}/background?v=${r.version}`,
            widthPx: r.background_width_px,
            heightPx: r.background_height_px,
            metresPerPixel: r.background_m_per_px,
          }
        : null,
    plotCount: Number(r.plot_count ?? 0),
    version: r.version,
    updatedAt: r.updated_at.toISOString(),
  };
}

/** The geometry of a plot row in map metres. */
export function plotRect(r: PlotRow) {
  return { id: r.id, x: r.x_m, y: r.y_m, width: r.width_m, length: r.length_m, rotation: r.rotation };
}

/** A plot row as the API shows it. */
export function toPlot(r: PlotRow): Plot {
  return {
    id: r.id,
    siteId: r.site_id,
    label: r.label,
    x: r.x_m,
    y: r.y_m,
    width: r.width_m,
    length: r.length_m,
    rotation: r.rotation,
    kind: r.kind,
    area: area(plotRect(r)),
    soilDepth: r.soil_depth_m,
    soilPh: r.soil_ph,
    soilTestedOn: r.soil_tested_on,
    sun: r.sun,
    isAccessible: r.is_accessible,
    hasWaterTap: r.has_water_tap,
    notes: r.notes,
    version: r.version,
    updatedAt: r.updated_at.toISOString(),
  };
}

/** The columns a plot body sets, for insert or update. */
export function plotColumns(b: Partial<Omit<Plot, 'id' | 'siteId' | 'area' | 'version' | 'updatedAt'>>) {
  const map: Record<string, string> = {
    label: 'label',
    x: 'x_m',
    y: 'y_m',
    width: 'width_m',
    length: 'length_m',
    rotation: 'rotation',
    kind: 'kind',
    soilDepth: 'soil_depth_m',
    soilPh: 'soil_ph',
    soilTestedOn: 'soil_tested_on',
    sun: 'sun',
    isAccessible: 'is_accessible',
    hasWaterTap: 'has_water_tap',
    notes: 'notes',
  };
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(b)) if (k in map && v !== undefined) out[map[k]] = v;
  return out;
}

/** The columns a site body sets, for insert or update. */
export function siteColumns(b: Record<string, unknown>) {
  const map: Record<string, string> = {
    name: 'name',
    address: 'address',
    latitude: 'latitude',
    longitude: 'longitude',
    timeZone: 'time_zone',
    units: 'units',
    pathWidth: 'path_width_m',
    grid: 'grid_m',
    width: 'width_m',
    length: 'length_m',
    lastSpringFrost: 'last_spring_frost',
    firstAutumnFrost: 'first_autumn_frost',
    soilNotes: 'soil_notes',
    elevationM: 'elevation_m',
    backgroundMetresPerPixel: 'background_m_per_px',
  };
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(b)) if (k in map && v !== undefined) out[map[k]] = v;
  // jsonb: knex would send a bare array as a Postgres array.
  if (b.soilTempsC !== undefined) out.soil_temps_c = b.soilTempsC === null ? null : JSON.stringify(b.soilTempsC);
  return out;
}
