import { act, fireEvent, render, screen } from '@testing-library/react';
import { MemoryRouter, Link, Route, Routes } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { useLeaveGuard } from './leave-guard';

function Editor({ dirty }: { dirty: boolean }) {
  useLeaveGuard(dirty);
  return (
    <>
      <p>editor</p>
      <Link to="/elsewhere">Board</Link>
    </>
  );
}

function App({ dirty }: { dirty: boolean }) {
  return (
    <MemoryRouter initialEntries={['/card']}>
      <Routes>
        <Route path="/card" element={<Editor dirty={dirty} />} />
        <Route path="/elsewhere" element={<p>elsewhere</p>} />
      </Routes>
    </MemoryRouter>
  );
}

describe('useLeaveGuard', () => {
  afterEach(() => vi.restoreAllMocks());

  it('asks before an in-app link leaves unsaved work; staying keeps the page', () => {
    const confirm = vi.spyOn(window, 'confirm').mockReturnValue(false);
    render(<App dirty />);
    fireEvent.click(screen.getByRole('link', { name: 'Board' }));
    expect(confirm).toHaveBeenCalledWith(expect.stringMatching(/unsaved changes/));
    expect(screen.getByText('editor')).toBeInTheDocument();
    confirm.mockReturnValue(true);
    fireEvent.click(screen.getByRole('link', { name: 'Board' }));
    expect(screen.getByText('elsewhere')).toBeInTheDocument();
  });

  it('lets a clean page go without asking, and asks the browser before closing a dirty one', () => {
    const confirm = vi.spyOn(window, 'confirm');
    const { unmount } = render(<App dirty={false} />);
    const clean = new Event('beforeunload', { cancelable: true });
    act(() => void window.dispatchEvent(clean));
    expect(clean.defaultPrevented).toBe(false);
    fireEvent.click(screen.getByRole('link', { name: 'Board' }));
    expect(confirm).not.toHaveBeenCalled();
    expect(screen.getByText('elsewhere')).toBeInTheDocument();
    unmount();

    render(<App dirty />);
    const dirty = new Event('beforeunload', { cancelable: true });
    act(() => void window.dispatchEvent(dirty));
    expect(dirty.defaultPrevented).toBe(true);
  });
});
