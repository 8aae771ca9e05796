import { screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { render } from '@/testing/render';
import { PageErrorBoundary } from './page-error-boundary';

function Page({ broken }: { broken: boolean }) {
  if (broken) throw new Error('Failed to fetch dynamically imported module');
  return <p>All well</p>;
}

describe('PageErrorBoundary', () => {
  it('shows what failed with a way out, and clears when the path changes', () => {
    vi.spyOn(console, 'error').mockImplementation(() => {});
    const { rerender } = render(
      <PageErrorBoundary resetKey="/broken">
        <Page broken />
      </PageErrorBoundary>,
    );
    const alert = screen.getByRole('alert');
    expect(alert).toHaveTextContent('This page could not be shown');
    expect(alert).toHaveTextContent('Failed to fetch dynamically imported module');
    expect(screen.getByRole('button', { name: 'Reload' })).toBeInTheDocument();

    // Same path: the error stays (the page would only throw again).
    rerender(
      <PageErrorBoundary resetKey="/broken">
        <Page broken={false} />
      </PageErrorBoundary>,
    );
    expect(screen.getByRole('alert')).toBeInTheDocument();

    rerender(
      <PageErrorBoundary resetKey="/fine">
        <Page broken={false} />
      </PageErrorBoundary>,
    );
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
    expect(screen.getByText('All well')).toBeInTheDocument();
  });
});
