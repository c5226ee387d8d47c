import type { z } from 'zod';
import { AdminUserResponse, AdminUsersResponse, AuditResponse } from './admin';
import {
  AssignmentResponse,
  AssignmentsResponse,
  AssignmentWeeklyResponse,
  BoardResponse,
  StudioPlayerResponse,
} from './assignments';
import { CsrfResponse, OkResponse, SessionResponse, UserResponse } from './auth';
import {
  AdminPurchaseResponse,
  AdminPurchasesResponse,
  BookDrillResponse,
  BookEditionResponse,
  BookResponse,
  BooksResponse,
  CheckoutResponse,
  PaymentWebhookResponse,
  SalesResponse,
} from './books';
import { OutboxResponse } from './dev';
import { ErrorResponse } from './errors';
import {
  CustomPatternResponse,
  CustomPatternsResponse,
  PreviewResponse,
  SavedDrillResponse,
  SavedDrillsResponse,
} from './drills';
import { HealthResponse } from './health';
import { ListTakesResponse } from './history';
import {
  BeatMapResponse,
  CalendarResponse,
  KeyMapResponse,
  NextResponse,
  RangeMapResponse,
  TimelineResponse,
  WeeklyResponse,
} from './maps';
import { NotificationsResponse, RemarkResponse, RemarksResponse } from './remarks';
import { SettingsResponse, SuggestTempoResponse } from './settings';
import {
  AcceptInviteResponse,
  InvitePreviewResponse,
  InviteResponse,
  InvitesResponse,
  StudioResponse,
  StudiosResponse,
} from './studios';
import { TakeResponse } from './takes';

/** A download: bytes of the given content type, not JSON. */
export interface FileAnswer {
  file: string;
}
const file = (contentType: string): FileAnswer => ({ file: contentType });

/** An answer with no body (204). */
export const NO_CONTENT = null;

/** What one route answers on success: a JSON body's schema, a file, or nothing. */
export type ResponseContract = z.ZodType | FileAnswer | null;

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/**
 * Every route of the API, written as Express mounts it ("METHOD /api/path/:param"), with the
 * contract of its successful answer. The server's routes send these shapes, the browser reads
 * their types, and the API tests parse every 2xx JSON answer with the schema of the route that
 * sent it (a route missing here fails them, as does an entry no route answers).
 */
export const apiResponses = {
  'GET /api/health': HealthResponse,

  'GET /api/auth/csrf': CsrfResponse,
  'GET /api/auth/session': SessionResponse,
  'GET /api/auth/me': UserResponse,
  'POST /api/auth/sign-up': UserResponse,
  'POST /api/auth/sign-in': UserResponse,
  'POST /api/auth/sign-out': OkResponse,
  'PATCH /api/auth/me': UserResponse,
  'POST /api/auth/password': OkResponse,
  'POST /api/auth/password-reset': OkResponse,
  'POST /api/auth/password-reset/confirm': OkResponse,

  'GET /api/admin/purchases': AdminPurchasesResponse,
  'POST /api/admin/purchases/:id/refund': AdminPurchaseResponse,
  'GET /api/admin/users': AdminUsersResponse,
  'PATCH /api/admin/users/:id': AdminUserResponse,
  'GET /api/admin/audit': AuditResponse,

  'GET /api/books': BooksResponse,
  'GET /api/books/mine': BooksResponse,
  'GET /api/books/sales': SalesResponse,
  'POST /api/books': BookResponse,
  'GET /api/books/:id': BookResponse,
  'GET /api/books/:id/edition': BookEditionResponse,
  'GET /api/books/:id/drills/:drillId': BookDrillResponse,
  'POST /api/books/:id/checkout': CheckoutResponse,
  'PATCH /api/books/:id': BookResponse,
  'POST /api/books/:id/drills': BookResponse,
  'PUT /api/books/:id/order': BookResponse,
  'PATCH /api/books/:id/drills/:drillId': BookResponse,
  'DELETE /api/books/:id/drills/:drillId': BookResponse,
  'POST /api/payments/webhook': PaymentWebhookResponse,

  'GET /api/studios': StudiosResponse,
  'POST /api/studios': StudioResponse,
  'GET /api/studios/:id': StudioResponse,
  'GET /api/studios/:id/board': BoardResponse,
  'GET /api/studios/:id/players/:playerId': StudioPlayerResponse,
  'DELETE /api/studios/:id/membership': NO_CONTENT,
  'GET /api/studios/:id/invites': InvitesResponse,
  'POST /api/studios/:id/invites': InviteResponse,
  'GET /api/studios/:id/assignments': AssignmentsResponse,
  'POST /api/studios/:id/assignments': AssignmentResponse,
  'GET /api/invites/:token': InvitePreviewResponse,
  'POST /api/invites/:token/accept': AcceptInviteResponse,
  'POST /api/invites/:token/sign-up': UserResponse,
  'GET /api/assignments': AssignmentsResponse,
  'GET /api/assignments/:id/weekly': AssignmentWeeklyResponse,
  'DELETE /api/assignments/:id': NO_CONTENT,
  'GET /api/notifications': NotificationsResponse,
  'POST /api/notifications/read': OkResponse,
  'GET /api/takes/:takeId/remarks': RemarksResponse,
  'POST /api/takes/:takeId/remarks': RemarkResponse,

  'POST /api/takes': TakeResponse,
  'GET /api/takes': ListTakesResponse,
  'POST /api/takes/import': TakeResponse,
  'GET /api/takes/:id': TakeResponse,
  // the take as a Standard MIDI File
  'GET /api/takes/:id/midi': file('audio/midi'),
  'DELETE /api/takes/:id': NO_CONTENT,

  'GET /api/maps/keys': KeyMapResponse,
  'GET /api/maps/range': RangeMapResponse,
  'GET /api/maps/beats': BeatMapResponse,
  'GET /api/maps/timeline': TimelineResponse,
  'GET /api/maps/calendar': CalendarResponse,
  'GET /api/maps/weekly': WeeklyResponse,
  'GET /api/maps/next': NextResponse,

  'GET /api/settings': SettingsResponse,
  'PUT /api/settings': SettingsResponse,
  'PUT /api/settings/latency': SettingsResponse,
  'GET /api/practice/tempo': SuggestTempoResponse,

  'GET /api/drills/preview': PreviewResponse,
  'GET /api/drills': SavedDrillsResponse,
  'POST /api/drills': SavedDrillResponse,
  'GET /api/drills/:id': SavedDrillResponse,
  'PATCH /api/drills/:id': SavedDrillResponse,
  'DELETE /api/drills/:id': NO_CONTENT,
  'GET /api/patterns': CustomPatternsResponse,
  'POST /api/patterns': CustomPatternResponse,
  'GET /api/patterns/:id': CustomPatternResponse,
  'PATCH /api/patterns/:id': CustomPatternResponse,
  'DELETE /api/patterns/:id': NO_CONTENT,

  /** development and tests only: never mounted in production */
  'GET /api/dev/outbox': OutboxResponse,
} as const satisfies Record<`${Method} /api${string}`, ResponseContract>;

export type ApiRoute = keyof typeof apiResponses;

/** What every route answers on failure (4xx, 5xx); the health check's 503 keeps its own shape. */
export const apiErrorResponse = ErrorResponse;

/** The JSON body a route answers with, e.g. `ApiResponse<'GET /api/books'>`. */
export type ApiResponse<R extends ApiRoute> = (typeof apiResponses)[R] extends z.ZodType<infer T> ? T : never;
