import { MeResponse, OkResponse, type Me } from '../../../../shared/schemas/auth';
import { ApiError, apiFetch } from '../../../lib/api-fetch';

export const sessionPaths = {
  me: '/api/auth/me',
  signOut: '/api/auth/sign-out',
} as const;

/** The signed-in user with their teams, or null when nobody is signed in. */
export async function fetchMe(): Promise<Me | null> {
  try {
    return (await apiFetch(sessionPaths.me, MeResponse)).user;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export const signOut = () => apiFetch(sessionPaths.signOut, OkResponse, { method: 'POST' });
