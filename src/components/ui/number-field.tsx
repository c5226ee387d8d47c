import type { ComponentProps } from 'react';
import { TextField } from './text-field';

/**
 * A labelled number input. With react-hook-form, register it with `valueAsNumber: true`;
 * an empty box then reads as NaN, which the shared schemas refuse with their own message.
 */
export function NumberField(props: Omit<ComponentProps<typeof TextField>, 'type'>) {
  return <TextField type="number" inputMode="decimal" {...props} />;
}
