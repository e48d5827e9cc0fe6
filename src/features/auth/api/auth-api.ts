import { pathTo } from '../../../../shared/api/paths';
import {
  MeResponse,
  OkResponse,
  type ResetConfirmInput,
  type ResetRequestInput,
  type SignInInput,
  type SignUpInput,
} from '../../../../shared/schemas/auth';
import { AcceptInviteResponse, InvitePreview } from '../../../../shared/schemas/teams';
import { apiFetch } from '../../../lib/api-fetch';

export const signIn = (input: SignInInput) =>
  apiFetch(pathTo('signIn'), MeResponse, { method: 'POST', json: input });

export const signUp = (input: SignUpInput) =>
  apiFetch(pathTo('signUp'), MeResponse, { method: 'POST', json: input });

export const requestReset = (input: ResetRequestInput) =>
  apiFetch(pathTo('resetRequest'), OkResponse, { method: 'POST', json: input });

/** Sets the new password and signs in on this device. */
export const confirmReset = (input: ResetConfirmInput) =>
  apiFetch(pathTo('resetConfirm'), MeResponse, { method: 'POST', json: input });

export const fetchInvitePreview = (token: string) =>
  apiFetch(pathTo('invite', { token }), InvitePreview);

export const acceptInvite = (token: string) =>
  apiFetch(pathTo('acceptInvite', { token }), AcceptInviteResponse, { method: 'POST' });
