import { Inject, Injectable } from '@nestjs/common';
import type { BlockView, BlockWithGeometry, DistrictView } from '@stormhour/shared';
import { and, asc, eq, getTableColumns, ilike, or, type SQL, sql } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { blocks, districts } from '../database/schema.js';

export type DistrictRow = typeof districts.$inferSelect;
export type NewBlockRow = typeof blocks.$inferInsert;

const blockColumns = {
  id: blocks.id,
  code: blocks.code,
  name: blocks.name,
  districtId: blocks.districtId,
  districtCode: districts.code,
  districtName: districts.name,
  areaKm2: blocks.areaKm2,
  minLon: blocks.minLon,
  minLat: blocks.minLat,
  maxLon: blocks.maxLon,
  maxLat: blocks.maxLat,
  centroidLon: blocks.centroidLon,
  centroidLat: blocks.centroidLat,
};

type BlockSelect = { [K in keyof typeof blockColumns]: (typeof blockColumns)[K]['_']['data'] };

function toBlockView(r: BlockSelect): BlockView {
  return {
    id: r.id,
    code: r.code,
    name: r.name,
    districtId: r.districtId,
    districtCode: r.districtCode,
    districtName: r.districtName,
    areaKm2: r.areaKm2,
    bbox: [r.minLon, r.minLat, r.maxLon, r.maxLat],
    centroid: [r.centroidLon, r.centroidLat],
  };
}

export interface BlockFilter {
  districtId?: number;
  q?: string;
}

@Injectable()
export class RegionsRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  listDistricts(): Promise<DistrictView[]> {
    return this.handle.db
      .select({
        ...getTableColumns(districts),
        blockCount: sql<number>`count(${blocks.id})::int`,
        areaKm2: sql<number>`coalesce(sum(${blocks.areaKm2}), 0)::float8`,
      })
      .from(districts)
      .leftJoin(blocks, eq(blocks.districtId, districts.id))
      .groupBy(districts.id)
      .orderBy(asc(districts.name))
      .then((rows) => rows.map(({ createdAt: _c, ...d }) => d));
  }

  async findDistrict(id: number): Promise<DistrictRow | undefined> {
    const [row] = await this.handle.db.select().from(districts).where(eq(districts.id, id));
    return row;
  }

  async findDistrictByCode(
    code: string,
    executor: Executor = this.handle.db,
  ): Promise<DistrictRow | undefined> {
    const [row] = await executor.select().from(districts).where(eq(districts.code, code));
    return row;
  }

  async insertDistrict(
    code: string,
    name: string,
    executor: Executor = this.handle.db,
  ): Promise<DistrictRow> {
    const [row] = await executor.insert(districts).values({ code, name }).returning();
    return row;
  }

  async renameDistrict(id: number, name: string, executor: Executor = this.handle.db): Promise<DistrictRow> {
    const [row] = await executor.update(districts).set({ name }).where(eq(districts.id, id)).returning();
    return row;
  }

  private blockConditions(filter: BlockFilter): SQL | undefined {
    const conditions: SQL[] = [];
    if (filter.districtId) conditions.push(eq(blocks.districtId, filter.districtId));
    if (filter.q) {
      const match = or(ilike(blocks.code, `%${filter.q}%`), ilike(blocks.name, `%${filter.q}%`));
      if (match) conditions.push(match);
    }
    return and(...conditions);
  }

  async listBlocks(filter: BlockFilter): Promise<BlockView[]> {
    const rows = await this.handle.db
      .select(blockColumns)
      .from(blocks)
      .innerJoin(districts, eq(districts.id, blocks.districtId))
      .where(this.blockConditions(filter))
      .orderBy(asc(blocks.code));
    return rows.map(toBlockView);
  }

  async listBlocksWithGeometry(filter: BlockFilter): Promise<BlockWithGeometry[]> {
    const rows = await this.handle.db
      .select({ ...blockColumns, geometry: blocks.geometry })
      .from(blocks)
      .innerJoin(districts, eq(districts.id, blocks.districtId))
      .where(this.blockConditions(filter))
      .orderBy(asc(blocks.code));
    return rows.map((r) => ({ ...toBlockView(r), geometry: r.geometry }));
  }

  async findBlock(id: number): Promise<BlockView | undefined> {
    const [row] = await this.handle.db
      .select(blockColumns)
      .from(blocks)
      .innerJoin(districts, eq(districts.id, blocks.districtId))
      .where(eq(blocks.id, id));
    return row && toBlockView(row);
  }

  async findBlockIdByCode(code: string, executor: Executor): Promise<number | undefined> {
    const [row] = await executor.select({ id: blocks.id }).from(blocks).where(eq(blocks.code, code));
    return row?.id;
  }

  async insertBlock(row: NewBlockRow, executor: Executor): Promise<void> {
    await executor.insert(blocks).values(row);
  }

  async updateBlock(
    id: number,
    changes: Partial<NewBlockRow>,
    executor: Executor = this.handle.db,
  ): Promise<void> {
    await executor
      .update(blocks)
      .set({ ...changes, updatedAt: new Date() })
      .where(eq(blocks.id, id));
  }

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.handle.db.transaction(work);
  }
}
