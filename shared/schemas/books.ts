import { z } from 'zod';
import { DrillSpec, KeyOrder } from './drills';

/**
 * Drill books: a teacher's ordered collection of drills and key cycles, each with a teaching
 * note, published free or at a price. The contracts the API and the browser share.
 */

/** Cover colours: the names of Sixfold's own palette (tailwind.config.ts). */
export const COVER_COLOURS = ['ink', 'brass', 'reed', 'ember', 'dusk'] as const;
export const CoverColour = z.enum(COVER_COLOURS, { error: 'Choose ink, brass, reed, ember or dusk' });
export type CoverColour = z.infer<typeof CoverColour>;

/** The currencies a book can be priced in (ISO 4217, two decimal places). */
export const CURRENCIES = ['EUR', 'USD', 'GBP', 'CAD', 'AUD', 'CHF'] as const;
export const Currency = z.enum(CURRENCIES, { error: 'Price books in EUR, USD, GBP, CAD, AUD or CHF' });
export type Currency = z.infer<typeof Currency>;

const Title = z
  .string({ error: 'Give the book a title' })
  .trim()
  .min(1, { error: 'Give the book a title' })
  .max(120, { error: 'Keep the title under 120 characters' });
const Description = z.string().trim().max(2000, { error: 'Keep the description under 2000 characters' });
/** Minor units (cents); 0 is a free book. The upper bound keeps a typo from pricing a book at a fortune. */
const PriceMinor = z
  .number({ error: 'The price is a whole number of cents' })
  .int({ error: 'The price is a whole number of cents' })
  .min(0, { error: 'The price cannot be negative' })
  .max(100_000, { error: 'The price is at most 1000.00' });
const DrillTitle = z
  .string({ error: 'Give the drill a title' })
  .trim()
  .min(1, { error: 'Give the drill a title' })
  .max(120, { error: 'Keep the title under 120 characters' });
const Note = z.string().trim().max(600, { error: 'Keep the note under 600 characters' });

export const CreateBookInput = z.object({
  title: Title,
  description: Description.default(''),
  coverColour: CoverColour.default('brass'),
  priceMinor: PriceMinor.default(0),
  currency: Currency.default('EUR'),
});
export type CreateBookInput = z.infer<typeof CreateBookInput>;

