import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Role } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { DEMO_USERS, renderApp, signInAs } from '@/testing/render';

// Every list screen with the API unreachable (fetch itself fails, as with the server down):
// the error is shown and nothing claims the list is empty.
const UNREACHABLE = /Cannot reach the Shuntwise server/;
// What the screens say of an empty list (and the table's own default), word for word.
const EMPTY_CLAIMS = [
  'No house parts yet',
  'No house part matches',
  'No vendor parts yet',
  'No vendor part matches',
  'No qualification case yet',
  'No case matches',
  'No usable part matches',
  'No catalogue part matches',
  'No house part yet',
  'No source matches',
  'You follow no house part yet',
  'No mail captured yet',
  'No records to display',
];

const SCREENS: Array<[string, Role]> = [
  ['/house-parts', 'engineer'],
  ['/vendor-parts', 'engineer'],
  ['/qualifications', 'engineer'],
  ['/board', 'engineer'],
  ['/sources', 'buyer'],
  ['/find', 'designer'],
  ['/outbox', 'admin'],
];

describe('screens with the API unreachable', () => {
  it.each(SCREENS)('%s shows the error only, no empty state', { timeout: 20_000 }, async (path, role) => {
    signInAs(role);
    mockApi({
      'GET /api/auth/me': { body: DEMO_USERS[role] },
      // Anything else: the network request itself fails.
      'GET /api/:a': () => Promise.reject(new TypeError('Failed to fetch')),
      'GET /api/:a/:b': () => Promise.reject(new TypeError('Failed to fetch')),
    });
    renderApp(path);
    expect((await screen.findAllByText(UNREACHABLE, undefined, { timeout: 10_000 })).length).toBeGreaterThan(0);
    // Retries may still be under way: give the screen its settled look before reading it.
    await waitFor(() => expect(screen.queryAllByRole('progressbar')).toHaveLength(0));
    const text = document.body.textContent ?? '';
    expect(EMPTY_CLAIMS.filter((claim) => text.includes(claim))).toEqual([]);
  });
});
