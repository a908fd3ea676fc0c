// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '@/lib/query-client';
import type { LockoutDto } from '@shared/schemas/lockout';
import { LockBoardCard } from '@/features/lockout/components/lock-board-card';

const ann = { id: '11111111-1111-4111-8111-111111111111', name: 'Ann Ortiz' };
const ben = { id: '22222222-2222-4222-8222-222222222222', name: 'Ben Wu' };
const E1 = 'aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa';
const E2 = 'bbbbbbbb-bbbb-4bbb-8bbb-bbbbbbbbbbbb';
const benLock = { id: 'cccccccc-cccc-4ccc-8ccc-cccccccccccc', lockNumber: 'B-7', person: ben, entryId: E1, lockBoxId: null, appliedAt: '2027-03-01T06:00:00.000Z', handedOverFromLockId: null, removedAt: null, removedBy: null, removal: null };
const board: LockoutDto = {
  workOrderId: 'wo-1', number: 'WO-1', state: 'planned',
  points: [
    { entryId: E1, tag: 'HV-1', kind: 'valve', lineNumber: 'L-1', requiredPosition: 'closed', lockBoxId: null, locks: [benLock], protected: true, positionFound: null },
    { entryId: E2, tag: 'HV-2', kind: 'valve', lineNumber: 'L-1', requiredPosition: 'closed', lockBoxId: null, locks: [], protected: false, positionFound: null },
  ],
  lockBox: null, verification: null, isolated: false, missing: ['1 of 2 isolation points have no lock: HV-2.'], removedLocks: [], myLocks: [],
};

function serve(me: { id: string; name: string; roles: string[] }, answer: LockoutDto = board) {
  const calls: { url: string; init?: RequestInit }[] = [];
  vi.stubGlobal('fetch', vi.fn(async (url: string, init?: RequestInit) => {
    calls.push({ url, init });
    const body = url === '/api/me' ? { ...me, email: null } : answer;
    return new Response(JSON.stringify(body), { status: 200, headers: { 'content-type': 'application/json' } });
  }));
  return calls;
}

afterEach(() => { cleanup(); queryClient.clear(); vi.unstubAllGlobals(); });

describe('the lock board card', () => {
  it('lets a fitter apply a lock on the unlocked point, sent with an idempotency key', async () => {
    const calls = serve({ ...ann, roles: ['fitter'] });
    render(<QueryClientProvider client={queryClient}><LockBoardCard orderId="wo-1" /></QueryClientProvider>);
    await screen.findByText('HV-2');
    expect(screen.getByText(/No lock: not protected/)).toBeTruthy();
    expect(screen.getByText(/1 of 2 isolation points/)).toBeTruthy();
    expect(screen.queryByText('Remove absent person’s lock')).toBeNull();
    await waitFor(() => expect(screen.getByRole('button', { name: 'Apply my locks' })).toBeTruthy());
    fireEvent.click(screen.getByRole('button', { name: 'Apply my locks' }));
    fireEvent.change(screen.getByLabelText('Your lock number on HV-2'), { target: { value: ' A-3 ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Record my locks' }));
    await waitFor(() => expect(calls.some((c) => c.init?.method === 'POST')).toBe(true));
    const post = calls.find((c) => c.init?.method === 'POST')!;
    expect(post.url).toBe('/api/work-orders/wo-1/locks');
    expect(JSON.parse(String(post.init!.body))).toEqual({ locks: [{ entryId: E2, lockNumber: 'A-3' }] });
    expect(new Headers(post.init!.headers).get('idempotency-key')).toBeTruthy();
  });

  it('shows a supervisor the absent-removal button and the verification waiting for every point', async () => {
    serve({ ...ann, roles: ['supervisor'] });
    render(<QueryClientProvider client={queryClient}><LockBoardCard orderId="wo-1" /></QueryClientProvider>);
    await screen.findByText('HV-2');
    await waitFor(() => expect(screen.getByRole('button', { name: 'Remove absent person’s lock' })).toBeTruthy());
    expect((screen.getByRole('button', { name: 'Record zero energy verified' }) as HTMLButtonElement).disabled).toBe(true);
    expect(screen.getByText(/Not protected yet: HV-2/)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Take over at shift change' }));
    expect(screen.getByLabelText('Your lock on HV-1, beside Ben Wu’s lock B-7')).toBeTruthy();
  });

  it('after the locks came off for the test, a point without a lock is shown plainly, not as unprotected', async () => {
    const off = { ...board.points[1]!, tag: 'HV-3' };
    serve({ ...ann, roles: ['operations'] }, { ...board, state: 'testing', points: [off], missing: [] });
    render(<QueryClientProvider client={queryClient}><LockBoardCard orderId="wo-1" /></QueryClientProvider>);
    await screen.findByText('HV-3');
    expect(screen.getByText('No lock: off for the test')).toBeTruthy();
    expect(screen.queryByText(/not protected/)).toBeNull();
  });
});
