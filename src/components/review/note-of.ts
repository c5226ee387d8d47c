/**
 * The note index of a drawn note a click landed on, if any: the staff marks each note's
 * element with its index (data-note-index, or data-index).
 */
export function noteOf(target: EventTarget, then: (index: number) => void) {
  const el = target instanceof Element ? target.closest('[data-note-index],[data-index]') : null;
  const raw = el?.getAttribute('data-note-index') ?? el?.getAttribute('data-index');
  if (raw !== null && raw !== undefined && /^\d+$/.test(raw)) then(Number(raw));
}
