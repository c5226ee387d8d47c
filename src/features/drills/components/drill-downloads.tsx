import { type Drill, drillToMidi, drillToMusicXml } from '@shared/engine';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { downloadBytes, fileBase } from './download-file';

/** The drill of this key as MIDI and MusicXML, and the whole key cycle as printable pages. */
export function DrillDownloads({ drill, printHref }: { drill: Drill; printHref: string }) {
  return (
    <section aria-labelledby="downloads-heading" className="grid gap-2">
      <h2 id="downloads-heading" className="text-lead font-bold">
        Take it with you
      </h2>
      <div className="flex flex-wrap gap-2">
        <Button
          variant="quiet"
          onClick={() => downloadBytes(drillToMidi(drill), `${fileBase(drill)}.mid`, 'audio/midi')}
        >
          MIDI file
        </Button>
        <Button
          variant="quiet"
          onClick={() =>
            downloadBytes(
              drillToMusicXml(drill),
              `${fileBase(drill)}.musicxml`,
              'application/vnd.recordare.musicxml+xml',
            )
          }
        >
          MusicXML file
        </Button>
        <Link
          to={printHref}
          className="inline-flex items-center rounded-lg bg-ink-800 px-4 py-2 font-semibold text-white hover:bg-ink-700 dark:bg-brass-300 dark:text-ink-950"
        >
          Printable key cycle (12 keys)
        </Link>
      </div>
      <p className="text-caption text-muted">
        MIDI sounds at concert pitch; MusicXML and the printed pages are in written pitch for the instrument.
      </p>
    </section>
  );
}
