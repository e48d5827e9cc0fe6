import { z } from 'zod';
import { pathTo } from '../../../../shared/api/paths';
import { Preset, PresetList, type PresetPatch } from '../../../../shared/schemas/presets';
import {
  Invite,
  InviteList,
  Member,
  MemberList,
  Team,
  TeamList,
  type InviteInput,
  type MemberPatch,
  type TeamInput,
  type TeamPatch,
} from '../../../../shared/schemas/teams';
import { TeamThresholds, type ThresholdsInput } from '../../../../shared/schemas/thresholds';
import { apiFetch } from '../../../lib/api-fetch';

const noContent = z.unknown();

export const fetchTeams = () => apiFetch(pathTo('teams'), TeamList);
export const createTeam = (input: TeamInput) =>
  apiFetch(pathTo('teams'), Team, { method: 'POST', json: input });
export const fetchTeam = (teamId: string) => apiFetch(pathTo('team', { teamId }), Team);
export const renameTeam = (teamId: string, input: TeamPatch) =>
  apiFetch(pathTo('team', { teamId }), Team, { method: 'PATCH', json: input });

export const fetchMembers = (teamId: string) => apiFetch(pathTo('members', { teamId }), MemberList);
export const changeRole = (teamId: string, userId: string, input: MemberPatch) =>
  apiFetch(pathTo('member', { teamId, userId }), Member, { method: 'PATCH', json: input });
export const removeMember = (teamId: string, userId: string) =>
  apiFetch(pathTo('member', { teamId, userId }), noContent, { method: 'DELETE' });

export const fetchInvites = (teamId: string) => apiFetch(pathTo('invites', { teamId }), InviteList);
export const createInvite = (teamId: string, input: InviteInput) =>
  apiFetch(pathTo('invites', { teamId }), Invite, { method: 'POST', json: input });
export const withdrawInvite = (teamId: string, inviteId: string) =>
  apiFetch(pathTo('teamInvite', { teamId, inviteId }), noContent, { method: 'DELETE' });

export const fetchPresets = (teamId: string) => apiFetch(pathTo('presets', { teamId }), PresetList);
export const patchPreset = (id: string, input: PresetPatch) =>
  apiFetch(pathTo('preset', { id }), Preset, { method: 'PATCH', json: input });
export const deletePreset = (id: string) =>
  apiFetch(pathTo('preset', { id }), noContent, { method: 'DELETE' });

export const fetchThresholds = (teamId: string) =>
  apiFetch(pathTo('thresholds', { teamId }), TeamThresholds);
export const saveThresholds = (teamId: string, input: ThresholdsInput) =>
  apiFetch(pathTo('thresholds', { teamId }), TeamThresholds, { method: 'PUT', json: input });
