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

const enc = encodeURIComponent;

export const authPaths = {
  signIn: '/api/auth/sign-in',
  signUp: '/api/auth/sign-up',
  resetRequest: '/api/auth/reset/request',
  resetConfirm: '/api/auth/reset/confirm',
  invite: (token: string) => `/api/invites/${enc(token)}`,
  acceptInvite: (token: string) => `/api/invites/${enc(token)}/accept`,
};

export const signIn = (input: SignInInput) =>
  apiFetch(authPaths.signIn, MeResponse, { method: 'POST', json: input });

export const signUp = (input: SignUpInput) =>
  apiFetch(authPaths.signUp, MeResponse, { method: 'POST', json: input });

export const requestReset = (input: ResetRequestInput) =>
  apiFetch(authPaths.resetRequest, OkResponse, { method: 'POST', json: input });

export const confirmReset = (input: ResetConfirmInput) =>
  apiFetch(authPaths.resetConfirm, OkResponse, { method: 'POST', json: input });

export const fetchInvitePreview = (token: string) =>
  apiFetch(authPaths.invite(token), InvitePreview);

export const acceptInvite = (token: string) =>
  apiFetch(authPaths.acceptInvite(token), AcceptInviteResponse, { method: 'POST' });
