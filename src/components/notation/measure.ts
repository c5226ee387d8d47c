/**
 * One staff of one measure as VexFlow objects, built from the notation model exactly as given:
 * its notes and rests, the printed accidentals only, one stem direction per beam group, beams
 * and triplet brackets by the model's ids. Invisible notes hold the time of a gap, if any.
 */
import type { Clef, Meter, NotatedEvent } from '@shared/engine';
import { Accidental, Beam, Dot, GhostNote, StaveNote, Stem, type Tickable, Tuplet, Voice } from 'vexflow/core';
import {
  diatonicStep,
  middleLineStep,
  printedOctave,
  printedValue,
  restKey,
  wholeRestKey,
  splitGap,
  vexClef,
  vexKey,
} from './pitch';

export interface DrawnEvent {
  event: NotatedEvent;
  note: StaveNote;
}

export interface BuiltStaffMeasure {
  voice: Voice;
  notes: DrawnEvent[];
  rests: DrawnEvent[];
  beams: Beam[];
  tuplets: Tuplet[];
}

const EPS = 1e-6;

/**
 * Stem direction for a set of notes on one staff (common practice): the note farthest from the
 * middle line decides; above it (or an even pull) the stems go down, below it up.
 */
export function stemDirectionFor(events: NotatedEvent[], clef: Clef): number {
  const mid = middleLineStep(clef);
  let far = 0;
  for (const e of events) {
    const d = diatonicStep(printedOctave(e.written, e.ottava)) - mid;
    if (Math.abs(d) > Math.abs(far) || (Math.abs(d) === Math.abs(far) && d > 0)) far = d;
  }
  return far >= 0 ? Stem.DOWN : Stem.UP;
}

function duration(e: NotatedEvent): { code: string; dots: number } {
  // A value the model should never give is drawn as an eighth rather than breaking the page.
  return printedValue(e.duration, e.tuplet !== undefined) ?? { code: '8', dots: 0 };
}

function ghosts(quarters: number): Tickable[] {
  return splitGap(quarters).map(({ code }) => new GhostNote({ duration: code }));
}

export function buildStaffMeasure(events: NotatedEvent[], clef: Clef, meter: Meter): BuiltStaffMeasure {
  const measureQuarters = (meter[0] * 4) / meter[1];
  const sorted = [...events].sort((a, b) => a.start - b.start);
  const vclef = vexClef(clef);

  const groupDirection = new Map<number, number>();
  const byBeam = new Map<number, NotatedEvent[]>();
  for (const e of sorted) {
    if (e.kind !== 'note' || e.beam === undefined) continue;
    byBeam.set(e.beam, [...(byBeam.get(e.beam) ?? []), e]);
  }
  for (const [id, group] of byBeam) groupDirection.set(id, stemDirectionFor(group, clef));

  const tickables: Tickable[] = [];
  const notes: DrawnEvent[] = [];
  const rests: DrawnEvent[] = [];
  const tupletNotes = new Map<number, StaveNote[]>();
  const beamNotes = new Map<number, StaveNote[]>();
  let t = 0;
  for (const e of sorted) {
    if (e.start > t + EPS) tickables.push(...ghosts(e.start - t));
    const { code, dots } = duration(e);
    const dur = `${code}${'d'.repeat(dots)}`;
    let note: StaveNote;
    if (e.kind === 'rest') {
      // A rest that fills the bar is printed in the middle of it (common practice).
      const wholeBar = Math.abs(e.duration - measureQuarters) < EPS;
      const whole = code === 'w';
      note = new StaveNote({
        keys: [whole ? wholeRestKey(clef) : restKey(clef)],
        duration: `${dur}r`,
        clef: vclef,
        alignCenter: wholeBar,
      });
      rests.push({ event: e, note });
    } else {
      // The model's own stem when it gives one; else one direction per beam group by the same rule.
      const stemDirection = e.stem
        ? e.stem === 'up'
          ? Stem.UP
          : Stem.DOWN
        : e.beam !== undefined && groupDirection.has(e.beam)
          ? groupDirection.get(e.beam)!
          : stemDirectionFor([e], clef);
      note = new StaveNote({
        keys: [vexKey(printedOctave(e.written, e.ottava))],
        duration: dur,
        clef: vclef,
        stemDirection,
        autoStem: false,
      });
      if (e.accidental) note.addModifier(new Accidental(e.accidental), 0);
      notes.push({ event: e, note });
      // Only flagged values take a beam.
      if (e.beam !== undefined && /^(8|16|32)$/.test(code))
        beamNotes.set(e.beam, [...(beamNotes.get(e.beam) ?? []), note]);
    }
    if (dots > 0) Dot.buildAndAttach([note], { all: true });
    if (e.tuplet !== undefined) tupletNotes.set(e.tuplet, [...(tupletNotes.get(e.tuplet) ?? []), note]);
    tickables.push(note);
    t = Math.max(t, e.start + e.duration);
  }
  if (t + EPS < measureQuarters) tickables.push(...ghosts(measureQuarters - t));

  // Triplets first: a tuplet changes its notes' ticks, which the voice counts as they are added.
  const tuplets: Tuplet[] = [];
  for (const group of tupletNotes.values()) {
    const pitched = group.filter((n) => !n.isRest());
    const up = pitched.length === 0 || pitched[0].getStemDirection() === Stem.UP;
    tuplets.push(
      new Tuplet(group, {
        bracketed: true,
        ratioed: false,
        numNotes: 3,
        notesOccupied: 2,
        location: up ? 1 : -1,
      }),
    );
  }
  const voice = new Voice({ numBeats: meter[0], beatValue: meter[1] }).setMode(Voice.Mode.SOFT);
  voice.addTickables(tickables);
  const beams: Beam[] = [];
  for (const group of beamNotes.values()) if (group.length > 1) beams.push(new Beam(group, false));
  return { voice, notes, rests, beams, tuplets };
}
