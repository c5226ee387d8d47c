import { Router } from 'express';
import { SuggestTempoQuery, type SuggestTempoResponse } from '../../shared/schemas/settings';
import type { AppContext } from '../context';
import { requireRole, requireUser } from '../middleware/auth';
import { parseQuery } from '../middleware/validate';
import { specFromQuery } from '../services/drills/spec-from-query';
import { suggestTempo } from '../services/practice/suggest-tempo';

export function practiceRouter({ db }: AppContext) {
  const router = Router();
  /** GET /api/practice/tempo?spec=<DrillSpec JSON> -> { climb: { tempo, lastTempo, lastVerdict } | null } */
  router.get('/tempo', requireRole('player'), async (req, res) => {
    const { spec } = parseQuery(SuggestTempoQuery, req);
    const climb = await suggestTempo(db, requireUser(req).id, specFromQuery(spec, 'spec'));
    res.json({ climb } satisfies SuggestTempoResponse);
  });
  return router;
}
