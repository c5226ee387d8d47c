import { Router } from 'express';
import { SetLatencyInput, type SettingsResponse, UpdateSettingsInput } from '../../shared/schemas/settings';
import type { AppContext } from '../context';
import { signedIn, requireUser } from '../middleware/auth';
import { parseBody } from '../middleware/validate';
import { getSettings } from '../services/settings/get';
import { setLatency } from '../services/settings/set-latency';
import { updateSettings } from '../services/settings/update';

/** A user's practice settings: instrument, written-pitch input, range, tempo, latency per device. */
export function settingsRouter({ db }: AppContext) {
  const router = Router();
  router.use(signedIn);
  router.get('/', async (req, res) => {
    res.json({ settings: await getSettings(db, requireUser(req).id) } satisfies SettingsResponse);
  });
  router.put('/', async (req, res) => {
    const input = parseBody(UpdateSettingsInput, req);
    res.json({ settings: await updateSettings(db, requireUser(req).id, input) } satisfies SettingsResponse);
  });
  router.put('/latency', async (req, res) => {
    const { device, offsetMs } = parseBody(SetLatencyInput, req);
    res.json({ settings: await setLatency(db, requireUser(req).id, device, offsetMs) } satisfies SettingsResponse);
  });
  return router;
}
