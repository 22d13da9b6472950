import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type DefaultValues, type FieldValues, type UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';

/**
 * A form checked in the browser by the same zod schema the server checks the request with (from
 * shared/api), so a field is refused with the same words before and after sending. Checked on
 * submit, then again as the weaver corrects a field.
 */
export function useSchemaForm<Schema extends z.ZodType<FieldValues, FieldValues>>(
  schema: Schema,
  defaultValues: DefaultValues<z.input<Schema>>,
): UseFormReturn<z.input<Schema>, unknown, z.output<Schema>> {
  return useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(schema),
    defaultValues,
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
}

/** What to say beside a field: the form's own check first, then what the server said about it. */
export function fieldMessage(errors: Record<string, { message?: string } | undefined>, apiFields: Record<string, string>, name: string): string | undefined {
  return errors[name]?.message ?? apiFields[name];
}
