import type { Drill } from '@shared/engine';
import { useSyncExternalStore } from 'react';
import type { LiveMark } from './take-session';

/**
 * The marks and the current note of a running take, kept outside React state so that a note
 * re-renders only the staff and the keyboard that show it, never the whole practice page.
 */
export class LiveMarks {
  marks: ReadonlyMap<number, LiveMark> = new Map();
  current: number | null = null;
  /** the drill the marks belong to: a staff showing another drill (the next ladder step) shows none */
  drill: Drill | null = null;
  private version = 0;
  private listeners = new Set<() => void>();

  subscribe = (fn: () => void) => {
    this.listeners.add(fn);
    return () => {
      this.listeners.delete(fn);
    };
  };

  getVersion = () => this.version;

  replace(marks: ReadonlyMap<number, LiveMark>) {
    this.marks = marks;
    this.emit();
  }

  setCurrent(current: number | null) {
    if (current === this.current) return;
    this.current = current;
    this.emit();
  }

  /** Clears the marks; a take on `drill` starts marking it. */
  reset(drill: Drill | null = null) {
    this.marks = new Map();
    this.current = null;
    this.drill = drill;
    this.emit();
  }

  private emit() {
    this.version += 1;
    for (const fn of this.listeners) fn();
  }
}

const NONE: ReadonlyMap<number, LiveMark> = new Map();

/**
 * Re-renders the calling component (only) when the take's marks or current note change. A
 * component showing a drill other than the one marked (a new ladder step, a changed tempo)
 * gets clean marks.
 */
export function useLiveMarks(store: LiveMarks, drill: Drill) {
  useSyncExternalStore(store.subscribe, store.getVersion);
  if (store.drill !== drill) return { marks: NONE, current: null };
  return { marks: store.marks, current: store.current };
}
