import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useRef, useState } from 'react';
import {
  type FieldPath,
  type FieldValues,
  type Resolver,
  type UseFormProps,
  type UseFormReturn,
  useForm,
} from 'react-hook-form';
import type { z } from 'zod';
import { ApiError } from '@/lib/api-client';

/** Loads a shared zod schema on first use, so a page's first paint does not wait for zod. */
export type SchemaLoader<S extends z.ZodType> = () => Promise<S>;

/**
 * A react-hook-form resolver over a zod schema from shared/schemas that is fetched on the
 * first validation (a dynamic import); the server parses the same schema.
 */
export function lazyZodResolver<S extends z.ZodType>(
  load: SchemaLoader<S>,
): Resolver<z.input<S> & FieldValues, unknown, z.output<S>> {
  let resolver: Resolver<z.input<S> & FieldValues, unknown, z.output<S>> | null = null;
  return async (values, context, options) => {
    if (!resolver) {
      const schema = await load();
      resolver = zodResolver(schema as never) as unknown as Resolver<z.input<S> & FieldValues, unknown, z.output<S>>;
    }
    return resolver(values, context, options);
  };
}

export type SchemaForm<S extends z.ZodType> = UseFormReturn<z.input<S> & FieldValues, unknown, z.output<S>> & {
  /** a message for the form as a whole (a refused request that names no field) */
  formError: string | null;
  /** the messages of one field, for TextField's `errors` */
  errorsOf(name: string): string[] | undefined;
  /** shows a failed request: the 400's fields inline, anything else above the form */
  fromError(err: unknown): void;
};

/**
 * Where a refusal's field messages go: on the fields the form shows, and everything else (the
 * form as a whole, `_`, or a field the form has no input for) in one message above the form.
 *
 * @example
 * placeFieldErrors({ email: ['Taken'], role: ['Not yours'] }, new Set(['email']))
 * // { above: 'Not yours', onFields: [['email', 'Taken']] }
 */
export function placeFieldErrors(
  fields: Record<string, string[]>,
  shown: ReadonlySet<string>,
): { above: string | null; onFields: Array<[string, string]> } {
  const above: string[] = [];
  const onFields: Array<[string, string]> = [];
  for (const [name, messages] of Object.entries(fields)) {
    if (name === '_' || !shown.has(name)) above.push(...messages);
    else onFields.push([name, messages.join(' ')]);
  }
  return { above: above.length > 0 ? above.join(' ') : null, onFields };
}

/**
 * Sixfold's one way to write a form: react-hook-form, validated in the browser by the same zod
 * schema the server parses, with the server's field errors shown on the same fields.
 *
 * @example
 * const form = useSchemaForm(() => import('@shared/schemas/auth').then((m) => m.SignInInput), {
 *   defaultValues: { email: '', password: '' },
 * });
 */
export function useSchemaForm<S extends z.ZodType>(
  load: SchemaLoader<S>,
  options: Omit<UseFormProps<z.input<S> & FieldValues, unknown, z.output<S>>, 'resolver'> = {},
): SchemaForm<S> {
  // The loader is usually an inline arrow: the first one is kept for the form's life.
  // biome-ignore lint/correctness/useExhaustiveDependencies: see above
  const resolver = useMemo(() => lazyZodResolver(load), []);
  const form = useForm<z.input<S> & FieldValues, unknown, z.output<S>>({ ...options, resolver });
  const [formError, setFormError] = useState<string | null>(null);
  // The names this form shows errors on: its registered inputs and those it asks errorsOf about.
  const shown = useRef(new Set<string>());

  const register: typeof form.register = (name, opts) => {
    shown.current.add(name);
    return form.register(name, opts);
  };

  function errorsOf(name: string): string[] | undefined {
    shown.current.add(name);
    let node: unknown = form.formState.errors;
    for (const part of name.split('.')) node = (node as Record<string, unknown> | undefined)?.[part];
    const message = (node as { message?: unknown } | undefined)?.message;
    return typeof message === 'string' && message !== '' ? [message] : undefined;
  }

  function fromError(err: unknown) {
    if (err instanceof ApiError && err.fields && Object.keys(err.fields).length > 0) {
      const { above, onFields } = placeFieldErrors(err.fields, shown.current);
      for (const [name, message] of onFields)
        form.setError(name as FieldPath<z.input<S> & FieldValues>, { type: 'server', message });
      setFormError(above);
      return;
    }
    setFormError(err instanceof Error ? err.message : 'Something went wrong; try again');
  }

  const handleSubmit: typeof form.handleSubmit = (onValid, onInvalid) =>
    form.handleSubmit((data, event) => {
      setFormError(null);
      return onValid(data, event);
    }, onInvalid);

  return { ...form, register, handleSubmit, formError, errorsOf, fromError };
}
