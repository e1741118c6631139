import type { AdviceRuleRequest, AdviceRuleView } from '@stormhour/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../testing/test-app.js';
import { DEFAULT_ADVICE_RULES } from './default-rules.js';

const header = 'district_code,crop,stage,from_week,to_week';

describe('crop calendars and advice rules API', () => {
  let t: TestApp;
  let admin: string;
  let scientist: string;
  let writer: string;
  let officer: string;
  let riverbend: number;
  beforeAll(async () => {
    t = await createTestApp({ uploadLimitBytes: 64 * 1024 });
    for (const [code, name] of [
      ['RVB', 'Riverbend'],
      ['HLF', 'Hillfoot'],
    ])
      await t.db.pg.query('insert into districts (code, name) values ($1, $2)', [code, name]);
    riverbend = (await t.db.pg.query<{ id: number }>("select id from districts where code = 'RVB'")).rows[0]
      .id;
    admin = await t.signedIn('admin');
    scientist = await t.signedIn('scientist');
    writer = await t.signedIn('writer');
    officer = await t.signedIn('officer');
  });
  afterAll(() => t.close());

  const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
  const count = async (table: string) =>
    (await t.db.pg.query<{ n: number }>(`select count(*)::int as n from ${table}`)).rows[0].n;
  const upload = (token: string, csv: string, name = 'calendar.csv') =>
    t.http.post('/api/crop-calendars/import').set(bearer(token)).attach('file', Buffer.from(csv), name);

  describe('crop calendars', () => {
    it('replaces a district’s calendar, normalising names, and the writer reads it', async () => {
      const put = await t.http
        .put(`/api/districts/${riverbend}/crop-calendar`)
        .set(bearer(scientist))
        .send({
          entries: [
            { crop: ' Rice ', stage: 'Nursery', fromWeek: 24, toWeek: 27 },
            { crop: 'rice', stage: 'transplanting', fromWeek: 27, toWeek: 30 },
          ],
        })
        .expect(200);
      expect(put.body).toMatchObject({ districtCode: 'RVB', districtName: 'Riverbend' });
      const read = await t.http
        .get(`/api/districts/${riverbend}/crop-calendar`)
        .set(bearer(writer))
        .expect(200);
      expect(read.body.entries).toEqual([
        { crop: 'rice', stage: 'nursery', fromWeek: 24, toWeek: 27 },
        { crop: 'rice', stage: 'transplanting', fromWeek: 27, toWeek: 30 },
      ]);
      expect(read.body.updatedAt).toMatch(/^\d{4}-\d{2}-\d{2}T/);
    });

    it('refuses bad entries, naming each field, and keeps the calendar', async () => {
      const res = await t.http
        .put(`/api/districts/${riverbend}/crop-calendar`)
        .set(bearer(admin))
        .send({
          entries: [
            { crop: '', stage: 'nursery', fromWeek: 24, toWeek: 27 },
            { crop: 'rice', stage: 'harvest', fromWeek: 54, toWeek: 2.5 },
          ],
        })
        .expect(400);
      expect(res.body.details).toEqual(
        expect.arrayContaining([
          { where: 'entries.0.crop', problem: 'Name the crop' },
          { where: 'entries.1.fromWeek', problem: 'ISO weeks run from 1 to 53' },
          { where: 'entries.1.toWeek', problem: 'Give a whole ISO week number' },
        ]),
      );
      expect(await count('crop_calendar_entries')).toBe(2);
      await t.http.get('/api/districts/999999/crop-calendar').set(bearer(admin)).expect(404);
    });

    it('refuses a CSV with bad rows whole, naming each row and column, and stores nothing', async () => {
      const res = await upload(
        scientist,
        [
          header,
          'RVB,rice,tillering,30,34',
          'HLF,maize,sowing,23,x',
          'XYZ,millet,sowing,25,27',
          'HLF,,harvest,36,39',
        ].join('\n'),
        'bad.csv',
      ).expect(400);
      // The checks that need no database come first; unknown districts only once every row is well formed.
      expect(res.body.message).toBe('bad.csv: 2 row(s) have problems; nothing was imported.');
      expect(res.body.details).toEqual([
        {
          where: 'row 3, column "to_week"',
          problem: '"x" is not a week number; give an ISO week from 1 to 53',
        },
        { where: 'row 5, column "crop"', problem: 'is empty' },
      ]);
      const unknown = await upload(
        scientist,
        [header, 'RVB,rice,tillering,30,34', 'XYZ,millet,sowing,25,27'].join('\n'),
      );
      expect(unknown.status).toBe(400);
      expect(unknown.body.details).toEqual([
        { where: 'row 3, column "district_code"', problem: 'there is no district XYZ' },
      ]);
      const calendar = await t.http.get(`/api/districts/${riverbend}/crop-calendar`).set(bearer(admin));
      expect(calendar.body.entries.map((e: { stage: string }) => e.stage)).toEqual([
        'nursery',
        'transplanting',
      ]);
    });

    it('imports a good CSV, replacing only the districts it names', async () => {
      const res = await upload(
        admin,
        [header, 'HLF,maize,sowing,23,25', 'HLF,orchards,flowering,50,4', 'HLF,maize,harvest,36,39'].join(
          '\r\n',
        ),
      ).expect(201);
      expect(res.body).toEqual({ districts: [{ code: 'HLF', stages: 3 }] });
      const riverbendStages = await t.http
        .get(`/api/districts/${riverbend}/crop-calendar`)
        .set(bearer(admin));
      expect(riverbendStages.body.entries).toHaveLength(2);
      expect(await count('crop_calendar_entries')).toBe(5);
      const audit = await t.db.pg.query<{ action: string }>(
        "select action from audit_log where action like 'crop-calendar.%' order by id",
      );
      expect(audit.rows.map((r) => r.action)).toEqual(['crop-calendar.replace', 'crop-calendar.import']);
    });

    it('refuses a file missing a column, a request without a file, and the roles that may not edit', async () => {
      const noColumn = await upload(
        scientist,
        'district_code,crop,stage,from_week\nRVB,rice,nursery,24\n',
      ).expect(400);
      expect(noColumn.body.message).toMatch(/lacks the column to_week/);
      const missing = await t.http.post('/api/crop-calendars/import').set(bearer(scientist)).expect(400);
      expect(missing.body.details).toEqual([{ where: 'file', problem: 'missing' }]);
      await upload(writer, `${header}\nRVB,rice,nursery,24,27\n`).expect(403);
      await t.http
        .put(`/api/districts/${riverbend}/crop-calendar`)
        .set(bearer(writer))
        .send({ entries: [] })
        .expect(403);
      await t.http.get(`/api/districts/${riverbend}/crop-calendar`).set(bearer(officer)).expect(403);
    });
  });

  describe('advice rules', () => {
    const aRule = (overrides: Partial<AdviceRuleRequest> = {}): AdviceRuleRequest => ({
      crop: 'rice',
      stage: 'flowering',
      condition: {
        combine: 'all',
        clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 0.4 }],
      },
      priority: 8,
      text: 'Protect {crop} at {stage} in {blocks}.',
      source: 'common practice',
      active: true,
      ...overrides,
    });

    it('starts with the shipped defaults, ordered by priority', async () => {
      const res = await t.http.get('/api/advice-rules').set(bearer(writer)).expect(200);
      const rules = res.body as AdviceRuleView[];
      expect(rules).toHaveLength(DEFAULT_ADVICE_RULES.length);
      expect(rules.every((r) => r.origin === 'default' && r.source.length > 0)).toBe(true);
      expect(rules[0].text).toMatch(/^Lightning/);
      const priorities = rules.map((r) => r.priority);
      expect(priorities).toEqual([...priorities].sort((a, b) => a - b));
    });

    it('lets the scientist add and edit a rule, audited', async () => {
      const created = await t.http.post('/api/advice-rules').set(bearer(scientist)).send(aRule()).expect(201);
      expect(created.body).toMatchObject({ origin: 'unit', crop: 'rice', stage: 'flowering', active: true });
      expect(created.body.updatedBy).toMatch(/^scientist\./);
      const edited = await t.http
        .put(`/api/advice-rules/${created.body.id}`)
        .set(bearer(scientist))
        .send(aRule({ active: false, priority: 3 }))
        .expect(200);
      expect(edited.body).toMatchObject({ id: created.body.id, active: false, priority: 3 });
      const audit = await t.db.pg.query<{ action: string }>(
        "select action from audit_log where action like 'advice-rule%' order by id",
      );
      expect(audit.rows.map((r) => r.action)).toEqual([
        'advice-rules.seed',
        'advice-rule.create',
        'advice-rule.update',
      ]);
    });

    it.each<
      [string, Partial<AdviceRuleRequest> | Record<string, unknown>, { where: string; problem: RegExp }]
    >([
      [
        'an unknown placeholder, by name and position',
        { text: 'Spray before {peak}.' },
        { where: 'text', problem: /^\{peak\} at character 14: unknown placeholder; use one of \{blocks\}/ },
      ],
      [
        '{crop} in a rule for no crop or stage',
        { crop: null, stage: null, text: 'Protect {crop}.' },
        { where: 'text', problem: /only a rule for a crop or a stage/ },
      ],
      [
        'a chance given in per cent',
        {
          condition: {
            combine: 'all',
            clauses: [{ metric: 'afternoonChance', aggregate: 'anyBlock', op: '>=', value: 40 }],
          },
        },
        { where: 'condition.clauses.0.value', problem: /fraction from 0 to 1/ },
      ],
      ['a priority out of range', { priority: 0 }, { where: 'priority', problem: /from 1 \(first\) to 99/ }],
      ['no source', { source: ' ' }, { where: 'source', problem: /common practice/ }],
      ['free code as a condition', { condition: 'chance > 0.4' }, { where: 'condition', problem: /./ }],
    ])('refuses %s', async (_name, overrides, expected) => {
      const before = await count('advice_rules');
      const res = await t.http
        .post('/api/advice-rules')
        .set(bearer(scientist))
        .send({ ...aRule(), ...overrides })
        .expect(400);
      const detail = (res.body.details as { where: string; problem: string }[]).find(
        (d) => d.where === expected.where,
      );
      expect(detail?.problem).toMatch(expected.problem);
      expect(await count('advice_rules')).toBe(before);
    });

    it('answers 404 for a rule that does not exist and 403 to the writer', async () => {
      await t.http.put('/api/advice-rules/999999').set(bearer(scientist)).send(aRule()).expect(404);
      await t.http.post('/api/advice-rules').set(bearer(writer)).send(aRule()).expect(403);
    });
  });
});
