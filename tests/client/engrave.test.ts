import { type DrillSpec, generateDrill, type Notation, notate } from '@shared/engine';
import { describe, expect, it } from 'vitest';
import {
  engraveSystem,
  moveSystem,
  type PlacedEvent,
  reach,
  systemMarkup,
} from '../../src/components/notation/engrave';
import { notesOf } from '../../src/components/notation/lane-placement';
import { planSystems } from '../../src/components/notation/layout';
import { GLYPH } from '../../src/components/notation/smufl';

function engrave(spec: Partial<DrillSpec> & Pick<DrillSpec, 'pattern'>, width = 1000) {
  const drill = generateDrill({ direction: 'up', ...spec } as DrillSpec);
  const notation = notate(drill);
  const systems = planSystems(notation.measures, notation.staves.length, width - 40).map((plan) =>
    engraveSystem(notation, drill.spec.meter, plan, 20),
  );
  return { drill, notation, systems };
}

/** A one-measure model with the notes given (quarters on a treble staff unless said). */
function single(
  events: Array<Partial<Notation['measures'][number]['events'][number]>>,
  staves: Notation['staves'] = ['treble'],
) {
  const notation: Notation = {
    staves,
    measures: [
      {
        number: 1,
        events: events.map((e, i) => ({
          kind: 'note',
          staff: 0,
          start: i,
          duration: 1,
          accidental: null,
          ottava: 0,
          noteIndex: i,
          ...e,
        })) as Notation['measures'][number]['events'],
      },
    ],
  };
  const [plan] = planSystems(notation.measures, staves.length, 600);
  return engraveSystem(notation, [4, 4], plan, 20);
}

describe('the engraver places notes where a reader expects them', () => {
  it('puts E4 on the bottom line and F5 on the top line of a treble staff, G2 and A3 on a bass staff (common practice)', () => {
    const treble = single([{ written: 'E4' }, { written: 'F5' }, { written: 'B4' }]).measures[0].events[0];
    expect(treble.map((p) => p.pos)).toEqual([8, 0, 4]);
    expect(treble.map((p) => p.y)).toEqual([40, 0, 20]);
    const bass = single([{ written: 'G2' }, { written: 'A3' }], ['bass']).measures[0].events[0];
    expect(bass.map((p) => p.pos)).toEqual([8, 0]);
  });

  it('draws a ledger line for every line between the staff and a note (common practice)', () => {
    const system = single([
      { written: 'C4' },
      { written: 'A5' },
      { written: 'C6' },
      { written: 'A3' },
      { written: 'G5' },
    ]);
    const markup = systemMarkup(system, () => null);
    const ledgers = [...markup.matchAll(/<path class="sf-ledger" d="([^"]*)"/g)].map((m) => m[1].split('M').length - 1);
    // C4: one below; A5: one above; C6: two above; A3: two below (C4 and A3's own line); G5: none
    expect(ledgers).toEqual([1, 1, 2, 2]);
  });

  it('gives a stem three and a half spaces on the staff, and reaches the middle line from far off it (common practice)', () => {
    const [low, high, ledger] = single([
      { written: 'G4', stem: 'up' },
      { written: 'D5', stem: 'down' },
      { written: 'A3', stem: 'up' },
    ]).measures[0].events[0];
    expect(low.y - low.stemEnd).toBe(35);
    expect(high.stemEnd - high.y).toBe(35);
    // A3 sits two ledger lines under a treble staff: its stem ends on the middle line (y 20)
    expect(ledger.stemEnd).toBe(20);
    expect(low.stemX).toBeGreaterThan(low.x + low.w / 2);
    expect(high.stemX).toBeLessThan(high.x + high.w / 2);
  });

  it('prints an accidental left of its note, clear of the note before it', () => {
    const row = single([{ written: 'C5' }, { written: 'F#5', accidental: '#' }, { written: 'Bb4', accidental: 'b' }])
      .measures[0].events[0];
    const markup = systemMarkup(single([{ written: 'C5' }, { written: 'F#5', accidental: '#' }]), () => null);
    const sharpX = Number(/<text class="sf-accidental" x="([\d.]+)"[^>]*>\uE262</.exec(markup)?.[1]);
    expect(sharpX).toBeLessThan(row[1].x);
    expect(sharpX).toBeGreaterThan(row[0].x + row[0].w);
    expect(row[2].x - row[1].x).toBeGreaterThan(row[1].x - row[0].x - 1);
  });
});

