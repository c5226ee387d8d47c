import type { ScoreUpdate } from '@shared/engine';
import { useSyncExternalStore } from 'react';
import { markClass } from './take-session';

/**
 * The marks and the current note of a running take, kept outside React state so that a note
 * re-renders only the staff and the keyboard that show it, never the whole practice page.
 */
export class LiveMarks {
  marks: ReadonlyMap<number, string> = new Map();
  current: number | null = null;
  private version = 0;
  private listeners = new Set<() => void>();

  subscribe = (fn: () => void) => {
    this.listeners.add(fn);
    return () => {
      this.listeners.delete(fn);
    };
  };

  getVersion = () => this.version;

  apply(updates: ScoreUpdate[]) {
    if (updates.length === 0) return;
    const next = new Map(this.marks);
    for (const u of updates) next.set(u.index, markClass({ result: u.result, settled: u.settled }));
    this.marks = next;
    this.emit();
  }

  replace(marks: ReadonlyMap<number, string>) {
    this.marks = marks;
    this.emit();
  }

  setCurrent(current: number | null) {
    if (current === this.current) return;
    this.current = current;
    this.emit();
  }

  reset() {
    this.marks = new Map();
    this.current = null;
    this.emit();
  }

  private emit() {
    this.version += 1;
    for (const fn of this.listeners) fn();
  }
}

/** Re-renders the calling component (only) when the take's marks or current note change. */
export function useLiveMarks(store: LiveMarks) {
  useSyncExternalStore(store.subscribe, store.getVersion);
  return { marks: store.marks, current: store.current };
}
