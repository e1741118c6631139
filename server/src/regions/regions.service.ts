import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import type {
  BlockImportResult,
  BlockView,
  CreateDistrictRequest,
  DistrictView,
  SessionUser,
  UpdateBlockRequest,
  UpdateDistrictRequest,
} from '@stormhour/shared';
import { AuditService } from '../audit/audit.service.js';
import { boundingBox, centroid, geodesicAreaKm2 } from './block-geometry.js';
import { checkBlocksFile, type ParsedBlock } from './block-import.js';
import { type BlockFilter, RegionsRepository } from './regions.repository.js';

@Injectable()
export class RegionsService {
  constructor(
    private readonly repo: RegionsRepository,
    private readonly audit: AuditService,
  ) {}

  listDistricts(): Promise<DistrictView[]> {
    return this.repo.listDistricts();
  }

  async createDistrict(actor: SessionUser, req: CreateDistrictRequest): Promise<DistrictView> {
    if (await this.repo.findDistrictByCode(req.code)) {
      throw new ConflictException({
        message: `A district with the code ${req.code} already exists.`,
        details: [{ where: 'code', problem: 'already in use' }],
      });
    }
    const row = await this.repo.transaction(async (tx) => {
      const created = await this.repo.insertDistrict(req.code, req.name, tx);
      await this.audit.record(actor, 'district.create', `district:${created.code}`, { name: req.name }, tx);
      return created;
    });
    return { id: row.id, code: row.code, name: row.name, blockCount: 0, areaKm2: 0 };
  }

  async updateDistrict(actor: SessionUser, id: number, req: UpdateDistrictRequest): Promise<DistrictView> {
    const current = await this.repo.findDistrict(id);
    if (!current) throw new NotFoundException(`There is no district with id ${id}.`);
    await this.repo.transaction(async (tx) => {
      await this.repo.renameDistrict(id, req.name, tx);
      await this.audit.record(actor, 'district.update', `district:${current.code}`, { name: req.name }, tx);
    });
    const all = await this.repo.listDistricts();
    return all.find((d) => d.id === id) as DistrictView;
  }

  listBlocks(filter: BlockFilter): Promise<BlockView[]> {
    return this.repo.listBlocks(filter);
  }

  async blocksGeoJson(filter: BlockFilter) {
    const rows = await this.repo.listBlocksWithGeometry(filter);
    return {
      type: 'FeatureCollection' as const,
      features: rows.map(({ geometry, ...props }) => ({
        type: 'Feature' as const,
        id: props.id,
        properties: props,
        geometry,
      })),
    };
  }

  async updateBlock(actor: SessionUser, id: number, req: UpdateBlockRequest): Promise<BlockView> {
    const current = await this.repo.findBlock(id);
    if (!current) throw new NotFoundException(`There is no block with id ${id}.`);
    if (req.districtId && !(await this.repo.findDistrict(req.districtId))) {
      throw new BadRequestException({
        message: `There is no district with id ${req.districtId}.`,
        details: [{ where: 'districtId', problem: 'no such district' }],
      });
    }
    await this.repo.transaction(async (tx) => {
      await this.repo.updateBlock(id, req, tx);
      await this.audit.record(actor, 'block.update', `block:${current.code}`, { ...req }, tx);
    });
    return (await this.repo.findBlock(id)) as BlockView;
  }

  /**
   * Imports every block of a GeoJSON file or none: all features are checked first, and the writes
   * happen in one transaction. Blocks whose code exists already are updated in place.
   */
  async importBlocks(actor: SessionUser | null, fileName: string, text: string): Promise<BlockImportResult> {
    const check = checkBlocksFile(text);
    if (!check.ok) {
      const problems = check.problems;
      throw new BadRequestException({
        message: check.fileProblem
          ? `${fileName}: ${check.fileProblem}`
          : `${fileName}: ${new Set(problems.map((p) => p.feature)).size} feature(s) have problems; nothing was imported.`,
        details: problems.map((p) => ({
          where: `features[${p.feature}]${p.blockCode ? ` (${p.blockCode})` : ''}`,
          problem: p.reason,
        })),
      });
    }
    return this.repo.transaction(async (tx) => {
      const result: BlockImportResult = { districtsCreated: 0, blocksCreated: 0, blocksUpdated: 0 };
      const districtIds = new Map<string, number>();
      for (const block of check.blocks) {
        if (!districtIds.has(block.districtCode)) {
          const existing = await this.repo.findDistrictByCode(block.districtCode, tx);
          const district =
            existing ?? (await this.repo.insertDistrict(block.districtCode, block.districtName, tx));
          if (!existing) result.districtsCreated++;
          districtIds.set(block.districtCode, district.id);
        }
        const row = { ...measured(block), districtId: districtIds.get(block.districtCode) as number };
        const existingId = await this.repo.findBlockIdByCode(block.code, tx);
        if (existingId) {
          await this.repo.updateBlock(existingId, row, tx);
          result.blocksUpdated++;
        } else {
          await this.repo.insertBlock(row, tx);
          result.blocksCreated++;
        }
      }
      await this.audit.record(actor, 'blocks.import', `file:${fileName}`, { ...result }, tx);
      return result;
    });
  }
}

function measured(block: ParsedBlock) {
  const [minLon, minLat, maxLon, maxLat] = boundingBox(block.geometry);
  const [centroidLon, centroidLat] = centroid(block.geometry);
  return {
    code: block.code,
    name: block.name,
    geometry: block.geometry,
    minLon,
    minLat,
    maxLon,
    maxLat,
    centroidLon,
    centroidLat,
    areaKm2: geodesicAreaKm2(block.geometry),
  };
}
