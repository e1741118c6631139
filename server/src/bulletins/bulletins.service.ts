import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  HttpException,
  Inject,
  Injectable,
  Logger,
  NotFoundException,
  UnprocessableEntityException,
} from '@nestjs/common';
import {
  ALL_DAYS,
  addDays,
  type BulletinContent,
  type BulletinDeliveryView,
  type BulletinDiffView,
  type BulletinListQuery,
  type BulletinOutlookInputs,
  type BulletinState,
  type BulletinSummaryView,
  type BulletinTextDiff,
  type BulletinTransition,
  type BulletinVersionView,
  type BulletinView,
  type CreateBulletinRequest,
  EDITABLE_STATES,
  evaluateRules,
  type GeoPolygonal,
  type OutboxRecipientStatus,
  OutlookQuery,
  type SaveBulletinRequest,
  type SessionUser,
  stagesInWeek,
} from '@stormhour/shared';
import addressparser from 'nodemailer/lib/addressparser';
import { AdviceRepository } from '../advice/advice.repository.js';
import { AuditService } from '../audit/audit.service.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import type { Executor } from '../database/database.js';
import { MailService, type OutgoingMail } from '../mail/mail.service.js';
import { OutlookService } from '../outlook/outlook.service.js';
import { SitesService } from '../radar/sites.service.js';
import { RegimesService } from '../regimes/regimes.service.js';
import { RegionsRepository } from '../regions/regions.repository.js';
import { BulletinRenderer } from './bulletin-renderer.js';
import { BulletinsRepository, type BulletinWithNames } from './bulletins.repository.js';
import { capIdentifier } from './engine/bulletin-cap.js';
import { bulletinTitle } from './engine/bulletin-text.js';
import { contradictionWarnings } from './engine/contradictions.js';
import {
  adviceContext,
  bulletinNumber,
  bulletinRow,
  draftContent,
  weekStartProblem,
} from './engine/draft.js';
import { localToday } from './engine/local-week.js';
import { richTextHtml, richTextPlain } from './engine/rich-text.js';
import { textDiff } from './engine/text-diff.js';

export type Actor = SessionUser;

const iso = (d: Date | null) => d?.toISOString() ?? null;
const REVIEWERS = ['scientist', 'admin'];

/** The outbox key of a bulletin version, and of its withdrawal notice. */
export const sendKey = (id: number, version: number) => `bulletin:${id}:v${version}`;
export const withdrawalKey = (id: number) => `bulletin:${id}:withdrawn`;

/**
 * Bulletins (DESIGN §3.7): drafts pre-filled from the week's outlook and the advice rules, versions,
 * review, sending through the outbox, withdrawal with a correction notice. The state only ever moves in a
 * transaction that also writes the event and the audit row; a failure leaves it where it was.
 */
