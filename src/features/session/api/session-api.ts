import { pathTo } from '../../../../shared/api/paths';
import { MeResponse, OkResponse, type Me } from '../../../../shared/schemas/auth';
import { ApiError, apiFetch } from '../../../lib/api-fetch';

/** The signed-in user with their teams, or null when nobody is signed in. */
export async function fetchMe(): Promise<Me | null> {
  try {
    return (await apiFetch(pathTo('me'), MeResponse)).user;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export const signOut = () => apiFetch(pathTo('signOut'), OkResponse, { method: 'POST' });
