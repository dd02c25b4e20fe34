import {
  type ContractDto,
  type CoverNeedsDto,
  type CoverOverrideDto,
  type CsvImportResult,
  PUBLISHING_ROUTES as PUB,
  type PublishCheckDto,
  SOLVING_ROUTES as R,
  GUARD_RAIL_DEFERRAL,
  PLANNING_ROUTES as P,
  type ShiftTypeDto,
} from '@rotaplex/contracts';
import { type SmallUnit, smallUnit } from './publishing-fixture';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

// Guard rails on settings: contracts beyond the working-time presets, shift types over 12 hours and a
// minimum cover lowered to 0 are saved (local law and agreements may allow them) with a caution that
// names the risk and defers to local law; the contracts list marks the contracts beyond the presets.
describe('guard-rail cautions on contracts, shift types and cover needs', () => {
  let t: TestApp;
  let admin: string;
  let small: SmallUnit;

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    small = await smallUnit(t, admin, 'Osprey Lane', '2031-05-05');
  });
  afterAll(() => t?.close());

  it('cautions on a contract beyond the presets (2 h rest, 90 h a week, 21 days in a row) and marks it in the list', async () => {
    const create = (body: object) =>
      t
        .http()
        .post(api(P.contracts))
        .set(bearer(admin))
        .send({ unitId: small.unit.id, ...body })
        .expect(201);
    const loose = (
      await create({
        name: 'Osprey marathon',
        minRestMinutes: 120,
        maxPaidMinutes: 90 * 60,
        maxConsecutiveWorkDays: 21,
      })
    ).body as ContractDto;
    expect(loose.cautions).toHaveLength(4);
    const words = loose.cautions!.join(' ');
    expect(words).toMatch(/Rest between shifts of 2 h is less than the 11 h of the presets/);
    expect(words).toMatch(/Up to 90 h a week is more than the 48 h/);
    expect(words).toMatch(/Up to 21 working days in a row is more than the 6/);
    expect(words).toMatch(/fatigue/);
    expect(loose.cautions!.at(-1)).toBe(GUARD_RAIL_DEFERRAL);
    expect(GUARD_RAIL_DEFERRAL).toMatch(/Local law, collective agreements/);

    const within = (
      await create({
        name: 'Osprey standard',
        minRestMinutes: 660,
        maxPaidMinutes: 2880,
        maxConsecutiveWorkDays: 6,
      })
    ).body as ContractDto;
    expect(within.cautions).toEqual([]);

    // A change back inside the presets clears the caution.
    const fixed = (
      await t
        .http()
        .patch(api(P.contract(loose.id)))
        .set(bearer(admin))
        .send({ minRestMinutes: 660, maxPaidMinutes: 2880, maxConsecutiveWorkDays: 6 })
        .expect(200)
    ).body as ContractDto;
    expect(fixed.cautions).toEqual([]);
    await t
      .http()
      .patch(api(P.contract(loose.id)))
      .set(bearer(admin))
      .send({ minRestMinutes: 120 })
      .expect(200);

    const list = (await t.http().get(api(P.contracts)).set(bearer(admin)).expect(200)).body as ContractDto[];
    const marked = Object.fromEntries(list.map((c) => [c.name, (c.cautions ?? []).length > 0]));
    expect(marked['Osprey marathon']).toBe(true);
    expect(marked['Osprey standard']).toBe(false);
    // The demo contracts keep within the presets.
    expect(marked['Full-time 37.5 h']).toBe(false);
  });

  it('cautions on a shift type longer than 12 hours, not on one of 12 hours', async () => {
    const create = (code: string, start: string, end: string) =>
      t
        .http()
        .post(api(P.shiftTypes(small.unit.id)))
        .set(bearer(admin))
        .send({ code, name: `Shift ${code}`, start, end, paidMinutes: 600, colour: 'slate' })
        .expect(201);
    const day = (await create('D24', '08:00', '08:00')).body as ShiftTypeDto;
    expect(day.cautions![0]).toMatch(/lasts 24 h, more than 12 h.*fatigue/);
    expect(day.cautions!.at(-1)).toBe(GUARD_RAIL_DEFERRAL);
    const twelve = (await create('T12', '19:00', '07:00')).body as ShiftTypeDto;
    expect(twelve.cautions).toEqual([]);
    const listed = (
      await t
        .http()
        .get(api(P.shiftTypes(small.unit.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as ShiftTypeDto[];
    expect(listed.find((s) => s.code === 'D24')!.cautions!.length).toBeGreaterThan(0);
  });

  it('cautions when a minimum cover of 1 becomes 0, in the pattern and on a date', async () => {
    const [early, late] = small.shifts;
    const pattern = (min: (weekday: number, shift: string) => number) =>
      t
        .http()
        .put(api(P.coverPattern(small.unit.id)))
        .set(bearer(admin))
        .send({
          rows: [0, 1, 2, 3, 4, 5, 6].flatMap((weekday) =>
            [early, late].map((s) => ({
              weekday,
              shiftTypeId: s.id,
              skillId: null,
              min: min(weekday, s.id),
              target: 1,
            })),
          ),
        })
        .expect(200);
    const lowered = (await pattern((weekday, id) => (weekday === 6 && id === late.id ? 0 : 1)))
      .body as CoverNeedsDto;
    expect(lowered.cautions).toHaveLength(2);
    expect(lowered.cautions![0]).toMatch(/^Late \(L\) on Sat had a minimum of 1 and now has none/);
    expect(lowered.cautions![1]).toBe(GUARD_RAIL_DEFERRAL);
    // Saved as asked.
    expect(lowered.pattern.find((r) => r.weekday === 6 && r.shiftTypeId === late.id)!.min).toBe(0);
    // Saving it again lowers nothing: no caution.
    expect(
      ((await pattern((weekday, id) => (weekday === 6 && id === late.id ? 0 : 1))).body as CoverNeedsDto)
        .cautions,
    ).toEqual([]);

    const override = (min: number) =>
      t
        .http()
        .post(api(P.coverOverrides(small.unit.id)))
        .set(bearer(admin))
        .send({ date: '2031-05-06', shiftTypeId: early.id, skillId: null, min, target: min });
    const zero = await override(0);
    expect(zero.status).toBeLessThan(300);
    expect((zero.body as CoverOverrideDto).cautions![0]).toMatch(
      /^Early \(E\) on 2031-05-06 had a minimum of 1 and now has none/,
    );
    const raised = await override(2);
    expect((raised.body as CoverOverrideDto).cautions).toEqual([]);

    // A CSV upload says it on the dry run, before anything is saved, and again on the import.
    const csv = ['day,shift,skill,min,target', 'Mon,E,,1,1', 'Mon,L,,0,1', '2031-05-06,E,,0,0'].join('\n');
    const upload = (dryRun: boolean) =>
      t
        .http()
        .post(api(`${P.coverImport(small.unit.id)}?dryRun=${dryRun}`))
        .set(bearer(admin))
        .set('Content-Type', 'text/csv')
        .send(csv)
        .expect(200);
    for (const dryRun of [true, false]) {
      const result = (await upload(dryRun)).body as CsvImportResult;
      expect(result.errors).toEqual([]);
      const words = result.cautions!.join(' ');
      expect(words).toMatch(/Late \(L\) on Mon had a minimum of 1 and now has none/);
      expect(words).toMatch(/Early \(E\) on 2031-05-06 had a minimum of 2 and now has none/);
      // Rows the upload drops (every other weekday) lose their minimum too.
      expect(words).toMatch(/Early \(E\) on Tue had a minimum of 1/);
      expect(result.cautions!.at(-1)).toBe(GUARD_RAIL_DEFERRAL);
    }
  });

  it('names a shift type over 12 hours on the roster among the cautions before publishing', async () => {
    const types = (
      await t
        .http()
        .get(api(P.shiftTypes(small.unit.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as ShiftTypeDto[];
    const long = types.find((s) => s.code === 'D24')!;
    const before = (
      await t
        .http()
        .get(api(PUB.publishCheck(small.period.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as PublishCheckDto;
    expect(before.cautions.join(' ')).not.toMatch(/D24/);
    await t
      .http()
      .put(api(R.assignmentCell(small.period.id)))
      .set(bearer(admin))
      .send({ staffMemberId: small.staff[0].id, date: small.period.startDate, shiftTypeId: long.id })
      .expect(200);
    const after = (
      await t
        .http()
        .get(api(PUB.publishCheck(small.period.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as PublishCheckDto;
    expect(after.cautions).toContain(`Shift D24 (D24): ${long.cautions![0]}`);
  });
});
