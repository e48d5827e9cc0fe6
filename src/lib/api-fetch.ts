import type { z } from 'zod';
import { ApiErrorBody } from '../../shared/api/error';

/** A non-2xx answer from our API, carrying the server's stable error code. */
export class ApiError extends Error {
  override name = 'ApiError';
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: ApiErrorBody['error']['issues'],
  ) {
    super(message);
  }
}

/**
 * fetch against our API: JSON in and out, cookies included. The answer is checked against the
 * shared schema so a server/client mismatch fails loudly here; throws ApiError on non-2xx.
 */
export async function apiFetch<S extends z.ZodType>(
  path: string,
  schema: S,
  init: RequestInit & { json?: unknown } = {},
): Promise<z.infer<S>> {
  const { json, headers, ...rest } = init;
  const response = await fetch(path, {
    credentials: 'same-origin',
    ...rest,
    headers: {
      Accept: 'application/json',
      ...(json !== undefined ? { 'Content-Type': 'application/json' } : {}),
      ...headers,
    },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
  });
  const text = await response.text();
  const body: unknown = text ? safeJson(text) : undefined;
  if (!response.ok) {
    const parsed = ApiErrorBody.safeParse(body);
    if (parsed.success) {
      const { code, message, issues } = parsed.data.error;
      throw new ApiError(response.status, code, message, issues);
    }
    throw new ApiError(
      response.status,
      'http_' + response.status,
      response.statusText || 'Request failed',
    );
  }
  return schema.parse(body);
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return text;
  }
}
