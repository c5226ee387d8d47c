import type { Drill } from '@shared/engine';
import { useSyncExternalStore } from 'react';
import type { MarkSource } from '@/components/notation/marks';
import type { LiveMark } from './take-session';

const NONE: ReadonlyMap<number, LiveMark> = new Map();

/**
 * The marks and the current note of a running take, kept outside React state. The staff paints
 * them itself when they change (a painter, called first); the keyboard re-renders only when
 * the current note moves; the rest of the practice page never does.
 */
export class LiveMarks implements MarkSource {
  marks: ReadonlyMap<number, LiveMark> = new Map();
  current: number | null = null;
  /** the drill the marks belong to: a staff showing another drill (the next ladder step) shows none */
  drill: Drill | null = null;
  private version = 0;
  private listeners = new Set<() => void>();
  private painters = new Set<() => void>();

  subscribe = (fn: () => void) => {
    this.listeners.add(fn);
    return () => {
      this.listeners.delete(fn);
    };
  };

  subscribePaint = (paint: () => void) => {
    this.painters.add(paint);
    return () => {
      this.painters.delete(paint);
    };
  };

  marksFor(drill: unknown) {
    if (this.drill !== drill) return { marks: NONE, current: null };
    return { marks: this.marks, current: this.current };
  }

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
    for (const paint of this.painters) paint();
    for (const fn of this.listeners) fn();
  }
}

/**
 * The note due now, for a component that shows only that (the keyboard): it re-renders when
 * the current note moves, not on every mark. A component showing a drill other than the one
 * marked (a new ladder step, a changed tempo) gets none.
 */
export function useLiveCurrent(store: LiveMarks, drill: Drill): number | null {
  return useSyncExternalStore(store.subscribe, () => (store.drill === drill ? store.current : null));
}
