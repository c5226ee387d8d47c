import { Router } from 'express';
import { ZodError } from 'zod';
import { DrillSpec } from '../../shared/schemas/drills';
import { SuggestTempoQuery } from '../../shared/schemas/settings';
import type { AppContext } from '../app';
import { AppError } from '../errors';
import { requireRole } from '../middleware/auth';
import { parseQuery } from '../middleware/validate';
import { suggestTempo } from '../services/practice/suggest-tempo';

export function practiceRouter({ db }: AppContext) {
  const router = Router();
  /** GET /api/practice/tempo?spec=<DrillSpec JSON> -> { climb: { tempo, lastTempo, lastVerdict } | null } */
  router.get('/tempo', requireRole('player'), async (req, res) => {
    const { spec: raw } = parseQuery(SuggestTempoQuery, req);
    let json: unknown;
    try {
      json = JSON.parse(raw);
    } catch {
      throw new AppError('validation', 'The spec is not valid JSON', { spec: ['The spec is not valid JSON'] });
    }
    const parsed = DrillSpec.safeParse(json);
    if (!parsed.success) throw new ZodError(parsed.error.issues.map((i) => ({ ...i, path: ['spec', ...i.path] })));
    res.json({ climb: await suggestTempo(db, req.user!.id, parsed.data) });
  });
  return router;
}
