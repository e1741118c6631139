import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import type {
  CropCalendarImportResult,
  CropCalendarRequest,
  CropCalendarView,
  CropStageEntry,
  ErrorDetail,
  SessionUser,
} from '@stormhour/shared';
import { AuditService } from '../audit/audit.service.js';
import { RegionsRepository } from '../regions/regions.repository.js';
import { AdviceRepository } from './advice.repository.js';
import { checkCropCalendarCsv } from './crop-calendar-csv.js';

@Injectable()
export class CropCalendarService {
  constructor(
    private readonly repo: AdviceRepository,
    private readonly regions: RegionsRepository,
    private readonly audit: AuditService,
  ) {}

  private async district(id: number) {
    const district = await this.regions.findDistrict(id);
    if (!district) throw new NotFoundException(`There is no district with id ${id}.`);
    return district;
  }

  async get(districtId: number): Promise<CropCalendarView> {
    const district = await this.district(districtId);
    const calendar = await this.repo.calendarOf(districtId);
    return { districtId, districtCode: district.code, districtName: district.name, ...calendar };
  }

  /** Replaces the district's calendar with the entries given, in one transaction. */
  async replace(actor: SessionUser, districtId: number, req: CropCalendarRequest): Promise<CropCalendarView> {
    const district = await this.district(districtId);
    await this.repo.transaction(async (tx) => {
      await this.repo.replaceCalendar(districtId, req.entries, tx);
      await this.audit.record(
        actor,
        'crop-calendar.replace',
        `district:${district.code}`,
        { stages: req.entries.length },
        tx,
      );
    });
    return this.get(districtId);
  }

  /**
   * Imports a CSV of one or more districts' calendars, all or nothing: every row is checked first, and
   * each district named in the file has its calendar replaced by the file's rows; others are untouched.
   */
  async importCsv(
    actor: SessionUser | null,
    fileName: string,
    text: string,
  ): Promise<CropCalendarImportResult> {
    const check = checkCropCalendarCsv(text);
    if (!check.ok) throw refused(fileName, check.fileProblem, check.problems);
    return this.repo.transaction(async (tx) => {
      const codes = [...new Set(check.rows.map((r) => r.districtCode))];
      const ids = await this.repo.districtIdsByCode(codes, tx);
      const unknown: ErrorDetail[] = check.rows
        .filter((r) => !ids.has(r.districtCode))
        .map((r) => ({
          where: `row ${r.row}, column "district_code"`,
          problem: `there is no district ${r.districtCode}`,
        }));
      if (unknown.length) throw refused(fileName, undefined, unknown);
      const byDistrict = new Map<string, CropStageEntry[]>();
      for (const r of check.rows)
        byDistrict.set(r.districtCode, [...(byDistrict.get(r.districtCode) ?? []), r.entry]);
      const districts: CropCalendarImportResult['districts'] = [];
      for (const [code, entries] of byDistrict) {
        await this.repo.replaceCalendar(ids.get(code) as number, entries, tx);
        districts.push({ code, stages: entries.length });
      }
      await this.audit.record(actor, 'crop-calendar.import', `file:${fileName}`, { districts }, tx);
      return { districts };
    });
  }
}

function refused(fileName: string, fileProblem: string | undefined, problems: ErrorDetail[]) {
  const rows = new Set(problems.map((p) => p.where.split(',')[0]));
  return new BadRequestException({
    message: fileProblem
      ? `${fileName}: ${fileProblem} Nothing was imported.`
      : `${fileName}: ${rows.size} row(s) have problems; nothing was imported.`,
    details: problems,
  });
}
