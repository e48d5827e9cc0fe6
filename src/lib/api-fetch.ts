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
    /** With 412: the version the server holds now, to reload or to overwrite with. */
    readonly currentVersion?: number,
  ) {
    super(message);
  }
}

/** Someone else saved first: the write named an older version than the server holds. */
export function isVersionConflict(
  error: unknown,
): error is ApiError & { status: 412; currentVersion: number } {
  return (
    error instanceof ApiError && error.status === 412 && typeof error.currentVersion === 'number'
  );
}

/** The If-Match header naming the version an edit started from (see server/README.md). */
export const ifMatch = (version: number) => ({ 'If-Match': `"${version}"` });

/** The version in an ETag (`"7"` or `W/"7"`), or undefined when there is none. */
export function versionFromEtag(etag: string | null): number | undefined {
  const m = etag ? /^(?:W\/)?"?(\d+)"?$/.exec(etag.trim()) : null;
  return m ? Number(m[1]) : undefined;
}

/**
 * fetch against our API: JSON in and out, cookies included. `version` sends If-Match, so a
 * write based on an older version is refused with 412 instead of overwriting a newer one. The
 * answer is checked against the shared schema so a server/client mismatch fails loudly here;
 * throws ApiError on non-2xx.
 */
export async function apiFetch<S extends z.ZodType>(
  path: string,
  schema: S,
  init: RequestInit & { json?: unknown; version?: number } = {},
): Promise<z.infer<S>> {
  const { json, headers, version, ...rest } = init;
  const response = await fetch(path, {
    credentials: 'same-origin',
    ...rest,
    headers: {
      Accept: 'application/json',
      ...(json !== undefined ? { 'Content-Type': 'application/json' } : {}),
      ...(version !== undefined ? ifMatch(version) : {}),
      ...headers,
    },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
  });
  const text = await response.text();
  const body: unknown = text ? safeJson(text) : undefined;
  if (!response.ok) {
    const parsed = ApiErrorBody.safeParse(body);
    if (parsed.success) {
      const { code, message, issues, currentVersion } = parsed.data.error;
      throw new ApiError(
        response.status,
        code,
        message,
        issues,
        currentVersion ?? versionFromEtag(response.headers.get('etag')),
      );
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
