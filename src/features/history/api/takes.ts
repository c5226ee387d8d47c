import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ListTakesQuery, ListTakesResponse } from '@shared/schemas/history';
import type { CsrfResponse } from '@shared/schemas/auth';
import type { ErrorResponse } from '@shared/schemas/errors';
import type { CreateTakeInput, TakeResponse } from '@shared/schemas/takes';
import { ApiError, api } from '@/lib/api-client';
import { mapKeys } from '@/lib/queries/keys';
import { takeKeys, takeQueryOptions, useTake } from '@/lib/queries/take';

export type TakeListParams = Partial<ListTakesQuery>;

function toSearch(params: Record<string, string | number | undefined>): string {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== '') q.set(k, String(v));
  const s = q.toString();
  return s ? `?${s}` : '';
}

export function fetchTakes(params: TakeListParams): Promise<ListTakesResponse> {
  return api.get<ListTakesResponse>(`/api/takes${toSearch(params)}`);
}

export const takesQueryOptions = (params: TakeListParams) =>
  queryOptions({
    queryKey: takeKeys.list(params),
    queryFn: () => fetchTakes(params),
    placeholderData: keepPreviousData,
  });

/** One page of the history, sorted and filtered on the server. */
export function useTakes(params: TakeListParams) {
  return useQuery(takesQueryOptions(params));
}

export { takeQueryOptions, useTake };

export function useDeleteTake() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete<void>(`/api/takes/${encodeURIComponent(id)}`),
    // The maps count every take, so they go stale with it.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: takeKeys.all }),
        queryClient.invalidateQueries({ queryKey: mapKeys.all }),
      ]),
  });
}

export const takeMidiUrl = (id: string) => `/api/takes/${encodeURIComponent(id)}/midi`;

export interface ImportInput {
  file: File;
  spec: CreateTakeInput['spec'];
  offsetMs?: number;
  onProgress?: (fraction: number) => void;
}

async function csrfToken(): Promise<string> {
  const res = await fetch('/api/auth/csrf', { credentials: 'same-origin' });
  return ((await res.json()) as CsrfResponse).token;
}

/** Sends a MIDI file with XMLHttpRequest, whose upload events give the progress bar. */
export async function importTake({ file, spec, offsetMs, onProgress }: ImportInput): Promise<TakeResponse> {
  const form = new FormData();
  form.set('file', file);
  form.set('spec', JSON.stringify(spec));
  if (offsetMs !== undefined) form.set('offsetMs', String(offsetMs));
  const token = await csrfToken();
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/takes/import');
    xhr.setRequestHeader('X-CSRF-Token', token);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.(e.loaded / e.total);
    };
    xhr.onerror = () =>
      reject(new ApiError(0, 'offline', 'The server could not be reached; check the connection and try again'));
    xhr.onload = () => {
      let body: { take?: TakeResponse['take']; error?: Partial<ErrorResponse['error']> } = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = {};
      }
      if (xhr.status === 201 && body.take) resolve({ take: body.take });
      else
        reject(
          new ApiError(
            xhr.status,
            body.error?.code ?? 'error',
            body.error?.message ?? 'The file was not imported',
            body.error?.fields,
          ),
        );
    };
    xhr.send(form);
  });
}

export function useImportTake() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importTake,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: takeKeys.all }),
        queryClient.invalidateQueries({ queryKey: mapKeys.all }),
      ]),
  });
}
