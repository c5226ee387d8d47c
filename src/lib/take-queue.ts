import { createStore, del, entries, set } from 'idb-keyval';
import type { CreateTakeInput, TakeResponse } from '@shared/schemas/takes';
import { ApiError, api } from './api-client';

/**
 * Nothing played is lost: a finished take goes into IndexedDB first, then to the server. When
 * the server can't be reached the take waits and is retried with backoff, and on the next
 * visit; the take's own id makes every retry safe (the server stores it once).
 */
interface Pending {
  take: CreateTakeInput;
  attempts: number;
  nextAt: number;
  /** set when the server refused the take for good (it stays, so nothing is thrown away) */
  refused?: string;
}

const store = typeof indexedDB === 'undefined' ? undefined : createStore('sixfold-takes', 'pending');
const listeners = new Set<(s: QueueState) => void>();
let timer: ReturnType<typeof setTimeout> | null = null;
let flushing: Promise<void> | null = null;
let state: QueueState = { waiting: 0, refused: [], busy: false };
/** the last try met a busy server (503: its database was out of reach) */
let busy = false;

export interface QueueState {
  waiting: number;
  refused: Array<{ id: string; message: string }>;
  /** the server answered "busy" (503) to the last try: the takes wait here and are sent later */
  busy: boolean;
}

/** What the page says while the server is busy. */
export const BUSY_MESSAGE = 'The server is busy, your take is kept and will be sent';

const MAX_DELAY_MS = 60_000;
export const backoffMs = (attempts: number) => Math.min(MAX_DELAY_MS, 1000 * 2 ** Math.max(0, attempts - 1));

export function onQueueChange(fn: (s: QueueState) => void): () => void {
  listeners.add(fn);
  fn(state);
  return () => listeners.delete(fn);
}

async function all(): Promise<Array<[string, Pending]>> {
  return (await entries<string, Pending>(store)) ?? [];
}

async function publish() {
  const items = await all();
  const waiting = items.filter(([, p]) => !p.refused).length;
  state = {
    waiting,
    busy: busy && waiting > 0,
    refused: items.filter(([, p]) => p.refused).map(([id, p]) => ({ id, message: p.refused ?? '' })),
  };
  for (const fn of listeners) fn(state);
}

/** Keeps the take on this device, then tries to send it (and anything else waiting). */
export async function saveTake(take: CreateTakeInput): Promise<void> {
  await set(take.id, { take, attempts: 0, nextAt: 0 } satisfies Pending, store);
  await publish();
  await flushTakes();
}

/** Sends every waiting take whose retry time has come; schedules the next try. */
export function flushTakes(): Promise<void> {
  flushing ??= doFlush().finally(() => {
    flushing = null;
  });
  return flushing;
}

async function doFlush() {
  if (timer) clearTimeout(timer);
  timer = null;
  const now = Date.now();
  for (const [id, p] of await all()) {
    if (p.refused || p.nextAt > now) continue;
    try {
      await api.post<TakeResponse>('/api/takes', p.take);
      await del(id, store);
      busy = false;
    } catch (err) {
      busy = err instanceof ApiError && err.status === 503;
      const permanent =
        err instanceof ApiError && err.status >= 400 && err.status < 500 && ![401, 403, 408, 429].includes(err.status);
      const attempts = p.attempts + 1;
      await set(
        id,
        permanent
          ? { ...p, attempts, refused: err.message }
          : { ...p, attempts, nextAt: Date.now() + backoffMs(attempts) },
        store,
      );
    }
  }
  await publish();
  const next = (await all()).filter(([, p]) => !p.refused).map(([, p]) => p.nextAt);
  if (next.length > 0) {
    const wait = Math.max(250, Math.min(...next) - Date.now());
    timer = setTimeout(() => void flushTakes(), wait);
  }
}

/** Call once when the app starts: sends what an earlier visit left, and retries when back online. */
export function startTakeSync() {
  if (!store) return;
  window.addEventListener('online', () => {
    void all().then(async (items) => {
      for (const [id, p] of items) if (!p.refused) await set(id, { ...p, nextAt: 0 }, store);
      await flushTakes();
    });
  });
  void flushTakes();
}

/** Drops a refused take once the player has read why (the only way a take leaves unsent). */
export async function dismissRefused(id: string) {
  await del(id, store);
  await publish();
}
