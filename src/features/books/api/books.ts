import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  AddBookDrillInput,
  BookDrillResponse,
  BookEditionResponse,
  BookResponse,
  BooksResponse,
  CheckoutResponse,
  CreateBookInput,
  ReorderBookInput,
  SalesResponse,
  UpdateBookDrillInput,
  UpdateBookInput,
} from '@shared/schemas/books';
import { api } from '@/lib/api-client';
import { bookKeys } from '@/lib/queries/keys';
import { useSavedDrills } from '@/lib/queries/saved-drills';

const enc = encodeURIComponent;

export const catalogueQueryOptions = queryOptions({
  queryKey: bookKeys.catalogue,
  queryFn: () => api.get<BooksResponse>('/api/books'),
});

/** Published books, with the viewer's access to each. */
export function useCatalogue() {
  return useQuery(catalogueQueryOptions);
}

/** A teacher's own books, drafts included. */
export function useMyBooks(enabled = true) {
  return useQuery({
    queryKey: bookKeys.mine,
    queryFn: () => api.get<BooksResponse>('/api/books/mine'),
    enabled,
  });
}

export const bookQueryOptions = (id: string) =>
  queryOptions({ queryKey: bookKeys.detail(id), queryFn: () => api.get<BookResponse>(`/api/books/${enc(id)}`) });

/** One book; `pollMs` keeps asking (after checkout, until the payment has come through). */
export function useBook(id: string, pollMs: number | false = false) {
  return useQuery({ ...bookQueryOptions(id), refetchInterval: pollMs });
}

export function fetchBookDrill(bookId: string, drillId: string): Promise<BookDrillResponse> {
  return api.get<BookDrillResponse>(`/api/books/${enc(bookId)}/drills/${enc(drillId)}`);
}

export function useBookDrill(bookId: string, drillId: string | null) {
  return useQuery({
    queryKey: bookKeys.drill(bookId, drillId),
    queryFn: () => fetchBookDrill(bookId, drillId!),
    enabled: !!drillId,
    retry: false,
  });
}

export function useBookEdition(id: string) {
  return useQuery({
    queryKey: bookKeys.edition(id),
    queryFn: () => api.get<BookEditionResponse>(`/api/books/${enc(id)}/edition`),
    retry: false,
  });
}

export function useSales() {
  return useQuery({ queryKey: bookKeys.sales, queryFn: () => api.get<SalesResponse>('/api/books/sales') });
}

/** The teacher's saved drills, to add to a book. */
export function useTeacherSavedDrills() {
  return useSavedDrills();
}

function useBookMutation<I>(fn: (input: I) => Promise<BookResponse>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (data) => {
      queryClient.setQueryData(bookKeys.detail(data.book.id), data);
      return queryClient.invalidateQueries({ queryKey: bookKeys.all });
    },
  });
}

export function useCreateBook() {
  return useBookMutation((input: CreateBookInput) => api.post<BookResponse>('/api/books', input));
}

export function useUpdateBook(id: string) {
  return useBookMutation((input: UpdateBookInput) => api.patch<BookResponse>(`/api/books/${enc(id)}`, input));
}

export function useAddBookDrill(id: string) {
  return useBookMutation((input: AddBookDrillInput) => api.post<BookResponse>(`/api/books/${enc(id)}/drills`, input));
}

export function useUpdateBookDrill(id: string) {
  return useBookMutation(({ drillId, ...input }: UpdateBookDrillInput & { drillId: string }) =>
    api.patch<BookResponse>(`/api/books/${enc(id)}/drills/${enc(drillId)}`, input),
  );
}

export function useRemoveBookDrill(id: string) {
  return useBookMutation((drillId: string) => api.delete<BookResponse>(`/api/books/${enc(id)}/drills/${enc(drillId)}`));
}

export function useReorderBook(id: string) {
  return useBookMutation((input: ReorderBookInput) => api.put<BookResponse>(`/api/books/${enc(id)}/order`, input));
}

/** Opens a hosted checkout; the caller sends the browser to its page. */
export function useCheckout(id: string) {
  return useMutation({ mutationFn: () => api.post<CheckoutResponse>(`/api/books/${enc(id)}/checkout`) });
}
