import {
  type AssignmentGridDto,
  PLANNING_ROUTES,
  PUBLISHING_ROUTES,
  type RosterPeriodDto,
  type ShiftTypeDto,
  SOLVING_ROUTES,
  type StaffMemberDto,
  type TokenResponse,
  type UnitDto,
} from '@rotaplex/contracts';
import {
  baseUrl,
  DEMO_PASSWORD,
  eventually,
  openBrowser,
  signIn,
  unnamedControls,
  type Session,
} from './support/browser';
import { linkFromMailbox } from './support/mailbox';

/**
 * Issue 5, item 3: staff A (Robin Tallis) proposes a swap of a published shift in the app, staff B
 * (Priya Wendover) accepts through the link in the e-mail caught by the local mail catcher (no
 * sign-in), and the ward manager approves through the link in their e-mail. The roster then holds
 * the swapped cells. The manager publishes a one-week roster of its own through the API first.
 * Demo ward shift types (invented data): Early 07:00-15:00, Late 14:30-22:30.
 */
const START = '2033-03-07'; // a Monday (no demo unavailability for Robin on Mondays)

type PageOf<T> = { items: T[] };

describe('swap approved by e-mail', () => {
  let staffA: Session;
  let staffB: Session;
  let manager: Session;
  let admin: Session;
  let managerToken: string;
  let period: RosterPeriodDto;
  let shift: Record<string, string>;
  let robin: string;
  let priya: string;

  const call = async <T>(path: string, token: string | null, method = 'GET', body?: unknown): Promise<T> => {
    const res = await fetch(`${baseUrl()}/api${path}`, {
      method,
      headers: {
        ...(token ? { Authorization: `Bearer ${token}` } : {}),
        ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
    return (await res.json()) as T;
  };

  beforeAll(async () => {
    const login = await call<TokenResponse>('/auth/login', null, 'POST', {
      email: 'manager@example.com',
      password: DEMO_PASSWORD,
    });
    managerToken = login.accessToken;
    const ward = (await call<UnitDto[]>('/units', managerToken)).find(
      (u) => u.name === 'Ward 7 Acute Medicine',
    )!;
    period = await call<RosterPeriodDto>(PLANNING_ROUTES.rosterPeriods, managerToken, 'POST', {
      unitId: ward.id,
      startDate: START,
      days: 7,
    });
    const types = await call<ShiftTypeDto[]>(PLANNING_ROUTES.shiftTypes(ward.id), managerToken);
    shift = Object.fromEntries(types.map((s) => [s.code, s.id]));
    const people = await call<PageOf<StaffMemberDto>>(
      `${PLANNING_ROUTES.staff}?unitId=${ward.id}&pageSize=100`,
      managerToken,
    );
    robin = people.items.find((p) => p.name === 'Robin Tallis')!.id;
    priya = people.items.find((p) => p.name === 'Priya Wendover')!.id;
    for (const [staffMemberId, code] of [
      [robin, 'L'],
      [priya, 'E'],
    ]) {
      await call(SOLVING_ROUTES.assignmentCell(period.id), managerToken, 'PUT', {
        staffMemberId,
        date: START,
        shiftTypeId: shift[code],
      });
    }
    const fresh = await call<RosterPeriodDto>(PLANNING_ROUTES.rosterPeriod(period.id), managerToken);
    await call(PUBLISHING_ROUTES.publish(period.id), managerToken, 'POST', { version: fresh.version });

    staffA = await openBrowser();
    staffB = await openBrowser();
    manager = await openBrowser();
    admin = await openBrowser();
  });
  afterAll(async () => {
    for (const s of [staffA, staffB, manager, admin]) await s?.close();
  });

  it('A proposes, B accepts through the e-mail link, the manager approves through the e-mail link', async () => {
    const { page } = staffA;
    await signIn(page, 'staff@example.com');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Swaps' }).click();
    await page.getByRole('heading', { level: 1, name: 'Swaps' }).waitFor();
    const form = page.getByRole('form', { name: 'Propose a swap' });
    const periodSelect = form.getByRole('combobox', { name: 'Roster period' });
    if (await periodSelect.count()) await periodSelect.selectOption({ label: 'From Mon 7 Mar (7 days)' });
    await form.getByRole('combobox', { name: 'My shift' }).selectOption({ label: 'Mon 7 Mar: L' });
    await form.getByRole('combobox', { name: 'Colleague' }).selectOption({ label: 'Priya Wendover' });
    await form.getByRole('combobox', { name: 'Their shift I take' }).selectOption({ label: 'Mon 7 Mar: E' });
    expect(await unnamedControls(page)).toEqual([]);
    await form.getByRole('button', { name: 'Check the rules' }).click();
    await form.getByText('The rules check found no problem').waitFor();
    await form
      .getByText('Robin Tallis works E on Mon 7 Mar; Priya Wendover works L on Mon 7 Mar', { exact: false })
      .waitFor();
    await form.getByRole('button', { name: 'Send swap request' }).click();
    const mine = page.getByRole('table', { name: 'All swap requests' });
    await mine.getByText('Waiting for colleague').first().waitFor();

    // B answers from the e-mail, without signing in.
    await signIn(admin.page, 'admin@example.com');
    const linkB = await linkFromMailbox(admin.page, 'priya.wendover@example.com', '/swap-decision?token=');
    await staffB.page.goto(linkB);
    await staffB.page.getByRole('heading', { name: 'Roster change' }).waitFor();
    await staffB.page.getByText('Swap asked by Robin Tallis with Priya Wendover', { exact: false }).waitFor();
    await staffB.page.getByRole('button', { name: 'Accept the swap' }).click();
    await staffB.page.getByText('Done: waiting for manager').waitFor();
    // The link works once.
    await staffB.page.reload();
    await staffB.page.getByText('This link cannot be used').waitFor();

    // The manager approves from their e-mail.
    const linkM = await linkFromMailbox(admin.page, 'manager@example.com', '/swap-decision?token=');
    await manager.page.goto(linkM);
    await manager.page.getByRole('button', { name: 'Approve the change' }).click();
    await manager.page.getByText('Done: approved').waitFor();

    // The roster holds the swap, and A's list shows it approved.
    const grid = await call<AssignmentGridDto>(SOLVING_ROUTES.assignments(period.id), managerToken);
    const cellOf = (id: string) => grid.rows.find((r) => r.staffMemberId === id)!.cells[0].shiftTypeId;
    expect(cellOf(robin)).toBe(shift['E']);
    expect(cellOf(priya)).toBe(shift['L']);
    await eventually(async () => {
      await page.reload();
      return (await mine.getByText('Approved').count()) > 0 ? true : undefined;
    }, 'the approved swap in A’s list');
  });

  it('both people’s calendars show the swapped shifts', async () => {
    const mineOn = async (session: Session) => {
      await session.page.goto(`/my-roster?date=${START}`);
      const own = session.page.getByTestId('my-roster-calendar').locator('[data-mine="true"]');
      await own.first().waitFor();
      return [...new Set(await own.evaluateAll((els) => els.map((el) => el.getAttribute('aria-label'))))];
    };
    expect(await mineOn(staffA)).toEqual([`Your shift, Early (E), ${START} 07:00 to 15:00`]);
    await signIn(staffB.page, 'priya.wendover@example.com');
    expect(await mineOn(staffB)).toEqual([`Your shift, Late (L), ${START} 14:30 to 22:30`]);
  });
});
