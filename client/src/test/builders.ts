import type { BlockView, DistrictView, LoginResponse, SessionUser, UserView } from '@stormhour/shared';
import type { BlockFeatureCollection } from '../lib/geo/blockFeatures';

// Invented names from the demo province; no real places or people.

export function aSessionUser(overrides: Partial<SessionUser> = {}): SessionUser {
  return {
    id: 1,
    email: 'ila.admin@vessary.example',
    name: 'Ila Marren',
    role: 'admin',
    districtId: null,
    ...overrides,
  };
}

export function aLogin(user: SessionUser = aSessionUser()): LoginResponse {
  return { accessToken: `token-for-${user.id}`, expiresIn: 900, user };
}

export function aUser(overrides: Partial<UserView> = {}): UserView {
  return {
    id: 2,
    email: 'tovan.reed@vessary.example',
    name: 'Tovan Reed',
    role: 'writer',
    districtId: null,
    active: true,
    createdAt: '2026-05-01T08:00:00.000Z',
    lastSignInAt: null,
    ...overrides,
  };
}

export function aDistrict(overrides: Partial<DistrictView> = {}): DistrictView {
  return { id: 1, code: 'RVB', name: 'Riverbend', blockCount: 0, areaKm2: 0, ...overrides };
}

export function aBlock(overrides: Partial<BlockView> = {}): BlockView {
  return {
    id: 1,
    code: 'RVB-01',
    name: 'Sallow Ford',
    districtId: 1,
    districtCode: 'RVB',
    districtName: 'Riverbend',
    areaKm2: 100,
    bbox: [88, 14, 88.1, 14.1],
    centroid: [88.05, 14.05],
    ...overrides,
  };
}

/** Square outlines 0.1° wide, one per block, side by side along the parallel, wound as RFC 7946 asks. */
export function outlinesOf(blocks: BlockView[]): BlockFeatureCollection {
  return {
    type: 'FeatureCollection',
    features: blocks.map((b, i) => {
      const w = 88 + i * 0.1;
      return {
        type: 'Feature',
        properties: {
          id: b.id,
          code: b.code,
          name: b.name,
          districtId: b.districtId,
          districtCode: b.districtCode,
          districtName: b.districtName,
          areaKm2: b.areaKm2,
        },
        geometry: {
          type: 'Polygon',
          coordinates: [
            [
              [w, 14],
              [w + 0.1, 14],
              [w + 0.1, 14.1],
              [w, 14.1],
              [w, 14],
            ],
          ],
        },
      };
    }),
  };
}
