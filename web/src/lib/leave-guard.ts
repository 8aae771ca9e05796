import { useEffect } from 'react';

/**
 * Asks before unsaved work is left behind. React Router runs here in declarative mode
 * (no data router, so no `useBlocker`): the guard listens to what leaves the page itself —
 * a click on an in-app link (caught in the capture phase, before the router's own
 * handler) and closing or reloading the tab (`beforeunload`, the browser's own question).
 */
export function useLeaveGuard(active: boolean, question = 'You have unsaved changes. Leave this page and lose them?'): void {
  useEffect(() => {
    if (!active) return;
    const onClick = (event: MouseEvent) => {
      if (event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return;
      const link = (event.target as Element | null)?.closest?.('a[href]') as HTMLAnchorElement | null;
      if (!link || (link.target && link.target !== '_self') || link.hasAttribute('download')) return;
      const to = new URL(link.href, window.location.href);
      if (to.origin !== window.location.origin) return;
      if (to.pathname === window.location.pathname && to.search === window.location.search) return;
      if (!window.confirm(question)) {
        event.preventDefault();
        event.stopPropagation();
      }
    };
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      // Older browsers ask only when a return value is set.
      event.returnValue = '';
    };
    document.addEventListener('click', onClick, true);
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => {
      document.removeEventListener('click', onClick, true);
      window.removeEventListener('beforeunload', onBeforeUnload);
    };
  }, [active, question]);
}
