import '@testing-library/jest-dom/vitest';
import { cleanup, configure } from '@testing-library/react';
import { afterEach, vi } from 'vitest';
import { resetSession } from '@/lib/session';

// The data grid renders slowly in jsdom on a 2-core machine; a second is too tight.
configure({ asyncUtilTimeout: 10_000 });

// jsdom lacks what Mantine measures with (as in Mantine's own Vite template).
const { getComputedStyle } = window;
window.getComputedStyle = (element: Element) => getComputedStyle(element);
HTMLElement.prototype.scrollIntoView = () => {};

Object.defineProperty(window, 'matchMedia', {
  writable: true,
  value: vi.fn().mockImplementation((query: string) => ({
    matches: false,
    media: query,
    onchange: null,
    addListener: vi.fn(),
    removeListener: vi.fn(),
    addEventListener: vi.fn(),
    removeEventListener: vi.fn(),
    dispatchEvent: vi.fn(),
  })),
});

class ResizeObserver {
  observe() {}
  unobserve() {}
  disconnect() {}
}
window.ResizeObserver = ResizeObserver;

afterEach(() => {
  cleanup();
  resetSession();
  localStorage.clear();
  vi.unstubAllGlobals();
});