export const UpdateBookInput = z
  .object({
    title: Title,
    description: Description,
    coverColour: CoverColour,
    priceMinor: PriceMinor,
    currency: Currency,
    published: z.boolean({ error: 'published is true or false' }),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { error: 'Send at least one field to change' });
export type UpdateBookInput = z.infer<typeof UpdateBookInput>;

/** A price as typed ("12.00", "12,5"), in minor units, then held to the same bounds. */
const PriceText = z
  .string({ error: 'Type a price such as 12.00' })
  .trim()
  .regex(/^\d+([.,]\d{1,2})?$/, { error: 'Type a price such as 12.00' })
  .transform((t) => Math.round(Number(t.replace(',', '.')) * 100))
  .pipe(PriceMinor);

/** The book details form in the browser: the fields `UpdateBookInput` takes, the price as typed. */
export const BookDetailsInput = z.object({
  title: Title,
  description: Description,
  coverColour: CoverColour,
  priceMinor: PriceText,
  currency: Currency,
});
export type BookDetailsInput = z.infer<typeof BookDetailsInput>;

export const AddBookDrillInput = z.object({
  savedDrillId: z.uuid({ error: 'Choose one of your saved drills' }),
  title: DrillTitle.optional(),
  note: Note.default(''),
  /** a key cycle in this order, or null for the drill's own key */
  keyCycle: KeyOrder.nullable().optional(),
});
export type AddBookDrillInput = z.infer<typeof AddBookDrillInput>;

export const UpdateBookDrillInput = z
  .object({
    title: DrillTitle,
    note: Note,
    keyCycle: KeyOrder.nullable(),
    free: z.literal(true, { error: 'Mark a drill free with free: true' }),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { error: 'Send at least one field to change' });
export type UpdateBookDrillInput = z.infer<typeof UpdateBookDrillInput>;

export const ReorderBookInput = z.object({ drillIds: z.array(z.uuid({ error: 'That is not a drill id' })).max(200) });
export type ReorderBookInput = z.infer<typeof ReorderBookInput>;

export const BookParams = z.object({ id: z.string().max(64) });
export const BookDrillParams = z.object({ id: z.string().max(64), drillId: z.string().max(64) });

/** What the viewer may open in a book: everything (its teacher, a buyer, a free book) or the free drill only. */
export const BookAccess = z.enum(['owner', 'bought', 'free-book', 'free-drill-only']);
export type BookAccess = z.infer<typeof BookAccess>;

/** A drill as the contents list shows it to anyone: no spec. */
export const BookDrillEntry = z.object({
  id: z.string(),
  title: z.string(),
  note: z.string(),
  free: z.boolean(),
  /** "D / C over D7 · four-three" */
  summary: z.string(),
  keyCycle: KeyOrder.nullable(),
});
export type BookDrillEntry = z.infer<typeof BookDrillEntry>;

export const Book = z.object({
  id: z.string(),
  title: z.string(),
  description: z.string(),
  coverColour: CoverColour,
  priceMinor: z.number().int(),
  currency: Currency,
  published: z.boolean(),
  teacher: z.object({ id: z.string(), name: z.string() }),
  drills: z.array(BookDrillEntry),
  access: BookAccess,
  updatedAt: z.string(),
});
export type Book = z.infer<typeof Book>;

export const BookResponse = z.object({ book: Book });
export type BookResponse = z.infer<typeof BookResponse>;
export const BooksResponse = z.object({ books: z.array(Book) });
export type BooksResponse = z.infer<typeof BooksResponse>;

/** `GET /api/books/:id/drills/:drillId`: the drill itself, for those who may open it. */
export const BookDrill = z.object({
  id: z.string(),
  title: z.string(),
  note: z.string(),
  spec: DrillSpec,
  keyCycle: KeyOrder.nullable(),
});
export type BookDrill = z.infer<typeof BookDrill>;
export const BookDrillResponse = z.object({ drill: BookDrill });
export type BookDrillResponse = z.infer<typeof BookDrillResponse>;

/** `GET /api/books/:id/edition`: every drill in full, for the printable edition. */
export const BookEditionResponse = z.object({ book: Book, drills: z.array(BookDrill) });
export type BookEditionResponse = z.infer<typeof BookEditionResponse>;

export const CheckoutResponse = z.object({ url: z.string() });
export type CheckoutResponse = z.infer<typeof CheckoutResponse>;

/* ---------- sales (teacher) and purchases (admin) ---------- */

export const BookSales = z.object({
  id: z.string(),
  title: z.string(),
  currency: Currency,
  priceMinor: z.number().int(),
  published: z.boolean(),
  sales: z.number().int(),
  refunds: z.number().int(),
  /** paid and not refunded, in minor units of the book's currency */
  revenueMinor: z.number().int(),
});
export type BookSales = z.infer<typeof BookSales>;

export const SalesDay = z.object({
  day: z.string(),
  bookId: z.string(),
  sales: z.number().int(),
  revenueMinor: z.number().int(),
});
export type SalesDay = z.infer<typeof SalesDay>;

export const SalesResponse = z.object({ books: z.array(BookSales), days: z.array(SalesDay) });
export type SalesResponse = z.infer<typeof SalesResponse>;

export const PurchaseStatus = z.enum(['pending', 'paid', 'refunded']);
export type PurchaseStatus = z.infer<typeof PurchaseStatus>;

export const AdminPurchase = z.object({
  id: z.string(),
  book: z.object({ id: z.string(), title: z.string() }),
  player: z.object({ id: z.string(), name: z.string(), email: z.string() }),
  amountMinor: z.number().int(),
  currency: z.string(),
  status: PurchaseStatus,
  createdAt: z.string(),
  paidAt: z.string().nullable(),
  refundedAt: z.string().nullable(),
});
export type AdminPurchase = z.infer<typeof AdminPurchase>;
export const AdminPurchasesResponse = z.object({ purchases: z.array(AdminPurchase) });
export type AdminPurchasesResponse = z.infer<typeof AdminPurchasesResponse>;
export const AdminPurchaseResponse = z.object({ purchase: AdminPurchase });
export type AdminPurchaseResponse = z.infer<typeof AdminPurchaseResponse>;
/** `POST /api/payments/webhook`: the event was read; `granted` when this delivery granted a book. */
export const PaymentWebhookResponse = z.object({ received: z.literal(true), granted: z.boolean() });
export type PaymentWebhookResponse = z.infer<typeof PaymentWebhookResponse>;

export const PurchaseParams = z.object({ id: z.uuid({ error: 'That is not a purchase id' }) });

/** "12.00 EUR" */
export function formatPrice(minor: number, currency: string): string {
  if (minor === 0) return 'Free';
  return `${(minor / 100).toFixed(2)} ${currency}`;
}
