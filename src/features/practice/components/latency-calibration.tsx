import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { getNoteInput } from '@/hooks/use-note-input';
import { medianLatency } from '../lib/latency';
import { playClicks } from '../lib/practice-audio';

const TEMPO = 90;
const LEAD_CLICKS = 4;
const TAP_CLICKS = 8;

/**
 * Tap along with 8 clicks (after 4 to get the feel) on the device you practise with; the median
 * offset is stored for that device and taken off its note times before scoring.
 */
export function LatencyCalibration({
  device,
  current,
  volumeDb,
  onMeasured,
}: {
  device: string;
  current: number | undefined;
  volumeDb: number;
  onMeasured: (offsetMs: number) => void;
}) {
  const [state, setState] = useState<'idle' | 'running' | 'done' | 'failed'>('idle');
  const [result, setResult] = useState<number | null>(null);
  const off = useRef<(() => void) | null>(null);
  useEffect(() => () => off.current?.(), []);

  const run = () => {
    const beat = 60000 / TEMPO;
    const first = performance.now() + 400;
    const all = Array.from({ length: LEAD_CLICKS + TAP_CLICKS }, (_, i) => first + i * beat);
    const counted = all.slice(LEAD_CLICKS);
    const taps: number[] = [];
    off.current?.();
    off.current = getNoteInput().onNote((e) => {
      if (e.type === 'on') taps.push(e.timeStamp);
    });
    setState('running');
    void playClicks(all, volumeDb).catch(() => undefined);
    setTimeout(
      () => {
        off.current?.();
        off.current = null;
        const offset = medianLatency(counted, taps, beat);
        setResult(offset);
        if (offset === null) setState('failed');
        else {
          setState('done');
          onMeasured(offset);
        }
      },
      all.at(-1)! - performance.now() + beat,
    );
  };

  return (
    <section aria-labelledby="latency-heading" className="rounded-card border border-line bg-raised p-4">
      <h2 id="latency-heading" className="text-lead font-bold">
        Latency
      </h2>
      <p className="mt-1 text-muted">
        {device}: {current === undefined ? 'not measured yet' : `${current.toFixed(1)} ms taken off every note`}.
      </p>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <Button variant="quiet" onClick={run} disabled={state === 'running'}>
          {state === 'running' ? 'Listening… tap with the clicks' : 'Measure by tapping'}
        </Button>
        <p role="status" className="text-body">
          {state === 'running' && `Four clicks to get the feel, then play any note on every click, eight times.`}
          {state === 'done' && result !== null && `Measured ${result.toFixed(1)} ms; saved for ${device}.`}
          {state === 'failed' && 'Not enough taps landed near the clicks. Try again, one note per click.'}
        </p>
      </div>
    </section>
  );
}
