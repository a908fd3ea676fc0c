// @vitest-environment jsdom
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import type { WorkOrderDto } from '@shared/schemas/work-orders';
import type { ReleaseBlocker } from '@shared/schemas/release';
import { PressureTestCard } from '@/features/release/components/pressure-test-card';
import { ReleaseCard } from '@/features/release/components/release-card';
import { ReleaseQueue } from '@/features/release/components/release-queue';

const J1 = '11111111-1111-4111-8111-111111111111';
const J2 = '22222222-2222-4222-8222-222222222222';
const order = (over: Partial<WorkOrderDto> = {}) => ({
  id: 'wo-1', number: 'WO-1', state: 'testing', history: [],
  lines: [{ id: 'l1', lineNumber: 'SA-001', status: 'locked-out' }],
  testPressure: { required: true, minimumPsi: 225, capPsi: 300, testPsi: 225, holdMinutes: 10, problems: [] },
  jointTasks: [
    { id: J1, label: 'J1', lineNumber: 'SA-001', jointSize: '2', fittingKind: 'coupling', redone: false },
    { id: J2, label: 'J2', lineNumber: 'SA-001', jointSize: '2', fittingKind: 'elbow-90', redone: true },
  ],
  ...over,
}) as unknown as WorkOrderDto;

type Reply = { status?: number; body: unknown };
function serve(roles: string[], routes: Record<string, Reply | ((init?: RequestInit) => Reply)>) {
  const calls: { url: string; init?: RequestInit }[] = [];
  vi.stubGlobal('fetch', vi.fn(async (url: string, init?: RequestInit) => {
    calls.push({ url, init });
    const key = `${init?.method ?? 'GET'} ${url}`;
    const found = url === '/api/me' ? { body: { id: 'me', name: 'Mara Quist', email: null, roles } } : routes[key];
    const reply = typeof found === 'function' ? found(init) : found ?? { status: 404, body: { error: { code: 'not_found', message: `no ${key}` } } };
    return new Response(JSON.stringify(reply.body), { status: reply.status ?? 200, headers: { 'content-type': 'application/json' } });
  }));
  return calls;
}
const show = (ui: ReactNode) => render(<QueryClientProvider client={queryClient}><MemoryRouter>{ui}</MemoryRouter></QueryClientProvider>);
const posts = (calls: { url: string; init?: RequestInit }[]) => calls.filter((c) => c.init?.method === 'POST');

afterEach(() => { cleanup(); queryClient.clear(); vi.unstubAllGlobals(); });

describe('the release card', () => {
  it('lists every reason and keeps the button closed while the server says not ready', async () => {
    const blockers: ReleaseBlocker[] = [
      { kind: 'lock', message: 'Lock 7 (Tomas Lind) is still on HV-1.', until: null },
      { kind: 'hold', message: "J1's cure hold runs until 2099-01-01 00:00 UTC.", until: '2099-01-01T00:00:00.000Z' },
    ];
    serve(['operations'], { 'GET /api/work-orders/wo-1/release-check': { body: { ready: false, blockers } } });
    show(<ReleaseCard order={order()} />);
    await screen.findByText('Lock 7 (Tomas Lind) is still on HV-1.');
    expect(screen.getByText('LOCK')).toBeTruthy();
    expect(screen.getByText('HOLD')).toBeTruthy();
    expect(screen.getByText(/left · ends/)).toBeTruthy();
    await waitFor(() => expect((screen.getByRole('button', { name: 'Release the line' }) as HTMLButtonElement).disabled).toBe(true));
  });

  it('asks for all five ticks, sends the checklist, and shows each reason of a refusal', async () => {
    const calls = serve(['operations'], {
      'GET /api/work-orders/wo-1/release-check': { body: { ready: true, blockers: [] } },
      'POST /api/work-orders/wo-1/release': {
        status: 409,
        body: { error: { code: 'release_refused', message: 'WO-1 cannot be released: …', details: { reasons: ['Lock 9 (Ann Ortiz) is still on HV-2.', 'No hydrostatic test is recorded.'] } } },
      },
    });
    show(<ReleaseCard order={order({ state: 'ready' })} />);
    const button = await screen.findByRole('button', { name: 'Release the line' });
    await waitFor(() => expect((button as HTMLButtonElement).disabled).toBe(false));
    fireEvent.click(button);
    expect(screen.getByText(/confirm the area is inspected/)).toBeTruthy();
    expect(posts(calls)).toHaveLength(0);
    for (const box of within(screen.getByRole('group', { name: /Before the line goes back/ })).getAllByRole('checkbox')) fireEvent.click(box);
    fireEvent.click(button);
    await screen.findByText('Lock 9 (Ann Ortiz) is still on HV-2.');
    expect(screen.getByText('No hydrostatic test is recorded.')).toBeTruthy();
    expect(JSON.parse(String(posts(calls)[0]!.init!.body))).toEqual({ areaInspected: true, peopleClear: true, affectedTold: true, ventsDrainsSet: true, slowRefill: true });
  });

  it('shows a fitter what blocks, without the checklist', async () => {
    serve(['fitter'], { 'GET /api/work-orders/wo-1/release-check': { body: { ready: true, blockers: [] } } });
    show(<ReleaseCard order={order({ state: 'ready' })} />);
    await screen.findByText('Ready to release');
    expect(screen.queryByRole('button', { name: 'Release the line' })).toBeNull();
    expect(screen.getByText(/released by an operations/i)).toBeTruthy();
  });

  it('after the release, says who released it and when, and that the line is back in service', () => {
    serve(['operations'], {});
    const history = [{ at: '2027-03-01T11:00:00Z', action: 'order-released', actor: { id: 'me', name: 'Mara Quist' }, before: {}, after: { notes: null } }];
    show(<ReleaseCard order={order({ state: 'released', history, lines: [{ id: 'l1', lineNumber: 'SA-001', status: 'in-service' }] as WorkOrderDto['lines'] })} />);
    expect(screen.getByText(/^Released by Mara Quist, /)).toBeTruthy();
    expect(screen.getByText('Its line is back in service.')).toBeTruthy();
  });
});

