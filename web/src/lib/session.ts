import { useSyncExternalStore } from 'react';
import { loginResponseSchema, type LoginResponse } from '@shuntwise/contracts';

/** What a signed-in browser keeps: the token and who it belongs to (the login answer). */
export type Session = LoginResponse;

/** Why the last session ended; the sign-in page words its notice from it. */
export type SessionEndReason = 'signed-out' | 'expired';

export const SESSION_STORAGE_KEY = 'shuntwise.session';

type Listener = () => void;
const listeners = new Set<Listener>();

let current: Session | null = readStored();
let lastEndReason: SessionEndReason | null = null;

function readStored(): Session | null {
  try {
    const raw = globalThis.localStorage?.getItem(SESSION_STORAGE_KEY);
    if (!raw) return null;
    const parsed = loginResponseSchema.safeParse(JSON.parse(raw));
    if (parsed.success) return parsed.data;
    // A stored value of another shape (older build, hand edit) is useless: drop it.
    globalThis.localStorage.removeItem(SESSION_STORAGE_KEY);
  } catch {
    // Storage blocked or not JSON: behave as signed out.
  }
  return null;
}

function emit() {
  for (const listener of listeners) listener();
}

export function getSession(): Session | null {
  return current;
}

export function getSessionEndReason(): SessionEndReason | null {
  return lastEndReason;
}

export function setSession(session: Session): void {
  current = session;
  lastEndReason = null;
  try {
    localStorage.setItem(SESSION_STORAGE_KEY, JSON.stringify(session));
  } catch {
    // Private mode may refuse storage; the session then lasts for this tab only.
  }
  emit();
}

/** Updates the stored user (after `/auth/me` reports a new name or role) and keeps the token. */
export function updateSessionUser(user: Session['user']): void {
  if (!current) return;
  const same = current.user.id === user.id && current.user.email === user.email && current.user.name === user.name && current.user.role === user.role;
  if (!same) setSession({ ...current, user });
}

export function clearSession(reason: SessionEndReason): void {
  const had = current !== null;
  current = null;
  lastEndReason = reason;
  try {
    localStorage.removeItem(SESSION_STORAGE_KEY);
  } catch {
    // nothing stored to remove
  }
  if (had) emit();
}

export function subscribeSession(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Re-reads storage after another tab changed it. */
export function reloadSession(): void {
  const next = readStored();
  if (next?.accessToken !== current?.accessToken) {
    // Signed out in another tab: this tab goes to sign-in too, keeping its page.
    if (!next && current) lastEndReason = 'expired';
    current = next;
    emit();
  }
}

/** A fresh start: no session and no memory of how the last one ended (tests use it). */
export function resetSession(): void {
  current = null;
  lastEndReason = null;
  try {
    localStorage.removeItem(SESSION_STORAGE_KEY);
  } catch {
    // nothing stored
  }
  emit();
}

// Signing out in one tab signs out the others (the `storage` event fires in the other tabs only).
if (typeof window !== 'undefined') {
  window.addEventListener('storage', (event) => {
    if (event.key === SESSION_STORAGE_KEY || event.key === null) reloadSession();
  });
}

export function useSession(): Session | null {
  return useSyncExternalStore(subscribeSession, getSession, getSession);
}
