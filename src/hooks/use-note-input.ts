import { useEffect, useState } from 'react';
import { type InputStatus, NoteInput } from '@/lib/midi-input';

let shared: NoteInput | null = null;

/** The page-wide note input (one per tab, so a device is opened once), started on first use. */
export function getNoteInput(): NoteInput {
  shared ??= new NoteInput();
  return shared;
}

export function useNoteInput() {
  const input = getNoteInput();
  const [status, setStatus] = useState<InputStatus>(input.getStatus());
  useEffect(() => {
    const off = input.onStatus(setStatus);
    void input.start();
    return () => {
      off();
    };
  }, [input]);

  // The computer keyboard plays while no text field has the focus.
  useEffect(() => {
    const handler = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      if (t && (t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.tagName === 'SELECT' || t.isContentEditable))
        return;
      if (e.metaKey || e.ctrlKey || e.altKey) return;
      if (input.computerKey(e)) e.preventDefault();
    };
    window.addEventListener('keydown', handler);
    window.addEventListener('keyup', handler);
    return () => {
      window.removeEventListener('keydown', handler);
      window.removeEventListener('keyup', handler);
    };
  }, [input]);

  return { input, status };
}
