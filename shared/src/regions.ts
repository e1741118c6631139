import { z } from 'zod';

/** Codes are short, stable identifiers used in files and bulletins (e.g. RVB, RVB-03). */
export const RegionCode = z
  .string()
  .trim()
  .regex(/^[A-Z0-9][A-Z0-9_-]{0,23}$/, 'Use 1–24 capital letters, digits, - or _');

export const DistrictView = z.object({
  id: z.number().int(),
  code: z.string(),
  name: z.string(),
  blockCount: z.number().int(),
  areaKm2: z.number(),
});
export type DistrictView = z.infer<typeof DistrictView>;

export const CreateDistrictRequest = z.object({
  code: RegionCode,
  name: z.string().trim().min(1, 'Enter the district’s name').max(120),
});
export type CreateDistrictRequest = z.infer<typeof CreateDistrictRequest>;

export const UpdateDistrictRequest = z
  .object({ name: z.string().trim().min(1, 'Enter the district’s name').max(120) })
  .strict();
export type UpdateDistrictRequest = z.infer<typeof UpdateDistrictRequest>;

export type BBox = [minLon: number, minLat: number, maxLon: number, maxLat: number];

export interface BlockView {
  id: number;
  code: string;
  name: string;
  districtId: number;
  districtCode: string;
  districtName: string;
  areaKm2: number;
  bbox: BBox;
  centroid: [lon: number, lat: number];
}

export interface BlockWithGeometry extends BlockView {
  geometry: GeoPolygonal;
}

export type Position = [number, number];
export type GeoPolygonal =
  | { type: 'Polygon'; coordinates: Position[][] }
  | { type: 'MultiPolygon'; coordinates: Position[][][] };

export const UpdateBlockRequest = z
  .object({
    name: z.string().trim().min(1, 'Enter the block’s name').max(120).optional(),
    districtId: z.number().int().positive().optional(),
  })
  .strict();
export type UpdateBlockRequest = z.infer<typeof UpdateBlockRequest>;

/**
 * Properties each feature of a blocks GeoJSON file must carry. A district that does not exist yet
 * is created from the first feature naming it.
 */
export const BLOCK_FEATURE_PROPERTIES = [
  'district_code',
  'district_name',
  'block_code',
  'block_name',
] as const;

export interface BlockImportResult {
  districtsCreated: number;
  blocksCreated: number;
  blocksUpdated: number;
}

/** One reason a feature of an import file was refused. */
export interface FeatureProblem {
  feature: number;
  blockCode?: string;
  reason: string;
}
