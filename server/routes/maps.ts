import { Router } from 'express';
import {
  type BeatMapResponse,
  type CalendarResponse,
  ChartQuery,
  type KeyMapResponse,
  MapQuery,
  NextQuery,
  type NextResponse,
  type RangeMapResponse,
  type TimelineResponse,
  type WeeklyResponse,
} from '../../shared/schemas/maps';
import type { AppContext } from '../context';
import { signedIn, requireUser } from '../middleware/auth';
import { parseQuery } from '../middleware/validate';
import { beatMap } from '../services/maps/beat-map';
import { practiceCalendar } from '../services/maps/calendar';
import { keyMap } from '../services/maps/key-map';
import { rangeMap } from '../services/maps/range-map';
import { subjectPlayerId } from '../services/maps/subject';
import { timeline } from '../services/maps/timeline';
import { weeklyByDrill } from '../services/maps/weekly';
import { whatNext } from '../services/maps/what-next';

/** The key, range and beat maps, the progress charts and "what next", for a player or their teacher. */
export function mapsRouter({ db }: AppContext) {
  const router = Router();
  router.use(signedIn);

  router.get('/keys', async (req, res) => {
    const q = parseQuery(MapQuery, req);
    const cells = await keyMap(db, await subjectPlayerId(db, requireUser(req), q.player), q);
    res.json({ cells } satisfies KeyMapResponse);
  });

  router.get('/range', async (req, res) => {
    const q = parseQuery(MapQuery, req);
    const cells = await rangeMap(db, await subjectPlayerId(db, requireUser(req), q.player), q);
    res.json({ cells } satisfies RangeMapResponse);
  });

  router.get('/beats', async (req, res) => {
    const q = parseQuery(MapQuery, req);
    const cells = await beatMap(db, await subjectPlayerId(db, requireUser(req), q.player), q);
    res.json({ cells } satisfies BeatMapResponse);
  });

  router.get('/timeline', async (req, res) => {
    const q = parseQuery(ChartQuery, req);
    const points = await timeline(db, await subjectPlayerId(db, requireUser(req), q.player), q);
    res.json({ points } satisfies TimelineResponse);
  });

  router.get('/calendar', async (req, res) => {
    const q = parseQuery(ChartQuery, req);
    const calendar = await practiceCalendar(db, await subjectPlayerId(db, requireUser(req), q.player), q);
    res.json(calendar satisfies CalendarResponse);
  });

  router.get('/weekly', async (req, res) => {
    const q = parseQuery(ChartQuery, req);
    const weekly = await weeklyByDrill(db, await subjectPlayerId(db, requireUser(req), q.player), q);
    res.json(weekly satisfies WeeklyResponse);
  });

  router.get('/next', async (req, res) => {
    const q = parseQuery(NextQuery, req);
    const items = await whatNext(db, await subjectPlayerId(db, requireUser(req), q.player));
    res.json({ items } satisfies NextResponse);
  });

  return router;
}
