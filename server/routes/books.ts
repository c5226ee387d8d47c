import { Router } from 'express';
import {
  AddBookDrillInput,
  BookDrillParams,
  type BookDrillResponse,
  type BookEditionResponse,
  BookParams,
  type BookResponse,
  type BooksResponse,
  type CheckoutResponse,
  CreateBookInput,
  ReorderBookInput,
  type SalesResponse,
  UpdateBookDrillInput,
  UpdateBookInput,
} from '../../shared/schemas/books';
import type { AppContext } from '../context';
import { AppError } from '../errors';
import { linkOrigin } from '../mail/link-origin';
import { requireRole, signedIn, requireUser } from '../middleware/auth';
import { parseBody, parseParams } from '../middleware/validate';
import { addBookDrill } from '../services/books/add-drill';
import { createBook } from '../services/books/create';
import { getBookEdition } from '../services/books/edition';
import { getBook } from '../services/books/get';
import { getBookDrill } from '../services/books/get-drill';
import { listTeacherBooks } from '../services/books/list-mine';
import { listPublishedBooks } from '../services/books/list-published';
import { removeBookDrill } from '../services/books/remove-drill';
import { reorderBook } from '../services/books/reorder';
import { bookSales } from '../services/books/sales';
import { updateBook } from '../services/books/update';
import { updateBookDrill } from '../services/books/update-drill';
import { startCheckout } from '../services/purchases/start-checkout';

/**
 * Drill books. The catalogue, a book's page and its free drill are open to anyone; the rest of
 * a book's drills only to its teacher and its buyers (404 for everyone else, as for a drill
 * that is not there). Teachers change only their own books (anyone else's is 404).
 */
export function booksRouter({ db, env }: AppContext) {
  const router = Router();
  const teacher = requireRole('teacher');

  router.get('/', async (req, res) => {
    res.json({ books: await listPublishedBooks(db, req.user) } satisfies BooksResponse);
  });
  router.get('/mine', teacher, async (req, res) => {
    res.json({ books: await listTeacherBooks(db, requireUser(req)) } satisfies BooksResponse);
  });
  router.get('/sales', teacher, async (req, res) => {
    res.json((await bookSales(db, requireUser(req))) satisfies SalesResponse);
  });
  router.post('/', teacher, async (req, res) => {
    const book = await createBook(db, requireUser(req), parseBody(CreateBookInput, req));
    res.status(201).json({ book } satisfies BookResponse);
  });

  router.get('/:id', async (req, res) => {
    res.json({ book: await getBook(db, req.user, parseParams(BookParams, req).id) } satisfies BookResponse);
  });
  router.get('/:id/edition', async (req, res) => {
    res.json((await getBookEdition(db, req.user, parseParams(BookParams, req).id)) satisfies BookEditionResponse);
  });
  router.get('/:id/drills/:drillId', async (req, res) => {
    const { id, drillId } = parseParams(BookDrillParams, req);
    res.json({ drill: await getBookDrill(db, req.user, id, drillId) } satisfies BookDrillResponse);
  });

  router.post('/:id/checkout', signedIn, async (req, res) => {
    const { id } = parseParams(BookParams, req);
    const origin = linkOrigin(req, env);
    if (!origin) throw new AppError('unavailable', 'Checkout needs PUBLIC_URL set on the server');
    res.json((await startCheckout(db, env, requireUser(req), id, origin)) satisfies CheckoutResponse);
  });

  // The teacher's own book: the ownership check comes first, so an outsider learns nothing from a 400.
  router.patch('/:id', teacher, async (req, res) => {
    const { id } = parseParams(BookParams, req);
    res.json({
      book: await updateBook(db, requireUser(req), id, parseBody(UpdateBookInput, req)),
    } satisfies BookResponse);
  });
  router.post('/:id/drills', teacher, async (req, res) => {
    const { id } = parseParams(BookParams, req);
    const book = await addBookDrill(db, requireUser(req), id, parseBody(AddBookDrillInput, req));
    res.status(201).json({ book } satisfies BookResponse);
  });
  router.put('/:id/order', teacher, async (req, res) => {
    const { id } = parseParams(BookParams, req);
    res.json({
      book: await reorderBook(db, requireUser(req), id, parseBody(ReorderBookInput, req)),
    } satisfies BookResponse);
  });
  router.patch('/:id/drills/:drillId', teacher, async (req, res) => {
    const { id, drillId } = parseParams(BookDrillParams, req);
    const book = await updateBookDrill(db, requireUser(req), id, drillId, parseBody(UpdateBookDrillInput, req));
    res.json({ book } satisfies BookResponse);
  });
  router.delete('/:id/drills/:drillId', teacher, async (req, res) => {
    const { id, drillId } = parseParams(BookDrillParams, req);
    res.json({ book: await removeBookDrill(db, requireUser(req), id, drillId) } satisfies BookResponse);
  });
  return router;
}
