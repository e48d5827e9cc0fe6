import { useMutation } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import {
  MeResponse,
  OkResponse,
  type ResetConfirmInput,
  type ResetRequestInput,
  type SignInInput,
  type SignUpInput,
} from '../../shared/schemas/auth';
import { apiFetch } from '../lib/api-fetch';

/** Signing in, signing up and resetting a password; the session (./session) is set by the caller. */
const signIn = (input: SignInInput) =>
  apiFetch(pathTo('signIn'), MeResponse, { method: 'POST', json: input });
const signUp = (input: SignUpInput) =>
  apiFetch(pathTo('signUp'), MeResponse, { method: 'POST', json: input });
const requestReset = (input: ResetRequestInput) =>
  apiFetch(pathTo('resetRequest'), OkResponse, { method: 'POST', json: input });
/** Sets the new password and signs in on this device. */
const confirmReset = (input: ResetConfirmInput) =>
  apiFetch(pathTo('resetConfirm'), MeResponse, { method: 'POST', json: input });

export const useSignIn = () => useMutation({ mutationFn: signIn });
export const useSignUp = () => useMutation({ mutationFn: signUp });
export const useRequestReset = () => useMutation({ mutationFn: requestReset });
export const useConfirmReset = () => useMutation({ mutationFn: confirmReset });
