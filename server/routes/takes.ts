import { type RequestHandler, Router } from 'express';
import multer from 'multer';
import {
  ImportTakeFields,
  ListTakesQuery,
  type ListTakesResponse,
  MAX_IMPORT_BYTES,
} from '../../shared/schemas/history';
import { CreateTakeInput, TakeIdParams, type TakeResponse } from '../../shared/schemas/takes';
import type { AppContext } from '../context';
import { requireRole, signedIn, requireUser } from '../middleware/auth';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { createTake } from '../services/takes/create';
import { deleteTake } from '../services/takes/delete';
import { exportTakeMidi, takeFileName } from '../services/takes/export-midi';
import { getTake } from '../services/takes/get';
import { importTake } from '../services/takes/import';
import { listTakes } from '../services/takes/list';
import { subjectPlayerId } from '../services/maps/subject';
import { AppError } from '../errors';
import { presentTake } from '../services/takes/present';

export function takesRouter({ db }: AppContext) {
  const router = Router();

  router.post('/', requireRole('player'), async (req, res) => {
    const input = parseBody(CreateTakeInput, req);
    const { take, created } = await createTake(db, {
      ...input,
      playerId: requireUser(req).id,
      startedAt: new Date(input.startedAt),
      measures: input.measures ?? null,
    });
    res.status(created ? 201 : 200).json({ take: presentTake(take) } satisfies TakeResponse);
  });

  router.get('/', signedIn, async (req, res) => {
    const query = parseQuery(ListTakesQuery, req);
    const playerId = await subjectPlayerId(db, requireUser(req), query.player);
    res.json((await listTakes(db, playerId, query)) satisfies ListTakesResponse);
  });

  router.post('/import', requireRole('player'), midiUpload, async (req, res) => {
    if (!req.file)
      throw new AppError('bad_request', 'Attach the MIDI file as "file"', { file: ['Attach a MIDI file'] });
    const fields = parseBody(ImportTakeFields, req);
    const { take } = await importTake(db, {
      playerId: requireUser(req).id,
      bytes: new Uint8Array(req.file.buffer),
      ...fields,
    });
    res.status(201).json({ take: presentTake(take) } satisfies TakeResponse);
  });

  router.get('/:id', signedIn, async (req, res) => {
    const { id } = parseParams(TakeIdParams, req);
    res.json({ take: presentTake(await getTake(db, requireUser(req), id)) } satisfies TakeResponse);
  });

  router.get('/:id/midi', signedIn, async (req, res) => {
    const { id } = parseParams(TakeIdParams, req);
    const take = await getTake(db, requireUser(req), id);
    res
      .type('audio/midi')
      .attachment(takeFileName(take))
      .send(Buffer.from(exportTakeMidi(take)));
  });

  router.delete('/:id', requireRole('player'), async (req, res) => {
    const { id } = parseParams(TakeIdParams, req);
    await deleteTake(db, requireUser(req).id, id);
    res.status(204).end();
  });

  return router;
}

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_IMPORT_BYTES, files: 1, fields: 8 },
}).single('file');

/** One MIDI file in memory, at most 1 MB; its type is judged later by its content, not its name. */
const midiUpload: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
      return next(
        new AppError('payload_too_large', 'The file is larger than 1 MB; a MIDI take is far smaller', {
          file: ['At most 1 MB'],
        }),
      );
    }
    if (err instanceof multer.MulterError)
      return next(new AppError('bad_request', `The upload was refused: ${err.message}`));
    next(err);
  });
};
