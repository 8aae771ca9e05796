import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { LoginResponse, Qualification } from '@shuntwise/contracts';
import { setSession } from '@/lib/session';
import { errorBody, mockApi } from '@/testing/mock-api';
import { DEMO_USERS, currentLocation, renderApp, signInAs } from '@/testing/render';
import { caseFixture } from '../testing/case-fixture';

// Two engineers as in the demo: the preparer (id 2) and a second engineer who decides (id 3).
const PREPARER: LoginResponse['user'] = { id: 2, email: 'engineer@demo.test', name: 'Priya Raman', role: 'engineer' };
const REVIEWER: LoginResponse['user'] = { id: 3, email: 'reviewer@demo.test', name: 'Tomas Eklund', role: 'engineer' };

function signIn(user: LoginResponse['user']) {
  setSession({ accessToken: `test-token-${user.id}`, user });
}

function serve(user: LoginResponse['user'], q: Qualification, extra: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({ 'GET /api/auth/me': { body: user }, 'GET /api/qualifications/:id': { body: q }, ...extra });
}

async function actions(): Promise<string[]> {
  const group = await screen.findByRole('group', { name: 'Actions on this case' });
  return within(group)
    .getAllByRole('button')
    .map((b) => b.textContent ?? '');
}

const inReview = (over: Partial<Qualification> = {}) =>
  caseFixture({ state: 'in-review', allowedActions: ['send-back', 'clear', 'clear-with-conditions', 'reject', 'withdraw'], ...over });