@Injectable()
export class BulletinsService {
  private readonly logger = new Logger('Bulletins');

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly repo: BulletinsRepository,
    private readonly regions: RegionsRepository,
    private readonly advice: AdviceRepository,
    private readonly outlook: OutlookService,
    private readonly sites: SitesService,
    private readonly regimes: RegimesService,
    private readonly mail: MailService,
    private readonly renderer: BulletinRenderer,
    private readonly audit: AuditService,
  ) {}

  // ── Drafting ──────────────────────────────────────────────────────────────────────────────────

  async create(actor: Actor, req: CreateBulletinRequest): Promise<BulletinView> {
    const weekProblem = weekStartProblem(req.weekStart);
    if (weekProblem)
      throw new BadRequestException({
        message: `The week cannot start then: ${weekProblem}.`,
        details: [{ where: 'weekStart', problem: weekProblem }],
      });
    const district = await this.regions.findDistrict(req.districtId);
    if (!district)
      throw new NotFoundException({
        message: `There is no district with id ${req.districtId}.`,
        details: [{ where: 'districtId', problem: 'no such district' }],
      });
    await this.refuseSecondLive(req.districtId, req.weekStart, district.name);

    const week = await this.weekOutlook(req);
    const rows = week.blocks
      .filter((b) => b.districtId === district.id)
      .map((b) => bulletinRow(b, week.binHours));
    const calendar = await this.advice.calendarOf(district.id);
    const crops = stagesInWeek(calendar.entries, req.weekStart);
    const regimeLabel = week.inputs.regime === ALL_DAYS ? null : week.inputs.regime;
    const rules = (await this.advice.listRules()).filter((r) => r.active);
    const proposal = evaluateRules(
      rules,
      adviceContext({
        district: { id: district.id, name: district.name },
        weekStart: req.weekStart,
        regime: regimeLabel,
        binHours: week.binHours,
        rows,
        crops,
      }),
    );
    const byId = new Map(rules.map((r) => [r.id, r]));
    const usedRules = [
      ...new Set([...proposal.general, ...proposal.crops.flatMap((c) => c.advice)].map((p) => p.ruleId)),
    ];
    const draftedFrom: BulletinOutlookInputs = {
      ...week.inputs,
      proposedBy: usedRules.map((id) => {
        const r = byId.get(id);
        return { ruleId: id, crop: r?.crop ?? null, stage: r?.stage ?? null, source: r?.source ?? '' };
      }),
    };

    const id = await this.repo.transaction(async (tx) => {
      // Checked again inside the transaction; the partial unique index is the last word.
      if (await this.repo.liveFor(district.id, req.weekStart, tx))
        throw this.secondLive(district.name, req.weekStart);
      const reissue = await this.repo.withdrawnCount(district.id, req.weekStart, tx);
      const number = bulletinNumber(district.code, req.weekStart, reissue);
      const content = draftContent({
        unitName: this.config.unitName,
        district,
        weekStart: req.weekStart,
        issueDate: localToday(new Date(), week.utcOffsetMinutes),
        number,
        regime: regimeLabel,
        binHours: week.binHours,
        afternoon: { fromHour: week.inputs.afternoonFrom, toHour: week.inputs.afternoonTo },
        rows,
        proposal,
      });
      const created = await this.repo.insert(
        {
          districtId: district.id,
          weekStart: req.weekStart,
          number,
          state: 'draft',
          authorId: actor.id,
          currentVersion: 1,
          utcOffsetMinutes: week.utcOffsetMinutes,
          draftedFrom,
        },
        tx,
      );
      await this.repo.insertVersion(created.id, 1, content, actor.id, tx);
      await this.repo.addEvent(
        {
          bulletinId: created.id,
          transition: 'create',
          fromState: null,
          toState: 'draft',
          actorId: actor.id,
          comment: null,
        },
        tx,
      );
      await this.audit.record(
        actor,
        'bulletin.create',
        `bulletin:${created.id}`,
        {
          number,
          district: district.code,
          weekStart: req.weekStart,
          regime: week.inputs.regime,
          siteId: week.inputs.siteId,
        },
        tx,
      );
      return created.id;
    });
    return this.view(actor, id);
  }

  private async refuseSecondLive(districtId: number, weekStart: string, districtName: string) {
    if (await this.repo.liveFor(districtId, weekStart)) throw this.secondLive(districtName, weekStart);
  }

  private secondLive(districtName: string, weekStart: string) {
    return new ConflictException({
      message: `${districtName} already has a bulletin for the week of ${weekStart}: open it, or withdraw it once sent before drafting another.`,
      details: [{ where: 'weekStart', problem: 'a live bulletin exists for this district and week' }],
    });
  }

  /**
   * The outlook the draft is made from: the site asked for (or the one giving the district's blocks the
   * most data), the regime asked for, else the week's expected regime from forecast grids, else all days.
   */
  private async weekOutlook(req: CreateBulletinRequest) {
    const siteId = req.siteId ?? (await this.siteFor(req.districtId));
    const site = await this.sites.get(siteId);
    let regime = req.regime ?? null;
    let chosenBy: BulletinOutlookInputs['regimeChosenBy'] = 'request';
    if (regime === null) {
      regime = await this.expectedRegime(siteId, req.weekStart);
      chosenBy = regime ? 'forecast' : 'no-forecast';
    }
    const query = (r: string) => OutlookQuery.parse({ siteId, regime: r });
    let answer: Awaited<ReturnType<OutlookService['outlook']>>;
    try {
      answer = await this.outlook.outlook(query(regime ?? ALL_DAYS));
    } catch (e) {
      // The forecast's regime may not occur in the record at all: fall back to every day, and say so.
      if (chosenBy !== 'forecast' || !(e instanceof BadRequestException)) throw e;
      regime = null;
      chosenBy = 'no-forecast';
      answer = await this.outlook.outlook(query(ALL_DAYS));
    }
    const body = answer.body;
    return {
      blocks: body.blocks,
      binHours: body.binHours,
      utcOffsetMinutes: site.utcOffsetMinutes,
      inputs: {
        siteId,
        siteCode: site.code,
        regime: body.regime,
        regimeChosenBy: chosenBy,
        binHours: body.binHours,
        afternoonFrom: body.afternoon.fromHour,
        afternoonTo: body.afternoon.toHour,
        fingerprint: (await this.outlook.dataFingerprint(siteId)) ?? '',
      },
    };
  }

  private async expectedRegime(siteId: number, weekStart: string): Promise<string | null> {
    try {
      return (await this.regimes.expected(siteId, weekStart, addDays(weekStart, 6))).regime;
    } catch (e) {
      // No regime settings or forecast grids yet: the draft uses every day.
      if (e instanceof HttpException) return null;
      throw e;
    }
  }

  /** The site whose outlook has data for most of the district's blocks. */
  private async siteFor(districtId: number): Promise<number> {
    const sites = await this.sites.list();
    if (sites.length === 0)
      throw new ConflictException({
        message:
          'There is no radar site yet, so there is no outlook to draft from: add a site in Intake first.',
        details: [{ where: 'siteId', problem: 'no radar site' }],
      });
    if (sites.length === 1) return sites[0].id;
    let best = { id: sites[0].id, blocks: -1 };
    for (const s of sites) {
      const body = (await this.outlook.outlook(OutlookQuery.parse({ siteId: s.id }))).body;
      const blocks = body.blocks.filter((b) => b.districtId === districtId && b.hasData).length;
      if (blocks > best.blocks) best = { id: s.id, blocks };
    }
    return best.id;
  }

  // ── Reading ───────────────────────────────────────────────────────────────────────────────────

  async list(q: BulletinListQuery): Promise<BulletinSummaryView[]> {
    return (await this.repo.list(q)).map(summary);
  }

  private async found(id: number, executor?: Executor): Promise<BulletinWithNames> {
    const b = await this.repo.find(id, executor);
    if (!b) throw new NotFoundException(`There is no bulletin with id ${id}.`);
    return b;
  }

  /** The version people see: the approved one once there is one, else the latest. */
  private shownVersion(b: BulletinWithNames): number {
    return b.approvedVersion ?? b.currentVersion;
  }

  async content(
    id: number,
  ): Promise<{ bulletin: BulletinWithNames; version: number; content: BulletinContent }> {
    const bulletin = await this.found(id);
    const version = this.shownVersion(bulletin);
    const row = await this.repo.version(id, version);
    return { bulletin, version, content: row.content };
  }

  async view(actor: Actor, id: number): Promise<BulletinView> {
    const { bulletin: b, content } = await this.content(id);
    const [versions, events, officers] = await Promise.all([
      this.repo.versions(id),
      this.repo.events(id),
      this.repo.officersOf(b.districtId),
    ]);
    const frozen = b.approvedVersion !== null;
    const fingerprint = frozen ? null : await this.outlook.dataFingerprint(b.draftedFrom.siteId);
    const editable = EDITABLE_STATES.includes(b.state);
    const mayEdit = editable && (actor.id === b.authorId || actor.role === 'writer');
    const reviewer = REVIEWERS.includes(actor.role) && actor.id !== b.authorId;
    return {
      ...summary(b),
      content,
      versions: versions.map((v) => ({
        version: v.version,
        savedBy: v.savedBy,
        savedAt: v.savedAt.toISOString(),
      })),
      events: events.map((e) => ({
        transition: e.transition as BulletinTransition,
        from: e.from as BulletinState | null,
        to: e.to as BulletinState,
        actor: e.actor,
        at: e.at.toISOString(),
        comment: e.comment,
      })),
      warnings: contradictionWarnings(content),
      recipientsCount: officers.length,
      draftedFrom: b.draftedFrom,
      approvedFrom: b.approvedFrom,
      outlookChangedSinceDraft: fingerprint !== null && fingerprint !== b.draftedFrom.fingerprint,
      can: {
        edit: mayEdit,
        submit: mayEdit,
        approve: b.state === 'in_review' && reviewer,
        return: b.state === 'in_review' && reviewer,
        send: b.state === 'approved',
        withdraw: b.state === 'sent' && REVIEWERS.includes(actor.role),
      },
    };
  }

  async version(id: number, n: number): Promise<BulletinVersionView> {
    await this.found(id);
    const row = await this.repo.version(id, n);
    if (!row) throw new NotFoundException(`Bulletin ${id} has no version ${n}.`);
    return {
      bulletinId: id,
      version: n,
      savedBy: row.savedBy,
      savedAt: row.savedAt.toISOString(),
      content: row.content,
    };
  }

  /** The plain text against the district's previous sent bulletin and against the previous version. */
  async diff(id: number): Promise<BulletinDiffView> {
    const { bulletin: b, version, content } = await this.content(id);
    const text = this.renderer.text(content);
    const previous = await this.repo.previousSent(b.districtId, b.weekStart, id);
    let previousSent: BulletinTextDiff = { against: null, lines: [], added: 0, removed: 0 };
    if (previous?.approvedVersion) {
      const other = await this.repo.version(previous.id, previous.approvedVersion);
      previousSent = {
        against: { bulletinId: previous.id, number: previous.number, version: previous.approvedVersion },
        ...textDiff(this.renderer.text(other.content), text),
      };
    }
    let previousVersion: BulletinTextDiff = { against: null, lines: [], added: 0, removed: 0 };
    if (version > 1) {
      const other = await this.repo.version(id, version - 1);
      previousVersion = {
        against: { bulletinId: id, number: b.number, version: version - 1 },
        ...textDiff(this.renderer.text(other.content), text),
      };
    }
    return { version, previousSent, previousVersion };
  }

  /** Any two saved versions of one bulletin, compared on the plain text officers receive. */
  async compare(id: number, from: number, to: number): Promise<BulletinTextDiff> {
    const b = await this.found(id);
    const [older, newer] = await Promise.all([this.repo.version(id, from), this.repo.version(id, to)]);
    const missing = [older ? null : from, newer ? null : to].filter((n) => n !== null);
    if (missing.length > 0)
      throw new NotFoundException({
        message: `Bulletin ${b.number} has no version ${missing.join(' or ')}: it has versions 1 to ${b.currentVersion}.`,
        details: missing.map((n) => ({ where: n === from ? 'from' : 'to', problem: `no version ${n}` })),
      });
    return {
      against: { bulletinId: id, number: b.number, version: from },
      ...textDiff(this.renderer.text(older.content), this.renderer.text(newer.content)),
    };
  }

  // ── Editing ───────────────────────────────────────────────────────────────────────────────────

  async save(actor: Actor, id: number, req: SaveBulletinRequest): Promise<BulletinView> {
    await this.repo.transaction(async (tx) => {
      const b = await this.found(id, tx);
      if (!EDITABLE_STATES.includes(b.state))
        throw new ConflictException({
          message: `Bulletin ${b.number} is ${label(b.state)}: only a draft or a returned bulletin can be edited.`,
          details: [{ where: 'state', problem: `is ${b.state}` }],
        });
      if (actor.id !== b.authorId && actor.role !== 'writer')
        throw new ForbiddenException({
          message: `Only the author (${b.authorEmail}) or an advisory writer may edit bulletin ${b.number}.`,
          details: [{ where: 'bulletin', problem: 'not the author' }],
        });
      if (req.baseVersion !== b.currentVersion)
        throw new ConflictException({
          message: `Bulletin ${b.number} was saved again meanwhile (version ${b.currentVersion}); your edit started from version ${req.baseVersion}. Reload it and make your changes again.`,
          details: [
            {
              where: 'baseVersion',
              problem: `is ${req.baseVersion}, the bulletin is at ${b.currentVersion}`,
            },
          ],
        });
      const current = (await this.repo.version(id, b.currentVersion, tx)).content;
      // The header, the outlook's numbers and the cautions stay as drafted.
      const content: BulletinContent = {
        ...current,
        issueDate: req.issueDate,
        summary: req.summary,
        crops: req.crops,
        generalAdvice: req.generalAdvice,
      };
      const next = b.currentVersion + 1;
      if (!(await this.repo.update(id, b.state, { currentVersion: next }, tx)))
        throw changedMeanwhile(b.number);
      await this.repo.insertVersion(id, next, content, actor.id, tx);
      await this.audit.record(actor, 'bulletin.save', `bulletin:${id}`, { version: next }, tx);
    });
    return this.view(actor, id);
  }

  // ── Review ────────────────────────────────────────────────────────────────────────────────────

  async submit(actor: Actor, id: number, comment?: string): Promise<BulletinView> {
    return this.move(actor, id, 'submit', EDITABLE_STATES, 'in_review', comment ?? null, async (b) => {
      if (actor.id !== b.authorId && actor.role !== 'writer')
        throw new ForbiddenException({
          message: `Only the author (${b.authorEmail}) or an advisory writer may submit bulletin ${b.number}.`,
          details: [{ where: 'bulletin', problem: 'not the author' }],
        });
      return {};
    });
  }

  async approve(actor: Actor, id: number, comment?: string): Promise<BulletinView> {
    return this.move(actor, id, 'approve', ['in_review'], 'approved', comment ?? null, async (b) => {
      this.refuseOwn(actor, b, 'approve');
      const fingerprint = (await this.outlook.dataFingerprint(b.draftedFrom.siteId)) ?? '';
      return {
        approvedVersion: b.currentVersion,
        approvedAt: new Date(),
        approvedFrom: { ...b.draftedFrom, fingerprint },
      };
    });
  }

  async return(actor: Actor, id: number, comment: string): Promise<BulletinView> {
    return this.move(actor, id, 'return', ['in_review'], 'returned', comment, async (b) => {
      this.refuseOwn(actor, b, 'return');
      return {};
    });
  }

  private refuseOwn(actor: Actor, b: BulletinWithNames, verb: string) {
    if (actor.id === b.authorId)
      throw new ForbiddenException({
        message: `You wrote bulletin ${b.number}, so you cannot ${verb} it: another scientist or administrator must review it.`,
        details: [{ where: 'bulletin', problem: 'the reviewer is the author' }],
      });
  }

  /**
   * One state change: checked against the state read, written with its event and audit row in one
   * transaction, and only if the state is still the one read.
   */
  private async move(
    actor: Actor,
    id: number,
    transition: BulletinTransition,
    from: readonly BulletinState[],
    to: BulletinState,
    comment: string | null,
    check: (b: BulletinWithNames) => Promise<Partial<Parameters<BulletinsRepository['update']>[2]>>,
  ): Promise<BulletinView> {
    const b = await this.found(id);
    if (!from.includes(b.state)) throw wrongState(b, transition, from);
    const extra = await check(b);
    await this.repo.transaction(async (tx) => {
      if (!(await this.repo.update(id, b.state, { state: to, ...extra }, tx)))
        throw changedMeanwhile(b.number);
      await this.repo.addEvent(
        { bulletinId: id, transition, fromState: b.state, toState: to, actorId: actor.id, comment },
        tx,
      );
      await this.audit.record(
        actor,
        `bulletin.${transition}`,
        `bulletin:${id}`,
        { from: b.state, to, comment },
        tx,
      );
    });
    return this.view(actor, id);
  }

  // ── Sending ───────────────────────────────────────────────────────────────────────────────────

  private fromAddress(): string {
    const [first] = addressparser(this.config.mailFrom, { flatten: true });
    return first?.address ?? 'bulletins@stormhour.invalid';
  }

  private async geometryOf(districtId: number): Promise<Map<string, GeoPolygonal>> {
    const blocks = await this.regions.listBlocksWithGeometry({ districtId });
    return new Map(blocks.map((b) => [b.code, b.geometry]));
  }

  /** The CAP alert of a bulletin's shown version: "Actual" once sent (at its sending time), else "Draft". */
  async capXml(id: number): Promise<{ number: string; xml: string }> {
    const { bulletin: b, version, content } = await this.content(id);
    const sent = b.state === 'sent' || b.state === 'withdrawn';
    const xml = this.renderer.capXml(content, {
      version,
      sender: this.fromAddress(),
      sent: sent && b.sentAt ? b.sentAt : new Date(),
      utcOffsetMinutes: b.utcOffsetMinutes,
      status: sent ? 'Actual' : 'Draft',
      geometryByBlock: await this.geometryOf(b.districtId),
    });
    return { number: b.number, xml };
  }

  async send(actor: Actor, id: number, comment?: string): Promise<BulletinView> {
    const b = await this.found(id);
    if (b.state !== 'approved') throw wrongState(b, 'send', ['approved']);
    const officers = await this.repo.officersOf(b.districtId);
    if (officers.length === 0)
      throw new ConflictException({
        message: `District ${b.districtName} has no extension officers: add one in Admin › People before sending.`,
        details: [{ where: 'district', problem: 'no active extension officers' }],
      });
    const version = b.approvedVersion as number;
    const content = (await this.repo.version(id, version)).content;
    const sentAt = new Date();
    // Everything is rendered before anything is queued: a rendering failure sends nothing.
    let attachments: OutgoingMail['attachments'];
    let html: string;
    let text: string;
    try {
      const pdf = await this.renderer.pdf(content);
      const cap = this.renderer.capXml(content, {
        version,
        sender: this.fromAddress(),
        sent: sentAt,
        utcOffsetMinutes: b.utcOffsetMinutes,
        status: 'Actual',
        geometryByBlock: await this.geometryOf(b.districtId),
      });
      html = this.renderer.html(content);
      text = this.renderer.text(content);
      const base = content.number.toLowerCase();
      attachments = [
        { filename: `${base}.pdf`, contentType: 'application/pdf', content: pdf },
        { filename: `${base}.cap.xml`, contentType: 'application/xml', content: Buffer.from(cap, 'utf8') },
      ];
    } catch (e) {
      const why = e instanceof Error ? e.message : String(e);
      this.logger.error(`Bulletin ${b.number} could not be rendered for sending: ${why}`);
      throw new UnprocessableEntityException({
        message: `Bulletin ${b.number} could not be turned into its PDF and CAP files (${why}). Nothing was sent; it stays approved.`,
        details: [{ where: 'attachments', problem: why }],
      });
    }
    const subject = bulletinTitle(content);
    const messages: OutgoingMail[] = officers.map((o) => ({ to: o.email, subject, text, html, attachments }));
    const key = sendKey(id, version);
    await this.repo.transaction(async (tx) => {
      if (!(await this.repo.update(id, 'approved', { state: 'sent', sentAt }, tx)))
        throw changedMeanwhile(b.number);
      const queued = await this.mail.enqueue(key, messages, { actor, tx });
      await this.repo.addEvent(
        {
          bulletinId: id,
          transition: 'send',
          fromState: 'approved',
          toState: 'sent',
          actorId: actor.id,
          comment: comment ?? null,
        },
        tx,
      );
      await this.audit.record(
        actor,
        'bulletin.send',
        `bulletin:${id}`,
        {
          key,
          version,
          recipients: queued.queued.map((q) => q.recipient),
          alreadyQueued: queued.alreadyQueued,
        },
        tx,
      );
    });
    return this.view(actor, id);
  }

  /** Withdraws a sent bulletin and mails a correction notice to everyone it was sent to. */
  async withdraw(actor: Actor, id: number, reason: string): Promise<BulletinView> {
    const b = await this.found(id);
    if (b.state !== 'sent') throw wrongState(b, 'withdraw', ['sent']);
    const version = b.approvedVersion as number;
    const content = (await this.repo.version(id, version)).content;
    const recipients = (await this.mail.statusOf(sendKey(id, version))).map((r) => r.recipient);
    const title = bulletinTitle(content);
    let cap: Buffer;
    try {
      cap = Buffer.from(
        this.renderer.capXml(content, {
          version,
          sender: this.fromAddress(),
          sent: new Date(),
          utcOffsetMinutes: b.utcOffsetMinutes,
          status: 'Actual',
          geometryByBlock: await this.geometryOf(b.districtId),
          cancels: { identifier: capIdentifier(content, version), sent: b.sentAt ?? new Date(), reason },
        }),
      );
    } catch (e) {
      const why = e instanceof Error ? e.message : String(e);
      throw new UnprocessableEntityException({
        message: `The withdrawal notice of ${b.number} could not be made (${why}). Nothing was sent; the bulletin stays sent.`,
        details: [{ where: 'attachments', problem: why }],
      });
    }
    const notice =
      `Bulletin ${content.number} for ${content.districtName} (valid ${content.weekStart} to ${content.weekEnd}) ` +
      'has been withdrawn. Do not act on its advice; a corrected bulletin follows when one is issued.';
    const messages: OutgoingMail[] = recipients.map((to) => ({
      to,
      subject: `Withdrawn: ${title}`,
      text: `${notice}\n\nReason: ${richTextPlain(reason)}\n\n${content.cautions.map((c) => `- ${c}`).join('\n')}\n`,
      html: `<p>${escapeHtml(notice)}</p><h2>Reason</h2>${richTextHtml(reason)}<ul>${content.cautions.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>`,
      attachments: [
        {
          filename: `${content.number.toLowerCase()}-withdrawn.cap.xml`,
          contentType: 'application/xml',
          content: cap,
        },
      ],
    }));
    await this.repo.transaction(async (tx) => {
      if (
        !(await this.repo.update(
          id,
          'sent',
          { state: 'withdrawn', withdrawnAt: new Date(), withdrawalReason: reason },
          tx,
        ))
      )
        throw changedMeanwhile(b.number);
      if (messages.length) await this.mail.enqueue(withdrawalKey(id), messages, { actor, tx });
      await this.repo.addEvent(
        {
          bulletinId: id,
          transition: 'withdraw',
          fromState: 'sent',
          toState: 'withdrawn',
          actorId: actor.id,
          comment: reason,
        },
        tx,
      );
      await this.audit.record(
        actor,
        'bulletin.withdraw',
        `bulletin:${id}`,
        { reason, notified: recipients },
        tx,
      );
    });
    return this.view(actor, id);
  }

  async delivery(id: number): Promise<BulletinDeliveryView> {
    const b = await this.found(id);
    const key = b.sentAt && b.approvedVersion ? sendKey(id, b.approvedVersion) : null;
    const recipients = key ? await this.mail.statusOf(key) : [];
    const wKey = b.state === 'withdrawn' ? withdrawalKey(id) : null;
    const withdrawal = wKey ? await this.mail.statusOf(wKey) : [];
    const counts = { queued: 0, sending: 0, sent: 0, failed: 0 };
    for (const r of recipients as OutboxRecipientStatus[]) counts[r.state]++;
    return { bulletinId: id, key, recipients, withdrawalKey: wKey, withdrawal, counts };
  }
}

