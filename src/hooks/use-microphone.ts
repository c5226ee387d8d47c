import { useEffect, useState } from 'react';
import { MicInput, type MicStatus } from '@/lib/mic-input';
import { getNoteInput } from './use-note-input';

let shared: MicInput | null = null;

/** The page-wide microphone input (one per tab), feeding the page-wide note input. */
export function getMicInput(): MicInput {
  shared ??= new MicInput(getNoteInput());
  return shared;
}

/** The microphone and its status; it starts only when the player picks it. */
export function useMicrophone() {
  const mic = getMicInput();
  const [status, setStatus] = useState<MicStatus>(mic.getStatus());
  useEffect(() => mic.onStatus(setStatus), [mic]);
  return { mic, status, on: status.state === 'listening' || status.state === 'starting' };
}