describe('beams, triplets and a grand staff', () => {
  it('ends every stem of a beam group on the beam, slanting at most one space', () => {
    const { systems } = engrave({ pair: ['C', 'D'], pattern: 'scale-steps', instrument: 'alto-sax' });
    const beams = systems.flatMap((s) => s.measures.flatMap((m) => m.beams));
    expect(beams.length).toBeGreaterThan(10);
    for (const b of beams) {
      const first = b.notes[0].stemX;
      for (const n of b.notes) expect(n.stemEnd).toBeCloseTo(b.y0 + b.slope * (n.stemX - first), 6);
      const last = b.notes[b.notes.length - 1];
      // at most one space, and at most a quarter of the distance over close notes
      const span = last.stemX - first;
      expect(Math.abs(b.slope * span)).toBeLessThanOrEqual(Math.max(2.5, Math.min(10, span / 4)) + 1e-9);
      // every stem is at least three and a half spaces from its head
      for (const n of b.notes) expect(Math.abs(n.stemEnd - n.y)).toBeGreaterThanOrEqual(35 - 1e-9);
      expect(b.notes.every((n) => n.up === b.up)).toBe(true);
    }
  });

  it('brackets each triplet on its stems side, clear of its stems and heads', () => {
    const { systems } = engrave({ pair: ['Db', 'Eb'], pattern: 'scale-steps-triplet', instrument: 'trombone' });
    for (const s of systems)
      for (const m of s.measures)
        for (const t of m.tuplets) {
          const under = m.events[t.staff].filter(
            (p) => p.event.kind === 'note' && p.x >= t.x0 - 1 && p.x + p.w <= t.x1 + 1,
          );
          expect(under.length).toBe(3);
          for (const p of under) {
            if (t.up) expect(t.y).toBeLessThan(Math.min(p.stemEnd, p.y - 5));
            else expect(t.y).toBeGreaterThan(Math.max(p.stemEnd, p.y + 5));
          }
        }
  });

  it('lines up the beats of both staves of a grand staff, and never lets two heads on a staff overlap', () => {
    const { systems } = engrave({
      pair: ['C', 'D'],
      pattern: 'scale-steps',
      direction: 'up-down',
      instrument: 'piano',
    });
    for (const s of systems)
      for (const m of s.measures) {
        const xAt = new Map<number, number>();
        for (const p of m.events.flat()) {
          if (p.event.kind !== 'note') continue;
          const seen = xAt.get(p.event.start);
          if (seen !== undefined) expect(p.x).toBe(seen);
          xAt.set(p.event.start, p.x);
        }
        for (const row of m.events) {
          const heads = row.filter((p) => p.event.kind === 'note');
          for (let i = 1; i < heads.length; i++) expect(heads[i].x).toBeGreaterThan(heads[i - 1].x + heads[i - 1].w);
        }
      }
  });

  it('moves a line and everything on it to the height it is given', () => {
    const { systems } = engrave({ pair: ['F', 'Eb'], pattern: 'weave', instrument: 'alto-sax' });
    const s = systems[0];
    const before = notesOf(s).map((p: PlacedEvent) => [p.y, p.stemEnd]);
    const r = reach(s, 0);
    moveSystem(s, [100]);
    const after = notesOf(s).map((p) => [p.y - 100, p.stemEnd - 100]);
    after.forEach(([y, stem], i) => {
      expect(y).toBeCloseTo(before[i][0], 9);
      expect(stem).toBeCloseTo(before[i][1], 9);
    });
    expect(reach(s, 0).above).toBeCloseTo(r.above, 9);
    expect(reach(s, 0).below).toBeCloseTo(r.below, 9);
  });
});