function summary(b: BulletinWithNames): BulletinSummaryView {
  return {
    id: b.id,
    districtId: b.districtId,
    districtCode: b.districtCode,
    districtName: b.districtName,
    weekStart: b.weekStart,
    weekEnd: addDays(b.weekStart, 6),
    number: b.number,
    state: b.state,
    authorId: b.authorId,
    authorEmail: b.authorEmail,
    currentVersion: b.currentVersion,
    approvedVersion: b.approvedVersion,
    createdAt: b.createdAt.toISOString(),
    updatedAt: b.updatedAt.toISOString(),
    sentAt: iso(b.sentAt),
  };
}

const STATE_WORDS: Record<BulletinState, string> = {
  draft: 'a draft',
  in_review: 'in review',
  returned: 'returned to its author',
  approved: 'approved',
  sent: 'sent',
  withdrawn: 'withdrawn',
};
const label = (s: BulletinState) => STATE_WORDS[s];

function wrongState(b: BulletinWithNames, transition: BulletinTransition, from: readonly BulletinState[]) {
  return new ConflictException({
    message: `Bulletin ${b.number} is ${label(b.state)}: it can be ${PAST[transition]} only when ${from.map(label).join(' or ')}.`,
    details: [{ where: 'state', problem: `is ${b.state}` }],
  });
}

const PAST: Record<BulletinTransition, string> = {
  create: 'created',
  submit: 'submitted for review',
  approve: 'approved',
  return: 'returned',
  send: 'sent',
  withdraw: 'withdrawn',
};

function changedMeanwhile(number: string) {
  return new ConflictException({
    message: `Bulletin ${number} changed meanwhile; reload it and try again.`,
    details: [{ where: 'state', problem: 'changed meanwhile' }],
  });
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}
