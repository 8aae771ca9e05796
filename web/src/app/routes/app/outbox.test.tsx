import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { CapturedMail } from '@shuntwise/contracts';
import { mockApi } from '@/testing/mock-api';
import { DEMO_USERS, renderApp, signInAs } from '@/testing/render';

const mails: CapturedMail[] = [
  {
    id: 1,
    from: 'Shuntwise <no-reply@shuntwise.test>',
    to: ['oskar@demo.test'],
    subject: 'You are invited to Shuntwise',
    text: 'Hello Oskar,\n\nset your password here: http://127.0.0.1:8080/invitation/abcdefghijklmnopqrstuvwx\n\nThe link works once.',
    receivedAt: '2026-11-30T10:00:00.000Z',
  },
  {
    id: 2,
    from: 'Shuntwise <no-reply@shuntwise.test>',
    to: ['buyer@demo.test', 'purchasing@demo.test'],
    subject: 'Source cleared: HP-1047',
    text: 'A second source was cleared.',
    receivedAt: '2026-12-01T09:30:00.000Z',
  },
];

describe('Outbox screen', () => {
  it('shows captured mail newest first with recipients, subject and body', async () => {
    signInAs('admin');
    mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.admin }, 'GET /api/outbox': { body: mails } });
    renderApp('/outbox');
    const articles = await screen.findAllByRole('article');
    expect(articles.map((a) => a.getAttribute('aria-label'))).toEqual(['Source cleared: HP-1047', 'You are invited to Shuntwise']);
    expect(within(articles[0]).getByText('buyer@demo.test, purchasing@demo.test')).toBeInTheDocument();
    const link = within(articles[1]).getByRole('link', { name: /\/invitation\// });
    expect(link).toHaveAttribute('href', 'http://127.0.0.1:8080/invitation/abcdefghijklmnopqrstuvwx');
    expect(articles[1]).toHaveTextContent('The link works once.');
  });

  it('says when nothing was captured', async () => {
    signInAs('admin');
    mockApi({ 'GET /api/auth/me': { body: DEMO_USERS.admin }, 'GET /api/outbox': { body: [] } });
    renderApp('/outbox');
    expect(await screen.findByText(/No mail captured yet/)).toBeInTheDocument();
  });
});