describe('the pressure test card', () => {
  it('lets a witness record a failed test, naming a joint still in the line, with an idempotency key, and shows a refusal', async () => {
    const calls = serve(['operations'], {
      'GET /api/work-orders/wo-1/pressure-tests': { body: [] },
      'POST /api/work-orders/wo-1/pressure-tests': {
        status: 409,
        body: { error: { code: 'test_refused', message: 'Before pressurising, each person removes their own lock from the test boundary (OSHA 29 CFR 1910.147(f)(1)); still on: 7.' } },
      },
    });
    show(<PressureTestCard order={order()} />);
    await screen.findByText('No test is recorded yet.');
    expect(screen.getByText('Never test with air or gas.')).toBeTruthy();
    fireEvent.click(await screen.findByRole('button', { name: 'Record the test' }));
    expect((screen.getByLabelText(/^Test pressure \(psi\)/) as HTMLInputElement).value).toBe('225');
    expect((screen.getByLabelText(/^Piping tested/) as HTMLTextAreaElement).value).toBe('SA-001');
    fireEvent.change(screen.getByLabelText(/^Test medium/), { target: { value: 'compressed air' } });
    expect(screen.getByText(/Testing with compressed air is refused/)).toBeTruthy();
    fireEvent.change(screen.getByLabelText(/^Test medium/), { target: { value: 'water' } });
    fireEvent.click(screen.getByLabelText('Tools and materials are clear of the section.'));
    fireEvent.click(screen.getByLabelText('People are clear of the section.'));
    fireEvent.change(screen.getByLabelText(/^Gauge/), { target: { value: 'PI-T3, 0–300 psi' } });
    fireEvent.change(screen.getByLabelText('Pressure reached at'), { target: { value: '2027-03-01T10:00' } });
    fireEvent.change(screen.getByLabelText('Reading at the start (psi)'), { target: { value: '226' } });
    fireEvent.change(screen.getByLabelText('Test ended at'), { target: { value: '2027-03-01T10:12' } });
    fireEvent.change(screen.getByLabelText('Reading at the end (psi)'), { target: { value: '190' } });
    expect(screen.getByText(/Held 12 min/)).toBeTruthy();
    fireEvent.click(screen.getByLabelText(/^Failed/));
    expect(screen.queryByText('J2')).toBeNull(); // cut out already: not in the line
    fireEvent.click(screen.getByRole('checkbox', { name: /J1/ }));
    fireEvent.change(screen.getByLabelText('Examiner who certifies the record'), { target: { value: 'R. Adeyemi' } });
    fireEvent.click(screen.getByRole('button', { name: 'Record the test' }));
    await screen.findByText(/still on: 7/);
    const post = posts(calls)[0]!;
    expect(new Headers(post.init!.headers).get('idempotency-key')).toMatch(/^[0-9a-f-]{36}$/);
    expect(JSON.parse(String(post.init!.body))).toMatchObject({
      result: 'failed', leakingJointIds: [J1], medium: 'water', testPressurePsi: 225, startReadingPsi: 226, endReadingPsi: 190,
      startedAt: new Date('2027-03-01T10:00').toISOString(), endedAt: new Date('2027-03-01T10:12').toISOString(),
    });
  });

  it('shows no form to someone who is not a witness, and nothing for an order before its test', async () => {
    serve(['fitter'], { 'GET /api/work-orders/wo-1/pressure-tests': { body: [] } });
    const { unmount } = show(<PressureTestCard order={order()} />);
    await screen.findByText('No test is recorded yet.');
    expect(screen.queryByRole('button', { name: 'Record the test' })).toBeNull();
    unmount();
    show(<PressureTestCard order={order({ state: 'curing' })} />);
    await waitFor(() => expect(screen.queryByText('Hydrostatic test')).toBeNull());
  });
});

describe('the release queue', () => {
  it('shows the ready orders first as their own group, then each blocked one with every reason', () => {
    const blocked = { id: 'b', number: 'WO-2', state: 'curing', lines: ['SA-002'], windowEnd: null, latestHoldEnd: null, ready: false, blockers: [{ kind: 'test' as const, message: 'No hydrostatic test is recorded.', until: null }] };
    const ready = { id: 'a', number: 'WO-1', state: 'ready', lines: ['SA-001'], windowEnd: null, latestHoldEnd: null, ready: true, blockers: [] };
    show(<ReleaseQueue orders={[ready, blocked]} />);
    const readyGroup = screen.getByRole('region', { name: 'Ready to release (1)' });
    expect(within(readyGroup).getByRole('link', { name: 'WO-1' }).getAttribute('href')).toBe('/work-orders/a');
    const blockedGroup = screen.getByRole('region', { name: 'Not yet (1)' });
    expect(within(blockedGroup).getByText('No hydrostatic test is recorded.')).toBeTruthy();
    expect(within(blockedGroup).getByText('TEST')).toBeTruthy();
  });
});
