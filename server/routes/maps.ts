import { Router } from 'express';
import { ChartQuery, MapQuery, NextQuery } from '../../shared/schemas/maps';
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
    res.json({ cells: await keyMap(db, await subjectPlayerId(db, requireUser(req), q.player), q) });
  });

  router.get('/range', async (req, res) => {
    const q = parseQuery(MapQuery, req);
    res.json({ cells: await rangeMap(db, await subjectPlayerId(db, requireUser(req), q.player), q) });
  });

  router.get('/beats', async (req, res) => {
    const q = parseQuery(MapQuery, req);
    res.json({ cells: await beatMap(db, await subjectPlayerId(db, requireUser(req), q.player), q) });
  });

  router.get('/timeline', async (req, res) => {
    const q = parseQuery(ChartQuery, req);
    res.json({ points: await timeline(db, await subjectPlayerId(db, requireUser(req), q.player), q) });
  });

  router.get('/calendar', async (req, res) => {
    const q = parseQuery(ChartQuery, req);
    res.json(await practiceCalendar(db, await subjectPlayerId(db, requireUser(req), q.player), q));
  });

  router.get('/weekly', async (req, res) => {
    const q = parseQuery(ChartQuery, req);
    res.json(await weeklyByDrill(db, await subjectPlayerId(db, requireUser(req), q.player), q));
  });

  router.get('/next', async (req, res) => {
    const q = parseQuery(NextQuery, req);
    res.json({ items: await whatNext(db, await subjectPlayerId(db, requireUser(req), q.player)) });
  });

  return router;
}