describe('rests, flags and lines', () => {
  it('prints a rest that fills the bar as a whole rest hanging from the fourth line, in any meter (common practice)', () => {
    for (const meter of [
      [12, 8],
      [3, 4],
      [5, 4],
      [9, 8],
    ] as const) {
      // starting at C5 going up, the bass staff is empty: a bar rest in each of its bars
      const { systems } = engrave({
        pair: ['C', 'D'],
        pattern: 'stack',
        instrument: 'piano',
        start: 72,
        meter: [...meter],
      });
      const barRests = systems.flatMap((s) =>
        s.measures.flatMap((m) =>
          m.events.flat().filter((p) => p.event.kind === 'rest' && p.event.duration === (meter[0] * 4) / meter[1]),
        ),
      );
      expect(barRests.length).toBeGreaterThan(0);
      for (const r of barRests) {
        expect(r.glyph).toBe(GLYPH.restWhole);
        expect(r.pos).toBe(2);
        expect(r.dots).toBe(0);
      }
    }
  });

  it('leaves room after a flag, so the next note, rest or accidental never runs into it', () => {
    let flags = 0;
    for (const pattern of ['weave', 'stack', 'four-three'] as const)
      for (const pair of [
        ['F', 'Eb'],
        ['F#', 'E'],
      ] as const) {
        const { systems } = engrave({ pair: [...pair], pattern, instrument: 'piano', meter: [3, 4] });
        for (const s of systems)
          for (const m of s.measures)
            for (const row of m.events) {
              const sorted = [...row].sort((a, b) => a.x - b.x);
              sorted.forEach((a, i) => {
                const b = sorted[i + 1];
                if (!b || !a.flag || !a.up) return;
                flags++;
                const accidental = b.event.accidental ? 12 : 0;
                expect(b.x - accidental).toBeGreaterThan(a.stemX + 10);
              });
            }
      }
    expect(flags).toBeGreaterThan(0);
  });

  it('stretches every line of music to the width but a short last one', () => {
    const drill = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up-down', instrument: 'alto-sax' });
    const plans = planSystems(notate(drill).measures, 1, 960);
    expect(plans.length).toBeGreaterThan(2);
    for (const plan of plans.slice(0, -1))
      expect(plan.widths.reduce((a, b) => a + b, 0)).toBeGreaterThan(960 - plan.widths.length);
  });
});

describe('the markup', () => {
  it('writes each note once, with the attributes the page gives it, and the music font glyphs (SMuFL code points)', () => {
    const { drill, systems } = engrave({
      pair: ['E', 'F#'],
      pattern: 'leap-back',
      direction: 'up-down',
      instrument: 'piano',
    });
    const markup = systems
      .map((s) => systemMarkup(s, (p) => ({ classes: 'sf-note', attributes: `data-index="${p.event.noteIndex}"` })))
      .join('');
    const indices = [...markup.matchAll(/data-index="(\d+)"/g)].map((m) => Number(m[1])).sort((a, b) => a - b);
    expect(indices).toEqual(drill.notes.map((_n, i) => i));
    // SMuFL: gClef U+E050, fClef U+E062, noteheadBlack U+E0A4, brace U+E000
    expect(markup).toContain(`>${GLYPH.gClef}<`);
    expect(markup).toContain(`>${GLYPH.fClef}<`);
    expect(markup).toContain(`>\uE0A4<`);
    expect(markup).toContain('class="sf-brace"');
    // the last measure ends with a thin and a thick line (common practice)
    expect(markup.match(/<rect class="sf-barline"/g)?.length).toBe(1);
  });
});