describe('sign-off panel', () => {
  it("offers a second engineer the decisions on a case in review, and no Withdraw: that is the preparer's (contracts actionBlock)", async () => {
    signIn(REVIEWER);
    // Even if a server answer listed withdraw, the reviewer gets no button for it.
    serve(REVIEWER, inReview());
    renderApp('/qualifications/7');
    expect(await actions()).toEqual(['Clear', 'Clear with conditions', 'Reject', 'Send back to draft']);
    expect(screen.queryByRole('button', { name: 'Withdraw' })).not.toBeInTheDocument();
  });

  it('never offers the preparer a decision on their own case, and says why before they try', async () => {
    signIn(PREPARER);
    // Even if a server answer listed a decision, the preparer gets no button for it.
    serve(PREPARER, inReview());
    renderApp('/qualifications/7');
    expect(await actions()).toEqual(['Send back to draft', 'Withdraw']);
    expect(screen.getByText(/You prepared this case, so another engineer must decide it \(two-person rule\)/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Clear' })).not.toBeInTheDocument();
    expect(screen.getByText(/Priya Raman \(you\)/)).toBeInTheDocument();
  });

  it('tells the preparer of a draft that another engineer will decide it', async () => {
    signIn(PREPARER);
    serve(PREPARER, caseFixture({ state: 'draft', submittedAt: null, allowedActions: ['evaluate', 'submit', 'withdraw'] }));
    renderApp('/qualifications/7');
    expect(await actions()).toEqual(['Send for review', 'Evaluate again', 'Withdraw']);
    expect(screen.getByText(/you cannot clear a case you prepared \(two-person rule\)/)).toBeInTheDocument();
  });

  it('shows an admin the case without any action, and a note that engineers decide', async () => {
    signInAs('admin');
    serve(DEMO_USERS.admin, inReview({ allowedActions: [] }));
    renderApp('/qualifications/7');
    expect(await screen.findByText('Nothing for you to do on this case now.')).toBeInTheDocument();
    expect(screen.getByText(/Only engineers prepare, discuss and decide cases/)).toBeInTheDocument();
    expect(screen.queryByRole('group', { name: 'Actions on this case' })).not.toBeInTheDocument();
  });

  it('explains why a marginal case can only be cleared with conditions', async () => {
    signIn(REVIEWER);
    serve(REVIEWER, inReview({ overall: 'marginal', allowedActions: ['send-back', 'clear-with-conditions', 'reject', 'withdraw'] }));
    renderApp('/qualifications/7');
    expect(await actions()).toEqual(['Clear with conditions', 'Reject', 'Send back to draft']);
    expect(screen.getByText(/it can be cleared only with written conditions/)).toBeInTheDocument();
  });

  it('offers revoke and re-check on a cleared case, and shows who decided on which versions', async () => {
    signIn(PREPARER);
    serve(
      PREPARER,
      caseFixture({
        state: 'cleared',
        decision: {
          state: 'cleared',
          by: { id: 3, name: 'Tomas Eklund' },
          at: '2026-11-21T10:00:00.000Z',
          specVersion: 1,
          cardVersion: 1,
          text: 'Equivalent on every check.',
        },
        allowedActions: ['revoke', 'recheck'],
      }),
    );
    renderApp('/qualifications/7');
    expect(await actions()).toEqual(['Revoke', 'Open a re-check']);
    const panel = screen.getByRole('region', { name: 'Sign-off' });
    expect(panel).toHaveTextContent('Tomas Eklund, 21 Nov 2026');
    expect(panel).toHaveTextContent('spec v1, card v1');
    expect(panel).toHaveTextContent('Equivalent on every check.');
    expect(panel).toHaveTextContent(/Decided cases are fixed/);
  });

  it('needs written conditions before a clearance with conditions is sent, then sends them with the version seen', async () => {
    signIn(REVIEWER);
    const decided = inReview({ state: 'cleared-with-conditions', version: 3, allowedActions: ['revoke', 'recheck'] });
    const api = serve(REVIEWER, inReview({ overall: 'marginal', allowedActions: ['send-back', 'clear-with-conditions', 'reject', 'withdraw'] }), {
      'POST /api/qualifications/:id/clear-with-conditions': { body: decided },
    });
    const { user } = renderApp('/qualifications/7');
    await user.click(await screen.findByRole('button', { name: 'Clear with conditions' }));
    const dialog = await screen.findByRole('dialog');
    await user.type(within(dialog).getByLabelText(/Conditions/), '   ');
    await user.click(within(dialog).getByRole('button', { name: 'Clear with conditions' }));
    expect(await within(dialog).findByText('Write the conditions')).toBeInTheDocument();
    expect(api.callsTo('POST', '/api/qualifications/7/clear-with-conditions')).toHaveLength(0);

    await user.clear(within(dialog).getByLabelText(/Conditions/));
    await user.type(within(dialog).getByLabelText(/Conditions/), 'Incoming test of leakage at 7.7 V on five pieces per lot');
    await user.click(within(dialog).getByRole('button', { name: 'Clear with conditions' }));
    await waitFor(() => expect(api.callsTo('POST', '/api/qualifications/7/clear-with-conditions')).toHaveLength(1));
    expect(api.callsTo('POST', '/api/qualifications/7/clear-with-conditions')[0].body).toEqual({
      version: 2,
      conditions: 'Incoming test of leakage at 7.7 V on five pieces per lot',
    });
    // The answer is the case as it is now: decided, with the next actions.
    expect(await actions()).toEqual(['Revoke', 'Open a re-check']);
  });

  it('opens a re-check of a flagged decision and goes to the new revision, linked to the old one', async () => {
    signIn(REVIEWER);
    const flagged = caseFixture({
      state: 'cleared',
      needsRecheck: true,
      recheckReasons: [{ cause: 'card-changed', at: '2026-12-01T08:00:00.000Z', detail: 'rating card version 2 (changed: zzk)' }],
      current: { specVersion: 1, cardVersion: 2 },
      allowedActions: ['revoke', 'recheck'],
    });
    const next = caseFixture({
      id: 15,
      revision: 2,
      previousId: 7,
      state: 'draft',
      cardVersion: 2,
      current: { specVersion: 1, cardVersion: 2 },
      allowedActions: ['evaluate', 'submit', 'withdraw'],
    });
    const api = mockApi({
      'GET /api/auth/me': { body: REVIEWER },
      'GET /api/qualifications/:id': (_call, { id }) => ({ body: id === '15' ? next : flagged }),
      'POST /api/qualifications/:id/recheck': { status: 201, body: next },
    });
    const { user } = renderApp('/qualifications/7');
    const flag = (await screen.findByText('Needs a re-check')).closest<HTMLElement>('[role="alert"]')!;
    expect(flag).toHaveTextContent('Needs a re-check');
    expect(flag).toHaveTextContent('the rating card changed — rating card version 2 (changed: zzk)');
    await user.click(screen.getByRole('button', { name: 'Open a re-check' }));
    const dialog = await screen.findByRole('dialog');
    expect(dialog).toHaveTextContent('Opens revision 2');
    await user.click(within(dialog).getByRole('button', { name: 'Open a re-check' }));
    await waitFor(() => expect(currentLocation()).toBe('/qualifications/15'));
    // A re-check sends no version: it never changes the decided case, it opens a new one.
    expect(api.callsTo('POST', '/api/qualifications/7/recheck')[0].body).toEqual({ note: null });
    expect(await screen.findByRole('link', { name: '← previous: case #7' })).toHaveAttribute('href', '/qualifications/7');
    expect(screen.getByText('Revision 2')).toBeInTheDocument();
  });

  it('needs a reason to revoke a clearance', async () => {
    signIn(REVIEWER);
    const api = serve(REVIEWER, caseFixture({ state: 'cleared', allowedActions: ['revoke', 'recheck'] }), {
      'POST /api/qualifications/:id/revoke': { body: caseFixture({ state: 'revoked' }) },
    });
    const { user } = renderApp('/qualifications/7');
    await user.click(await screen.findByRole('button', { name: 'Revoke' }));
    const dialog = await screen.findByRole('dialog');
    await user.click(within(dialog).getByRole('button', { name: 'Revoke' }));
    expect(await within(dialog).findByText('Write the reason for revoking the clearance')).toBeInTheDocument();
    expect(api.callsTo('POST', '/api/qualifications/7/revoke')).toHaveLength(0);
  });

  it('explains a 409 (someone decided first) plainly, keeps the text, and reloads the case on request', async () => {
    signIn(REVIEWER);
    let gets = 0;
    const api = mockApi({
      'GET /api/auth/me': { body: REVIEWER },
      'GET /api/qualifications/:id': () => {
        gets += 1;
        return { body: gets === 1 ? inReview() : inReview({ state: 'rejected', version: 3, allowedActions: ['recheck'] }) };
      },
      'POST /api/qualifications/:id/clear': {
        status: 409,
        body: errorBody('Case #7 changed after you loaded it (you saw version 2, it is now 3); reload and try again'),
      },
    });
    const { user } = renderApp('/qualifications/7');
    await user.click(await screen.findByRole('button', { name: 'Clear' }));
    const dialog = await screen.findByRole('dialog');
    await user.type(within(dialog).getByLabelText('Note'), 'Checked against the datasheet');
    await user.click(within(dialog).getByRole('button', { name: 'Clear' }));
    const alert = await within(dialog).findByRole('alert');
    expect(alert).toHaveTextContent('The case changed before your action arrived');
    expect(alert).toHaveTextContent(/Someone else decided or changed it first/);
    expect(alert).toHaveTextContent('you saw version 2, it is now 3');
    expect(within(dialog).getByLabelText('Note')).toHaveValue('Checked against the datasheet');

    await user.click(within(alert).getByRole('button', { name: 'Reload the case' }));
    await waitFor(() => expect(api.callsTo('GET', '/api/qualifications/7')).toHaveLength(2));
    expect(await actions()).toEqual(['Open a re-check']);
    expect(screen.getAllByText('Rejected').length).toBeGreaterThan(0);
  });
});
