import type { CoverColour } from '@shared/schemas/books';

/** Each cover colour of the palette as a cover's background and text. */
export const COVER_CLASS: Record<CoverColour, string> = {
  ink: 'bg-ink-800 text-white',
  brass: 'bg-brass-500 text-ink-950',
  reed: 'bg-reed-700 text-white',
  ember: 'bg-ember-700 text-white',
  dusk: 'bg-dusk-700 text-white',
};
