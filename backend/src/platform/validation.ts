import { z } from 'zod';
import type { ApiErrorDetail } from '@shared/api/errors';
import { AppError } from './app-error';

/** Checks `input` against `schema` at the edge; on failure throws one AppError naming every bad field. */
export function validate<S extends z.ZodType>(schema: S, input: unknown, where = 'Request'): z.infer<S> {
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  const details = toDetails(result.error);
  const summary = details.map((d) => `${d.field}: ${d.message}`).join('; ');
  throw new AppError('validation_failed', `${where} is invalid — ${summary}`, details);
}

function toDetails(error: z.ZodError): ApiErrorDetail[] {
  const details: ApiErrorDetail[] = [];
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        details.push({ field: [...issue.path, key].join('.'), message: 'is not a known field' });
      }
      continue;
    }
    details.push({ field: issue.path.join('.') || '(body)', message: issue.message });
  }
  return details;
}

/** Query-string paging shared by every list endpoint. */
export function pageQuerySchema<S extends readonly [string, ...string[]]>(sorts: S, defaultSort: S[number]) {
  return z.object({
    page: z.coerce.number().int().min(0).default(0),
    pageSize: z.coerce.number().int().min(1).max(200).default(25),
    sort: z.enum(sorts).default(defaultSort as never),
    dir: z.enum(['asc', 'desc']).default('asc'),
    q: z.string().trim().max(100).optional(),
  });
}

export const idParam = z.object({ id: z.coerce.number().int().positive() });
